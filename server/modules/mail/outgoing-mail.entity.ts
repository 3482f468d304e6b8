import { defineEntity, type Opt } from '@mikro-orm/core';
import { BaseRecord, baseProperties } from '../base';
import { Organization } from '../users/organization.entity';

export const outgoingMailKinds = ['invitation', 'password-reset', 'password-changed', 'sheet', 'review'] as const;
export type OutgoingMailKind = (typeof outgoingMailKinds)[number];
export const outgoingMailStatuses = ['queued', 'sending', 'sent', 'failed'] as const;
export type OutgoingMailStatus = (typeof outgoingMailStatuses)[number];

export interface StoredAttachment {
  filename: string;
  contentType: string;
  /** The bytes, base64. */
  content: string;
}

/**
 * One e-mail Sightfan owes someone (the transactional outbox). It is written in the same
 * transaction as the change that causes it, so an invitation can never exist without its e-mail,
 * and delivered from here with retries. While `sending`, `nextAttemptAt` is the lease's end: a
 * sender that died mid-way leaves the row to be picked up again after it.
 */
export class OutgoingMail extends BaseRecord {
  organization!: Organization;
  kind!: OutgoingMailKind;
  toAddress!: string;
  /** The Reply-To address (a sheet's sender), or null for the product's own notices. */
  replyTo: Opt<string> | null = null;
  subject!: string;
  text!: string;
  attachments: Opt<StoredAttachment[]> = [];
  status: Opt<OutgoingMailStatus> = 'queued';
  attempts: Opt<number> = 0;
  nextAttemptAt: Opt<Date> = new Date();
  lastError: Opt<string> | null = null;
  sentAt: Opt<Date> | null = null;

  static readonly schema = defineEntity({
    class: OutgoingMail,
    tableName: 'outgoing_mail',
    indexes: [{ properties: ['status', 'nextAttemptAt'] }],
    properties: (p) => ({
      ...baseProperties(),
      organization: p.manyToOne(Organization.schema).deleteRule('cascade'),
      kind: p.enum([...outgoingMailKinds]),
      toAddress: p.string().length(320),
      replyTo: p.string().length(320).nullable(),
      subject: p.string().length(998),
      text: p.text(),
      attachments: p.json<StoredAttachment[]>().lazy(true, false),
      status: p.enum([...outgoingMailStatuses]).default('queued'),
      attempts: p.integer().default(0),
      nextAttemptAt: p.datetime(),
      lastError: p.string().length(300).nullable(),
      sentAt: p.datetime().nullable(),
    }),
  });
}
