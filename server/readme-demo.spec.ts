import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS } from './db/seed';

describe('README demo sign-in', () => {
  it('lists exactly the accounts the seed creates', () => {
    const readme = readFileSync(new URL('../README.md', import.meta.url), 'utf8');
    const rows = [...readme.matchAll(/^\| (admin|designer|quilter) \| (\S+@\S+) \| (\S+) \|$/gm)].map((m) => ({
      role: m[1],
      email: m[2],
      password: m[3],
    }));
    const seeded = DEMO_ACCOUNTS.map(({ role, email, password }) => ({ role, email, password }));
    expect(rows.sort((a, b) => a.role.localeCompare(b.role))).toEqual(seeded.sort((a, b) => a.role.localeCompare(b.role)));
  });
});
