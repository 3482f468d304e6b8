import { defineEntity, type Opt } from '@mikro-orm/core';
import { BaseRecord, baseProperties } from '../base';
import { User } from './user.entity';

/** A one-time link to set a password. Only the SHA-256 of the token is stored. */
export class Invitation extends BaseRecord {
  user!: User;
  tokenHash!: string;
  expiresAt!: Date;
  usedAt: Opt<Date> | null = null;

  static readonly schema = defineEntity({
    class: Invitation,
    tableName: 'invitation',
    properties: (p) => ({
      ...baseProperties(),
      user: p.manyToOne(User.schema).deleteRule('cascade'),
      tokenHash: p.string().length(64).unique(),
      expiresAt: p.datetime(),
      usedAt: p.datetime().nullable(),
    }),
  });
}
