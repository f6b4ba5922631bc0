import nodemailer from 'nodemailer';
import type { Config } from '../config';

export interface OutgoingMail {
  from: string;
  to: string;
  subject: string;
  text: string;
  html?: string | null;
  /** Stable per outbox row, so a resend after a crash is recognisable as the same message. */
  messageId: string;
  /** Extra headers such as List-Unsubscribe (RFC 8058). */
  headers?: Record<string, string>;
}

/** Sends e-mail; SMTP in every environment (the capturing fake locally). */
export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  verify(): Promise<void>;
  close(): void;
}

/** A nodemailer SMTP transport with short timeouts so a dead server fails fast. */
export function createSmtpMailer(config: Pick<Config, 'SMTP_HOST' | 'SMTP_PORT' | 'SMTP_SECURE' | 'SMTP_USER' | 'SMTP_PASS'>): Mailer {
  const transport = nodemailer.createTransport({
    host: config.SMTP_HOST,
    port: config.SMTP_PORT,
    secure: config.SMTP_SECURE,
    ...(config.SMTP_USER ? { auth: { user: config.SMTP_USER, pass: config.SMTP_PASS ?? '' } } : {}),
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
    socketTimeout: 15_000,
  });
  return {
    async send(mail) {
      await transport.sendMail({
        from: mail.from,
        to: mail.to,
        subject: mail.subject,
        text: mail.text,
        ...(mail.html ? { html: mail.html } : {}),
        messageId: mail.messageId,
        ...(mail.headers && Object.keys(mail.headers).length ? { headers: mail.headers } : {}),
      });
    },
    async verify() {
      await transport.verify();
    },
    close: () => transport.close(),
  };
}
