import { defineEntity, type Opt } from '@mikro-orm/core';
import { BaseRecord, baseProperties } from '../base';
import { User } from './user.entity';

export const linkPurposes = ['invite', 'reset'] as const;
export type LinkPurpose = (typeof linkPurposes)[number];

/**
 * A one-time link to set a password: an invitation, or a reset after "forgot password". Only the
 * SHA-256 of the token is stored; both kinds expire and work once.
 */
export class Invitation extends BaseRecord {
  user!: User;
  purpose: Opt<LinkPurpose> = 'invite';
  tokenHash!: string;
  expiresAt!: Date;
  usedAt: Opt<Date> | null = null;

  static readonly schema = defineEntity({
    class: Invitation,
    tableName: 'invitation',
    properties: (p) => ({
      ...baseProperties(),
      user: p.manyToOne(User.schema).deleteRule('cascade'),
      purpose: p.enum([...linkPurposes]).default('invite'),
      tokenHash: p.string().length(64).unique(),
      expiresAt: p.datetime(),
      usedAt: p.datetime().nullable(),
    }),
  });
}
