// svgdom 0.1.25 ships no types; the preview's Node tests use only this.
declare module 'svgdom' {
  /** A window whose document is an SVG document, for svg.js outside a browser. */
  export function createSVGWindow(): Window & typeof globalThis;
}
