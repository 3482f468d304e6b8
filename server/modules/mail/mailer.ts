import nodemailer, { type Transporter } from 'nodemailer';

export interface OutgoingMailMessage {
  to: string;
  replyTo?: string;
  subject: string;
  text: string;
  attachments?: { filename: string; content: Buffer; contentType: string }[];
}

export interface Mailer {
  send(mail: OutgoingMailMessage): Promise<void>;
  close(): void;
}

/**
 * How long one delivery may wait on the mail server. nodemailer's own defaults (2 minutes to
 * connect, 30 s for the greeting, 10 minutes of socket silence) would hold a request or the outbox
 * worker far too long when a server accepts the connection and then says nothing.
 */
export interface SmtpTimeouts {
  connectionMs: number;
  greetingMs: number;
  socketMs: number;
}
export const DEFAULT_SMTP_TIMEOUTS: SmtpTimeouts = { connectionMs: 5000, greetingMs: 5000, socketMs: 15000 };

/** nodemailer toward a real SMTP server (SMTP_URL) or the local fake on 127.0.0.1. */
export function createMailer(opts: { smtpUrl?: string; fakePort?: number; host?: string; from: string; timeouts?: SmtpTimeouts }): Mailer {
  const t = opts.timeouts ?? DEFAULT_SMTP_TIMEOUTS;
  const timeouts = { connectionTimeout: t.connectionMs, greetingTimeout: t.greetingMs, socketTimeout: t.socketMs };
  const transport: Transporter = opts.smtpUrl
    ? nodemailer.createTransport({ url: opts.smtpUrl, ...timeouts })
    : nodemailer.createTransport({ host: opts.host ?? '127.0.0.1', port: opts.fakePort, secure: false, ignoreTLS: true, ...timeouts });
  return {
    async send(mail) {
      await transport.sendMail({ from: opts.from, ...mail });
    },
    close: () => transport.close(),
  };
}
