import nodemailer, { type Transporter } from 'nodemailer';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  attachments?: { filename: string; content: Buffer; contentType: string }[];
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

/** nodemailer toward a real SMTP server (SMTP_URL) or the local fake on 127.0.0.1. */
export function createMailer(opts: { smtpUrl?: string; fakePort?: number; from: string }): Mailer {
  const transport: Transporter = opts.smtpUrl
    ? nodemailer.createTransport(opts.smtpUrl)
    : nodemailer.createTransport({ host: '127.0.0.1', port: opts.fakePort, secure: false, ignoreTLS: true });
  return {
    async send(mail) {
      await transport.sendMail({ from: opts.from, ...mail });
    },
    close: () => transport.close(),
  };
}
