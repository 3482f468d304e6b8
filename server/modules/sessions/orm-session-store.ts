import session from 'express-session';
import type { SessionData } from 'express-session';
import type { Orm } from '../../db';
import { fromDbDate, type DbDate } from '../../db-date';
import { runCompiled } from '../../compiled-query';
import { SessionRecord } from './session.entity';

const DAY_MS = 24 * 60 * 60 * 1000;
/**
 * Rolling sessions move their expiry on every request; writing that to the database each time made
 * every signed-in GET a write (SQLite serialises writers). The row's expiry is written again only
 * when it would move by more than this, so a 14-day session may end up to an hour early — never late.
 */
export const TOUCH_GRANULARITY_MS = 60 * 60 * 1000;
/** Bounded memory of the expiry last read or written per session id: a cache that only saves writes. */
const REMEMBERED_EXPIRIES = 10_000;

/**
 * An express-session store over the app's own database (SQLite or PostgreSQL), through the ORM, so sessions survive a
 * restart and live in the same migrations as everything else. We wrote this small one rather than
 * add a store package because the packages open a second connection to the same file, outside the
 * migrations, and SQLite serialises writers (see DEVELOPERS.md).
 */
export class OrmSessionStore extends session.Store {
  private pruneTimer?: NodeJS.Timeout;
  private readonly storedExpiry = new Map<string, number>();

  private remember(sid: string, expiresAt: number): void {
    this.storedExpiry.delete(sid);
    this.storedExpiry.set(sid, expiresAt);
    if (this.storedExpiry.size > REMEMBERED_EXPIRIES) this.storedExpiry.delete(this.storedExpiry.keys().next().value as string);
  }

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

  /**
   * One plain select of the two columns a request needs, without a forked entity manager or an
   * entity, its SQL kept (server/compiled-query.ts): this runs on every signed-in request, before
   * the request's own entity manager exists.
   * The expiry comes back as the database keeps it (SQLite: milliseconds; PostgreSQL: a Date).
   */
  override get(sid: string, cb: (err: unknown, session?: SessionData | null) => void): void {
    const em = this.orm.em;
    runCompiled<{ data: string; expires_at: DbDate }>(em, 'session:get', { sid }, (slot) =>
      em.getKnex()('session').select('data', 'expires_at').where('sid', slot('sid')).limit(1),
    )
      .then(([row]) => {
        const expiresAt = row ? fromDbDate(row.expires_at).getTime() : NaN;
        if (!row || !(expiresAt > Date.now())) return cb(null, null);
        this.remember(sid, expiresAt);
        cb(null, JSON.parse(row.data) as SessionData);
      })
      .catch((err) => cb(err));
  }

  override set(sid: string, sess: SessionData, cb?: (err?: unknown) => void): void {
    const em = this.orm.em.fork();
    const expiresAt = this.expiry(sess);
    em.upsert(SessionRecord, { sid, data: JSON.stringify(sess), userId: sess.userId ?? null, expiresAt })
      .then(() => {
        this.remember(sid, expiresAt.getTime());
        cb?.();
      })
      .catch((err) => cb?.(err));
  }

  /** Counts the expiry writes that touch() made (for the tests and the load benchmark). */
  touchWrites = 0;

  override touch(sid: string, sess: SessionData, cb?: () => void): void {
    const expiresAt = this.expiry(sess);
    const stored = this.storedExpiry.get(sid);
    if (stored !== undefined && expiresAt.getTime() - stored < TOUCH_GRANULARITY_MS) {
      cb?.();
      return;
    }
    const em = this.orm.em.fork();
    this.touchWrites++;
    em.nativeUpdate(SessionRecord, { sid }, { expiresAt })
      .then(() => {
        this.remember(sid, expiresAt.getTime());
        cb?.();
      })
      .catch(() => cb?.());
  }

  override destroy(sid: string, cb?: (err?: unknown) => void): void {
    this.storedExpiry.delete(sid);
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
