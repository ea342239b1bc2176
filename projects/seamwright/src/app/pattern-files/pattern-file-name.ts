/** Names the operating systems keep for devices (Windows refuses them as file names, with any extension). */
const RESERVED = /^(con|prn|aux|nul|com[0-9]|lpt[0-9])$/i;
/** Characters no file name may hold on one system or another, and control characters. */
// eslint-disable-next-line no-control-regex
const FORBIDDEN = /[<>:"/\\|?*\u0000-\u001f\u007f]/g;
/** Longest base name kept, in characters; with the longest extension it stays far below 255 bytes. */
const MAX_BASE_CHARS = 80;

/**
 * A file name for a download made from a pattern title: characters no system accepts become spaces,
 * runs of spaces become one, leading and trailing dots and spaces go, device names get an underscore,
 * long titles are cut (never inside a surrogate pair), and an empty result becomes `pattern`. Letters of
 * every script are kept. `extension` is added as given, e.g. `.seamwright.json`.
 */
export function patternFileName(title: string, extension: string): string {
  let base = title.normalize('NFC').replace(FORBIDDEN, ' ').replace(/\s+/g, ' ');
  base = base.replace(/^[\s.]+|[\s.]+$/g, '');
  const chars = Array.from(base);
  if (chars.length > MAX_BASE_CHARS) base = chars.slice(0, MAX_BASE_CHARS).join('').replace(/[\s.]+$/g, '');
  if (!base) base = 'pattern';
  if (RESERVED.test(base)) base = `_${base}`;
  return base + extension;
}

/** The extension of pattern files, as docs/pattern-format.md names them. */
export const PATTERN_FILE_EXTENSION = '.seamwright.json';
