/**
 * Password reset and change under attack (issue 15, items 5, 6 and 9): guessing is rate-limited,
 * a reset request tells nothing about who has an account, and a used token or a password change
 * ends every other reset link of the account.
 */
import bcrypt from 'bcryptjs';
import { and, eq, isNull } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { freePort } from '../tests/support/server-process';
import { Client, startTestServer, tokenFromMail, userClient, type TestServer } from './test/harness';

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};

describe('reset tokens end with their purpose', () => {
  let t: TestServer;
  beforeAll(async () => {
    t = await startTestServer({ RESET_LIMIT_PER_ACCOUNT: '50', RESET_LIMIT_PER_ADDRESS: '50' });
  });
  afterAll(async () => {
    await t.close();
  });

  /** Asks for `n` reset links for `email` and returns their tokens from the mails. */
  async function resetTokens(email: string, n: number): Promise<string[]> {
    const c = await Client.create(t.app);
    const tokens: string[] = [];
    for (let i = 0; i < n; i++) {
      const arrives = t.mail.waitFor(email);
      await c.post('/api/auth/password-reset', { email }).expect(202);
      tokens.push(tokenFromMail((await arrives).text).token);
    }
    return tokens;
  }

  it('using one of three links refuses the other two', async () => {
    await userClient(t.app, 'sibling@example.test');
    const [a, b, c] = await resetTokens('sibling@example.test', 3);
    const anon = await Client.create(t.app);
    await anon.post('/api/auth/password-reset/confirm', { token: b, newPassword: 'the chosen password' }).expect(200);
    for (const token of [a, c]) {
      const res = await anon.post('/api/auth/password-reset/confirm', { token, newPassword: 'a sneaky other password' });
      expect(res.status).toBe(400);
      expect(res.body.error).toBe('This reset link is invalid or has expired');
    }
    expect((await anon.signIn('sibling@example.test', 'the chosen password')).status).toBe(200);
  });

  it('changing the password refuses every outstanding link', async () => {
    const owner = await userClient(t.app, 'changer@example.test');
    const tokens = await resetTokens('changer@example.test', 2);
    await owner.post('/api/auth/change-password', { currentPassword: 'correct horse battery', newPassword: 'a brand new password' }).expect(200);
    const anon = await Client.create(t.app);
    for (const token of tokens) {
      const res = await anon.post('/api/auth/password-reset/confirm', { token, newPassword: 'taken over password' });
      expect(res.status).toBe(400);
    }
    expect((await anon.signIn('changer@example.test', 'a brand new password')).status).toBe(200);
  });
});

describe('guessing is limited', () => {
  let t: TestServer;
  beforeAll(async () => {
    // The cost the server hashes at matters here: a bogus token must be refused without paying it.
    t = await startTestServer({ BCRYPT_ROUNDS: '12', RESET_LIMIT_PER_ADDRESS: '5', RESET_LIMIT_PER_ACCOUNT: '3', SIGNIN_LIMIT_PER_ACCOUNT: '3', SIGNIN_LIMIT_PER_ADDRESS: '6' });
  });
  afterAll(async () => {
    await t.close();
  });

  it('reset-confirm with a bogus token is refused before any password hashing, and answers 429 after five', async () => {
    const c = await Client.create(t.app);
    const t0 = performance.now();
    await bcrypt.hash('one hash at the server cost', 12);
    const hashMs = performance.now() - t0;
    const statuses: number[] = [];
    const times: number[] = [];
    for (let i = 0; i < 7; i++) {
      const s = performance.now();
      const res = await c.post('/api/auth/password-reset/confirm', { token: `bogus-token-${i}-${'x'.repeat(30)}`, newPassword: 'some new password' });
      times.push(performance.now() - s);
      statuses.push(res.status);
      if (res.status === 429) {
        expect(res.body.error).toMatch(/too many attempts/i);
        expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
      }
    }
    // RESET_LIMIT_PER_ADDRESS=5: five refusals counted, then 429.
    expect(statuses).toEqual([400, 400, 400, 400, 400, 429, 429]);
    // One bcrypt hash at cost 12 takes hundreds of milliseconds; a refusal that hashed first would too.
    expect(median(times.slice(0, 5))).toBeLessThan(hashMs / 3);
  });

  it('change-password answers 429 after three wrong current passwords, also with the right one', async () => {
    const u = await userClient(t.app, 'guessed@example.test');
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++) {
      statuses.push((await u.post('/api/auth/change-password', { currentPassword: `wrong guess ${i}`, newPassword: 'whatever new password' })).status);
    }
    expect(statuses).toEqual([401, 401, 401, 429]);
    const right = await u.post('/api/auth/change-password', { currentPassword: 'correct horse battery', newPassword: 'whatever new password' });
    expect(right.status).toBe(429);
    // Per address: another account from the same address has the address's remaining allowance only.
    const other = await userClient(t.app, 'neighbour@example.test');
    const more: number[] = [];
    for (let i = 0; i < 4; i++) {
      more.push((await other.post('/api/auth/change-password', { currentPassword: `wrong again ${i}`, newPassword: 'whatever new password' })).status);
    }
    // SIGNIN_LIMIT_PER_ADDRESS=6: five counted above (refused ones count too), one more, then 429.
    expect(more).toEqual([401, 429, 429, 429]);
  });
});

describe('a reset request tells nothing about who has an account', () => {
  for (const mail of ['up', 'down'] as const) {
    it(`same status and time for known and unknown addresses with mail ${mail}`, async () => {
      // "Down": SMTP pointed at a port nobody listens on, so every delivery attempt is refused.
      const env: Record<string, string> = { RESET_LIMIT_PER_ACCOUNT: '1000', RESET_LIMIT_PER_ADDRESS: '1000' };
      if (mail === 'down') env['SMTP_PORT'] = String(await freePort());
      const t = await startTestServer(env);
      try {
        await userClient(t.app, 'known@example.test');
        const c = await Client.create(t.app);
        const known: number[] = [];
        const unknown: number[] = [];
        const statuses = new Set<string>();
        for (let i = 0; i < 15; i++) {
          for (const [email, times] of [['known@example.test', known], [`nobody${i}@example.test`, unknown]] as const) {
            const s = performance.now();
            const res = await c.post('/api/auth/password-reset', { email });
            times.push(performance.now() - s);
            statuses.add(`${res.status} ${JSON.stringify(res.body)}`);
          }
        }
        expect([...statuses]).toEqual(['202 {"ok":true}']);
        console.log(`reset request, mail ${mail}: median known ${median(known).toFixed(1)} ms, unknown ${median(unknown).toFixed(1)} ms`);
        expect(Math.abs(median(known) - median(unknown))).toBeLessThan(50);
        if (mail === 'up') {
          // The mail still arrives, from the background sender.
          const arrived = await t.mail.waitFor('known@example.test');
          expect(arrived.subject).toBe('Reset your Seamwright password');
        } else {
          // Nothing lost: every known-address mail waits in the outbox for the mail server to return.
          const { mailOutbox } = t.ctx.data.t;
          const waiting = await t.ctx.data.db
            .select({ id: mailOutbox.id })
            .from(mailOutbox)
            .where(and(eq(mailOutbox.to, 'known@example.test'), isNull(mailOutbox.sentAt)));
          expect(waiting.length).toBe(15);
        }
      } finally {
        await t.close();
      }
    });
  }
});
