// svgdom 0.1.25 ships no types; the front view's Node test reads its SVG with it.
declare module 'svgdom' {
  /** A window whose document is an SVG document, for svg.js outside a browser. */
  export function createSVGWindow(): Window & typeof globalThis;
}
