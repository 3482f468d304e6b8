import session from 'express-session';
import type { SessionData } from 'express-session';
import type { Orm } from '../../db';
import { SessionRecord } from './session.entity';

const DAY_MS = 24 * 60 * 60 * 1000;

/**
 * An express-session store over the app's own SQLite file, through the ORM, so sessions survive a
 * restart and live in the same migrations as everything else. We wrote this small one rather than
 * add a store package because the packages open a second connection to the same file, outside the
 * migrations, and SQLite serialises writers (see DEVELOPERS.md).
 */
export class OrmSessionStore extends session.Store {
  private pruneTimer?: NodeJS.Timeout;

  constructor(
    private readonly orm: Orm,
    pruneEveryMs = 15 * 60 * 1000,
  ) {
    super();
    this.pruneTimer = setInterval(() => void this.prune().catch(() => undefined), pruneEveryMs);
    this.pruneTimer.unref();
  }

  private expiry(sess: SessionData): Date {
    const exp = sess.cookie?.expires;
    if (exp) return new Date(exp);
    return new Date(Date.now() + DAY_MS);
  }

  override get(sid: string, cb: (err: unknown, session?: SessionData | null) => void): void {
    const em = this.orm.em.fork();
    em.findOne(SessionRecord, { sid })
      .then((row) => {
        if (!row || row.expiresAt.getTime() <= Date.now()) return cb(null, null);
        cb(null, JSON.parse(row.data) as SessionData);
      })
      .catch((err) => cb(err));
  }

  override set(sid: string, sess: SessionData, cb?: (err?: unknown) => void): void {
    const em = this.orm.em.fork();
    em.upsert(SessionRecord, { sid, data: JSON.stringify(sess), userId: sess.userId ?? null, expiresAt: this.expiry(sess) })
      .then(() => cb?.())
      .catch((err) => cb?.(err));
  }

  override touch(sid: string, sess: SessionData, cb?: () => void): void {
    const em = this.orm.em.fork();
    em.nativeUpdate(SessionRecord, { sid }, { expiresAt: this.expiry(sess) })
      .then(() => cb?.())
      .catch(() => cb?.());
  }

  override destroy(sid: string, cb?: (err?: unknown) => void): void {
    const em = this.orm.em.fork();
    em.nativeDelete(SessionRecord, { sid })
      .then(() => cb?.())
      .catch((err) => cb?.(err));
  }

  /** Ends every session of one user (an admin disabled them), or all but `keepSid` (they changed their password). */
  async destroyForUser(userId: number, keepSid?: string): Promise<void> {
    await this.orm.em.fork().nativeDelete(SessionRecord, keepSid ? { userId, sid: { $ne: keepSid } } : { userId });
  }

  async prune(): Promise<number> {
    return this.orm.em.fork().nativeDelete(SessionRecord, { expiresAt: { $lte: new Date() } });
  }

  close(): void {
    if (this.pruneTimer) clearInterval(this.pruneTimer);
  }
}
