import { SMTPServer } from 'smtp-server';
import { simpleParser, type AddressObject } from 'mailparser';
import type { AddressInfo } from 'node:net';
import type { Orm } from '../../db';
import type { Logger } from '../../logger';
import { MailMessage } from './mail-message.entity';

export interface FakeSmtp {
  port: number;
  close(): Promise<void>;
}

function addresses(a: AddressObject | AddressObject[] | undefined): string[] {
  if (!a) return [];
  return (Array.isArray(a) ? a : [a]).flatMap((o) => o.value.map((v) => v.address ?? '').filter(Boolean));
}

/**
 * The project's local stand-in for a mail provider: an SMTP server on 127.0.0.1 that accepts
 * everything and keeps each message in the database, where the demo outbox shows it.
 * Port 0 picks a free port (tests).
 */
export async function startFakeSmtp(orm: Orm, log: Logger, port: number): Promise<FakeSmtp> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    size: 25 * 1024 * 1024,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('error', callback);
      stream.on('end', () => {
        const raw = Buffer.concat(chunks);
        simpleParser(raw)
          .then(async (parsed) => {
            const em = orm.em.fork();
            const envelopeTo = session.envelope.rcptTo.map((r) => r.address);
            const msg = em.create(MailMessage, {
              fromAddress: addresses(parsed.from)[0] ?? (session.envelope.mailFrom ? session.envelope.mailFrom.address : ''),
              toAddresses: envelopeTo.length ? envelopeTo : addresses(parsed.to),
              subject: parsed.subject ?? '(no subject)',
              text: parsed.text ?? '',
              attachments: parsed.attachments.map((a) => ({
                filename: a.filename ?? 'attachment',
                contentType: a.contentType,
                size: a.size,
              })),
              raw: raw.toString('latin1'),
              receivedAt: new Date(),
            });
            await em.persistAndFlush(msg);
            log.info(`fake mail: received "${msg.subject}" for ${msg.toAddresses.join(', ')}`);
            callback();
          })
          .catch((err: Error) => callback(err));
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const actual = (server.server.address() as AddressInfo).port;
  return {
    port: actual,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
