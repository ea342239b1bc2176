import { expect } from '@playwright/test';
import { mailInboxURL } from '../../playwright.config';

/** One message caught by the local fake mail server (server/dev/fake-mail-server.ts). */
export interface CaughtMail {
  id: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  date: string;
}

/** Every message to `to` caught so far, oldest first, from the fake mail server's HTTP API. */
export async function mailsTo(to: string): Promise<CaughtMail[]> {
  const res = await fetch(`${mailInboxURL}/api/messages?to=${encodeURIComponent(to)}`);
  return (await res.json()) as CaughtMail[];
}

/** Waits for the newest message to `to` whose subject matches, from the fake mail server's HTTP API. */
export async function waitForMail(to: string, subject: RegExp): Promise<CaughtMail> {
  let found: CaughtMail | undefined;
  await expect
    .poll(
      async () => {
        const all = await mailsTo(to);
        found = all.filter((m) => subject.test(m.subject)).at(-1);
        return !!found;
      },
      { timeout: 15_000, message: `mail to ${to} matching ${subject}` },
    )
    .toBe(true);
  return found!;
}

/** The first link in a mail's text that starts with `prefix`. */
export function linkIn(mail: CaughtMail, prefix: string): string {
  const link = mail.text.split(/\s+/).find((w) => w.startsWith(prefix));
  if (!link) throw new Error(`no link starting with ${prefix} in: ${mail.text}`);
  return link.replace(/[>).,]+$/, '');
}
