import { describe, expect, it } from 'vitest';
import { emailSchema, passwordSchema, signUpBodySchema } from './requests';

describe('request bodies', () => {
  it('counts a password in UTF-8 bytes, as bcrypt reads it', () => {
    // "é" is two bytes in UTF-8 (U+00E9 → C3 A9), so 36 of them are 72 bytes and 37 are 74.
    expect(passwordSchema.safeParse('é'.repeat(36)).success).toBe(true);
    expect(passwordSchema.safeParse('é'.repeat(37)).success).toBe(false);
    expect(passwordSchema.safeParse('short').success).toBe(false);
  });

  it('trims and lower-cases e-mail addresses', () => {
    expect(emailSchema.parse('  Quinn@Share.Test ')).toBe('quinn@share.test');
    expect(emailSchema.safeParse('not an address').success).toBe(false);
  });

  it('refuses unknown fields and roles nobody may sign up with', () => {
    const ok = { email: 'a@b.test', password: 'correct horse battery', displayName: 'A', role: 'designer' };
    expect(signUpBodySchema.safeParse(ok).success).toBe(true);
    expect(signUpBodySchema.safeParse({ ...ok, role: 'admin' }).success).toBe(false);
    expect(signUpBodySchema.safeParse({ ...ok, extra: 1 }).success).toBe(false);
  });
});
