// jsdom ships no types; the server's tests use only its XML reader, declared here.
declare module 'jsdom' {
  /** The few element members the tests read. */
  export interface XmlElement {
    readonly localName: string;
    getAttribute(name: string): string | null;
    querySelector(selector: string): XmlElement | null;
    querySelectorAll(selector: string): Iterable<XmlElement> & { readonly length: number };
  }
  export class JSDOM {
    constructor(html?: string);
    readonly window: {
      DOMParser: new () => { parseFromString(text: string, type: 'image/svg+xml' | 'application/xml'): { documentElement: XmlElement; querySelector(selector: string): XmlElement | null } };
    };
  }
}
