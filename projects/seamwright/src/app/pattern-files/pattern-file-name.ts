/** Names the operating systems keep for devices (Windows refuses them as file names, with any extension). */
const RESERVED = /^(con|prn|aux|nul|com[0-9]|lpt[0-9])$/i;
/** Characters no file name may hold on one system or another, and control characters. */
// eslint-disable-next-line no-control-regex
const FORBIDDEN = /[<>:"/\\|?*\u0000-\u001f\u007f]/g;
/** Longest base name kept: 80 characters and 200 bytes of UTF-8, so any of our extensions stays within 255 bytes. */
const MAX_BASE_CHARS = 80;
const MAX_BASE_BYTES = 200;

/**
 * A file name for a download made from a pattern title: characters no system accepts become spaces,
 * runs of spaces become one, leading and trailing dots and spaces go, device names get an underscore,
 * long titles are cut to 80 characters and 200 bytes (never inside a character), and an empty result becomes `pattern`. Letters of
 * every script are kept. `extension` is added as given, e.g. `.seamwright.json`.
 */
export function patternFileName(title: string, extension: string): string {
  let base = title.normalize('NFC').replace(FORBIDDEN, ' ').replace(/\s+/g, ' ');
  base = base.replace(/^[\s.]+|[\s.]+$/g, '');
  base = cut(base).replace(/[\s.]+$/g, '');
  if (!base) base = 'pattern';
  if (RESERVED.test(base)) base = `_${base}`;
  return base + extension;
}

/** The longest start of `text` within the character and byte limits, never ending inside a character. */
function cut(text: string): string {
  const encoder = new TextEncoder();
  let out = '';
  let bytes = 0;
  let count = 0;
  for (const ch of text) {
    bytes += encoder.encode(ch).length;
    if (++count > MAX_BASE_CHARS || bytes > MAX_BASE_BYTES) break;
    out += ch;
  }
  return out;
}

/** The extension of pattern files, as docs/pattern-format.md names them. */
export const PATTERN_FILE_EXTENSION = '.seamwright.json';
