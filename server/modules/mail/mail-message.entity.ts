import { defineEntity, type Opt } from '@mikro-orm/core';

export interface AttachmentMeta {
  filename: string;
  contentType: string;
  size: number;
}

/** A message received by the local fake SMTP server (demo mode's outbox). `raw` is the whole RFC 5322 message. */
export class MailMessage {
  id!: number;
  fromAddress!: string;
  toAddresses!: string[];
  subject!: string;
  text!: string;
  attachments!: AttachmentMeta[];
  raw!: string;
  receivedAt: Opt<Date> = new Date();

  static readonly schema = defineEntity({
    class: MailMessage,
    tableName: 'mail_message',
    properties: (p) => ({
      id: p.integer().primary().autoincrement(),
      fromAddress: p.string().length(320),
      toAddresses: p.json<string[]>(),
      subject: p.string().length(998),
      text: p.text(),
      attachments: p.json<AttachmentMeta[]>(),
      raw: p.text().lazy(true, false),
      receivedAt: p.datetime().onCreate(() => new Date()),
    }),
  });
}
