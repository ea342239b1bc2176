/**
 * A local fake mail server for development and tests: accepts every message over SMTP
 * (smtp-server), parses it (mailparser), keeps it in memory and shows it over a small HTTP API:
 *
 *   GET    /api/messages          → [{ id, from, to[], subject, text, html, date }]  (?to=address filters)
 *   GET    /api/messages/:id      → one message
 *   DELETE /api/messages          → forget all
 *
 * Standalone: `tsx server/dev/fake-mail-server.ts` (FAKE_SMTP_PORT default 1025,
 * FAKE_MAIL_HTTP_PORT default 1080, FAKE_MAIL_HOST default 127.0.0.1).
 */
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import { simpleParser, type AddressObject } from 'mailparser';

/** One captured e-mail. */
export interface CapturedMail {
  id: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  date: string;
}

export interface FakeMailServer {
  smtpPort: number;
  httpPort: number;
  host: string;
  /** Captured messages, oldest first. */
  messages: CapturedMail[];
  /** Resolves with the next message sent to `to` (or already captured after `since`). */
  waitFor(to: string, timeoutMs?: number): Promise<CapturedMail>;
  close(): Promise<void>;
}

export interface FakeMailOptions {
  host?: string;
  /** 0 picks a free port. */
  smtpPort?: number;
  httpPort?: number;
  /** Most messages kept (oldest dropped first). */
  keep?: number;
}

const addresses = (a: AddressObject | AddressObject[] | undefined): string[] =>
  (Array.isArray(a) ? a : a ? [a] : []).flatMap((o) => o.value.map((v) => (v.address ?? '').toLowerCase())).filter(Boolean);

/** Starts the fake SMTP server and its HTTP inbox. */
export async function startFakeMailServer(options: FakeMailOptions = {}): Promise<FakeMailServer> {
  const host = options.host ?? '127.0.0.1';
  const keep = options.keep ?? 500;
  const messages: CapturedMail[] = [];
  const waiters: { to: string; resolve: (m: CapturedMail) => void }[] = [];
  let counter = 0;

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    banner: 'Seamwright fake mail server',
    size: 10 * 1024 * 1024,
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const envelopeTo = session.envelope.rcptTo.map((r) => r.address.toLowerCase());
          const mail: CapturedMail = {
            id: String(++counter),
            from: parsed.from?.text ?? (session.envelope.mailFrom ? session.envelope.mailFrom.address : ''),
            to: envelopeTo.length > 0 ? envelopeTo : addresses(parsed.to),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : null,
            date: (parsed.date ?? new Date()).toISOString(),
          };
          messages.push(mail);
          if (messages.length > keep) messages.splice(0, messages.length - keep);
          for (let i = waiters.length - 1; i >= 0; i--) {
            if (mail.to.includes(waiters[i].to)) {
              waiters[i].resolve(mail);
              waiters.splice(i, 1);
            }
          }
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });

  const inbox = http.createServer((req, res) => {
    const url = new URL(req.url ?? '/', 'http://inbox');
    const send = (status: number, body: unknown) => {
      res.writeHead(status, { 'content-type': 'application/json', 'cache-control': 'no-store' });
      res.end(JSON.stringify(body));
    };
    if (url.pathname === '/api/messages' && req.method === 'GET') {
      const to = url.searchParams.get('to')?.toLowerCase();
      return send(200, to ? messages.filter((m) => m.to.includes(to)) : messages);
    }
    if (url.pathname === '/api/messages' && req.method === 'DELETE') {
      messages.length = 0;
      return send(200, { ok: true });
    }
    const one = /^\/api\/messages\/(\d+)$/.exec(url.pathname);
    if (one && req.method === 'GET') {
      const m = messages.find((x) => x.id === one[1]);
      return m ? send(200, m) : send(404, { error: 'No such message', details: null });
    }
    if (url.pathname === '/api/health') return send(200, { ok: true, messages: messages.length });
    send(404, { error: 'Not found', details: null });
  });

  await new Promise<void>((resolve, reject) => {
    smtp.once('error', reject);
    smtp.listen(options.smtpPort ?? 1025, host, () => resolve());
  });
  await new Promise<void>((resolve, reject) => {
    inbox.once('error', reject);
    inbox.listen(options.httpPort ?? 1080, host, () => resolve());
  });
  const smtpAddress = (smtp as unknown as { server: http.Server }).server.address() as AddressInfo;
  const httpAddress = inbox.address() as AddressInfo;

  return {
    host,
    smtpPort: smtpAddress.port,
    httpPort: httpAddress.port,
    messages,
    waitFor(to, timeoutMs = 10_000) {
      const address = to.toLowerCase();
      return new Promise((resolve, reject) => {
        const timer = setTimeout(() => reject(new Error(`no mail to ${address} within ${timeoutMs} ms`)), timeoutMs);
        waiters.push({
          to: address,
          resolve: (m) => {
            clearTimeout(timer);
            resolve(m);
          },
        });
      });
    },
    async close() {
      await new Promise<void>((resolve) => smtp.close(() => resolve()));
      inbox.closeAllConnections();
      await new Promise<void>((resolve) => inbox.close(() => resolve()));
    },
  };
}

const isMain = process.argv[1]?.endsWith('fake-mail-server.ts');
if (isMain) {
  const num = (v: string | undefined, d: number) => (v && /^\d+$/.test(v) ? Number(v) : d);
  startFakeMailServer({
    host: process.env['FAKE_MAIL_HOST'] ?? '127.0.0.1',
    smtpPort: num(process.env['FAKE_SMTP_PORT'], 1025),
    httpPort: num(process.env['FAKE_MAIL_HTTP_PORT'], 1080),
  })
    .then((s) => {
      console.log(`Fake mail server: SMTP on ${s.host}:${s.smtpPort}, inbox on http://${s.host}:${s.httpPort}/api/messages`);
      const stop = () => void s.close().then(() => process.exit(0));
      process.once('SIGINT', stop);
      process.once('SIGTERM', stop);
    })
    .catch((err) => {
      console.error('Fake mail server failed to start:', err);
      process.exit(1);
    });
}
