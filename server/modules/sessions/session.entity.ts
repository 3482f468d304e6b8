import { defineEntity, type Opt } from '@mikro-orm/core';

/** A stored express-session, so sign-ins survive a server restart. */
export class SessionRecord {
  sid!: string;
  data!: string;
  /** The signed-in user, so every session of a disabled user can be ended at once. */
  userId: Opt<number> | null = null;
  expiresAt!: Date;

  static readonly schema = defineEntity({
    class: SessionRecord,
    tableName: 'session',
    properties: (p) => ({
      sid: p.string().length(128).primary(),
      data: p.text(),
      userId: p.integer().nullable().index(),
      expiresAt: p.datetime().index(),
    }),
  });
}
