import nodemailer from 'nodemailer';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startFakeMailServer, type FakeMailServer } from './fake-mail-server';

let mail: FakeMailServer;
beforeAll(async () => {
  mail = await startFakeMailServer({ smtpPort: 0, httpPort: 0 });
});
afterAll(async () => {
  await mail.close();
});

const inbox = (path: string, init?: RequestInit) => fetch(`http://127.0.0.1:${mail.httpPort}${path}`, init);

describe('fake mail server', () => {
  it('captures mail sent over real SMTP and shows it over its HTTP inbox', async () => {
    const transport = nodemailer.createTransport({ host: '127.0.0.1', port: mail.smtpPort, secure: false, ignoreTLS: true });
    const arrives = mail.waitFor('Quilter@Example.test');
    await transport.sendMail({
      from: 'Seamwright <no-reply@seamwright.localhost>',
      to: 'Quilter@Example.test',
      subject: 'Héllo — ünïcode',
      text: 'Open http://localhost:4200/invitations/accept?token=abc_DEF-123\n',
      html: '<p>Open <a href="http://localhost:4200/invitations/accept?token=abc_DEF-123">this</a></p>',
    });
    await transport.sendMail({ from: 'x@seamwright.localhost', to: 'other@example.test', subject: 'Other', text: 'x' });
    transport.close();
    const captured = await arrives;
    expect(captured).toMatchObject({ to: ['quilter@example.test'], subject: 'Héllo — ünïcode' });
    expect(captured.text).toContain('token=abc_DEF-123');
    expect(captured.html).toContain('<a href=');

    const all = (await (await inbox('/api/messages')).json()) as { id: string }[];
    expect(all).toHaveLength(2);
    const mine = (await (await inbox('/api/messages?to=quilter@example.test')).json()) as { id: string; subject: string }[];
    expect(mine.map((m) => m.subject)).toEqual(['Héllo — ünïcode']);
    const one = await inbox(`/api/messages/${mine[0].id}`);
    expect(((await one.json()) as { from: string }).from).toContain('no-reply@seamwright.localhost');
    expect((await inbox('/api/messages/999')).status).toBe(404);
    expect((await inbox('/api/messages', { method: 'DELETE' })).status).toBe(200);
    expect(await (await inbox('/api/messages')).json()).toEqual([]);
  });
});
