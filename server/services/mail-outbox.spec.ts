import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sqliteData, type Data } from '../db/data';
import { openDatabase, type DatabaseHandle } from '../db/database';
import { MailOutbox, retryDelayMs } from './mail-outbox';
import type { Mailer, OutgoingMail } from './mailer';

let dir: string;
let handle: DatabaseHandle;
let data: Data;
beforeAll(() => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'seamwright-outbox-'));
  handle = openDatabase(dir);
  data = sqliteData(handle);
});
afterAll(() => {
  handle.close();
  fs.rmSync(dir, { recursive: true, force: true });
});

/** A mailer that refuses the first `failures` sends, then keeps what it is given. */
function flakyMailer(failures: number): Mailer & { sent: OutgoingMail[] } {
  const sent: OutgoingMail[] = [];
  let left = failures;
  return {
    sent,
    async send(mail) {
      if (left-- > 0) throw new Error('connect ECONNREFUSED 127.0.0.1:1025');
      sent.push(mail);
    },
    close() {},
  };
}

const row = (id: string) =>
  handle.sqlite.prepare('SELECT attempts, next_attempt_at AS next, sent_at AS sent, failed_at AS failed, text, last_error AS error FROM mail_outbox WHERE id = ?').get(id) as {
    attempts: number;
    next: number;
    sent: number | null;
    failed: number | null;
    text: string;
    error: string | null;
  };

describe('mail outbox', () => {
  it('retries a refused mail with doubling delays, sends it when the server is back, then clears its body', async () => {
    const mailer = flakyMailer(2);
    const outbox = new MailOutbox(data, mailer, () => undefined, { firstRetryMs: 1000, maxRetryMs: 60_000, maxAttempts: 5, wakeOnEnqueue: false });
    let now = 1_000_000;
    const id = await outbox.enqueue(data, 'password-reset', { to: 'a@example.test', subject: 'Reset', text: 'link https://x/?token=secret' });
    handle.sqlite.prepare('UPDATE mail_outbox SET next_attempt_at = ? WHERE id = ?').run(now, id);

    expect(await outbox.drain(() => now)).toBe(0);
    expect(row(id)).toMatchObject({ attempts: 1, next: now + 1000, sent: null, failed: null, error: 'connect ECONNREFUSED 127.0.0.1:1025' });
    // Not due yet: nothing is tried.
    now += 999;
    expect(await outbox.drain(() => now)).toBe(0);
    expect(row(id).attempts).toBe(1);
    now += 1;
    expect(await outbox.drain(() => now)).toBe(0);
    expect(row(id)).toMatchObject({ attempts: 2, next: now + 2000 });
    now += 2000;
    expect(await outbox.drain(() => now)).toBe(1);
    expect(row(id)).toMatchObject({ attempts: 3, sent: now, text: '', error: null });
    expect(mailer.sent).toEqual([{ to: 'a@example.test', subject: 'Reset', text: 'link https://x/?token=secret' }]);
    expect(await outbox.drain(() => now + 1e9)).toBe(0);
    await outbox.close();
  });

  it('gives up after the last attempt and keeps the reason', async () => {
    const outbox = new MailOutbox(data, flakyMailer(100), () => undefined, { firstRetryMs: 10, maxRetryMs: 10, maxAttempts: 3, wakeOnEnqueue: false });
    const now = 5_000_000;
    const id = await outbox.enqueue(data, 'invitation', { to: 'b@example.test', subject: 'Join', text: 'x' });
    handle.sqlite.prepare('UPDATE mail_outbox SET next_attempt_at = ? WHERE id = ?').run(now, id);
    for (let i = 0; i < 5; i++) await outbox.drain(() => now + i * 10);
    expect(row(id)).toMatchObject({ attempts: 3, failed: now + 20, sent: null });
    await outbox.close();
  });

  it('delays double from the first retry up to the ceiling', () => {
    const o = { firstRetryMs: 5000, maxRetryMs: 3_600_000 };
    expect([1, 2, 3, 4, 11, 12].map((n) => retryDelayMs(n, o))).toEqual([5000, 10_000, 20_000, 40_000, 3_600_000, 3_600_000]);
  });
});
