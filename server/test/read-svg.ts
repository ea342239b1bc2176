import { JSDOM, type XmlElement } from 'jsdom';

/** Reads SVG markup with jsdom's XML parser (strict, independent of the writer); throws when it is not well-formed. */
export function readSvg(markup: string): XmlElement {
  const doc = new new JSDOM().window.DOMParser().parseFromString(markup, 'image/svg+xml');
  if (doc.querySelector('parsererror')) throw new Error(`not well-formed SVG: ${markup.slice(0, 120)}`);
  if (doc.documentElement.localName !== 'svg') throw new Error(`not an SVG: <${doc.documentElement.localName}>`);
  return doc.documentElement;
}
