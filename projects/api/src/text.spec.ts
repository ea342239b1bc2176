import { describe, expect, it } from 'vitest';
import { saveVersionBodySchema, signUpBodySchema } from './public-api';
import { stripControlCharacters } from './text';

// The control characters are Unicode's general category Cc: U+0000–U+001F, U+007F and U+0080–U+009F
// (The Unicode Standard, §23.1 "Control Codes").
describe('stripControlCharacters', () => {
  it('removes every C0 control, DEL and every C1 control from one-line text', () => {
    const all = Array.from({ length: 0x20 }, (_, i) => String.fromCharCode(i)).join('') + '\u007f' + Array.from({ length: 0x20 }, (_, i) => String.fromCharCode(0x80 + i)).join('');
    expect(stripControlCharacters(`a${all}b`)).toBe('ab');
  });

  it('keeps tab and line feed in multi-line text, drops carriage return', () => {
    expect(stripControlCharacters('one\r\n\ttwo\u0000', true)).toBe('one\n\ttwo');
    expect(stripControlCharacters('one\r\n\ttwo', false)).toBe('onetwo');
  });

  it('keeps every other script, emoji and the characters just outside the ranges', () => {
    expect(stripControlCharacters('キルト ☂ نقشه 🧵 \u00a0~')).toBe('キルト ☂ نقشه 🧵 \u00a0~');
  });
});

describe('schemas strip control characters at the edge', () => {
  it('a display name with NUL and ESC is stored without them; one of only controls is refused', () => {
    const body = signUpBodySchema.parse({ email: 'a@b.test', password: 'long enough password', displayName: 'Ada\u0000\u001b[2J Lovelace', role: 'designer' });
    expect(body.displayName).toBe('Ada[2J Lovelace');
    const empty = signUpBodySchema.safeParse({ email: 'a@b.test', password: 'long enough password', displayName: '\u0000\u0007', role: 'designer' });
    expect(empty.success).toBe(false);
  });

  it("a version's name is one line and its note keeps its lines", () => {
    const body = saveVersionBodySchema.parse({ baseRevision: 1, name: 'Final\u0085\n', note: 'line one\nline two\u0000' });
    expect(body).toMatchObject({ name: 'Final', note: 'line one\nline two' });
  });
});
