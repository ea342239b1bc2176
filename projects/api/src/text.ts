/**
 * Text from users (titles, names, notes) without control characters: C0 controls, DEL and C1 controls
 * are removed (Unicode general category Cc); tab and line feed stay where text may span lines. A NUL
 * in a title would be stored and mailed, an ESC would cut a PDF title short.
 */
export function stripControlCharacters(text: string, multiline = false): string {
  let out = '';
  for (const ch of text) {
    const c = ch.codePointAt(0) ?? 0;
    const control = c < 0x20 || (c >= 0x7f && c <= 0x9f);
    if (!control || (multiline && (c === 0x09 || c === 0x0a))) out += ch;
  }
  return out;
}

/** {@link stripControlCharacters} for one-line text (titles, names). */
export const singleLineText = (text: string) => stripControlCharacters(text, false);

/** {@link stripControlCharacters} for text that may span lines (notes, descriptions). */
export const multiLineText = (text: string) => stripControlCharacters(text, true);
