import nodemailer from 'nodemailer';
import type { Config } from '../config';

/** One outgoing e-mail. */
export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
}

/** Sends e-mail; the server's only way out to a mailbox. */
export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

/** A mailer speaking SMTP to `config.smtp` (the local fake mail server in development and tests). */
export function createSmtpMailer(config: Pick<Config, 'smtp' | 'mailFrom' | 'env'>): Mailer {
  const transport = nodemailer.createTransport({
    host: config.smtp.host,
    port: config.smtp.port,
    secure: false,
    // The local fake speaks plain SMTP on loopback; a real relay would be configured with TLS.
    ignoreTLS: config.env !== 'production',
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 20_000,
  });
  return {
    async send(mail) {
      await transport.sendMail({ from: config.mailFrom, ...mail });
    },
    close() {
      transport.close();
    },
  };
}
