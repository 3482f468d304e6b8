/**
 * Rate limits counted in the database, so every app instance sees the same counts (issue 15).
 *
 * One statement per attempt: `insert … on conflict (key) do update … returning points`, which both
 * SQLite (3.35+) and PostgreSQL run atomically, with the same SQL text. A window that has run out
 * starts again inside the same statement, so two instances can never both read "under the limit"
 * and then both write. The shape follows rate-limiter-flexible's (`consume` throws a
 * `RateLimiterRes` when over), so callers keep its consume-first pattern.
 */
import { RateLimiterRes } from 'rate-limiter-flexible';
import type { Orm } from '../../db';

export interface DbRateLimiterOptions {
  keyPrefix: string;
  /** Points allowed per window. */
  points: number;
  /** The window, in seconds, from the first point consumed in it. */
  duration: number;
}

interface Row {
  points: number | string;
  expires_at_ms: number | string;
}

const UPSERT = `insert into rate_limit (key, points, expires_at_ms) values (?, ?, ?)
  on conflict (key) do update set
    points = case when rate_limit.expires_at_ms > ? then rate_limit.points + excluded.points else excluded.points end,
    expires_at_ms = case when rate_limit.expires_at_ms > ? then rate_limit.expires_at_ms else excluded.expires_at_ms end
  returning points, expires_at_ms`;

export class DbRateLimiter {
  constructor(
    private readonly orm: Orm,
    readonly options: DbRateLimiterOptions,
  ) {}

  private key(k: string): string {
    return `${this.options.keyPrefix}:${k}`;
  }

  private result(row: Row): RateLimiterRes {
    const consumed = Number(row.points);
    return new RateLimiterRes(Math.max(this.options.points - consumed, 0), Math.max(Number(row.expires_at_ms) - Date.now(), 0), consumed);
  }

  /**
   * Adds `points` to the key's count and answers the new count; throws the answer (a
   * `RateLimiterRes`) when the count is now over the limit. `customDuration` (seconds) sets the
   * window of a count that starts with this call.
   */
  async consume(k: string, points = 1, opts: { customDuration?: number } = {}): Promise<RateLimiterRes> {
    const now = Date.now();
    const expires = now + (opts.customDuration ?? this.options.duration) * 1000;
    const rows = await this.orm.em.getConnection().execute<Row[]>(UPSERT, [this.key(k), points, expires, now, now]);
    const res = this.result(rows[0]);
    if (res.consumedPoints > this.options.points) throw res;
    return res;
  }

  /** Gives points back (never below zero). */
  async reward(k: string, points = 1): Promise<void> {
    await this.orm.em
      .getConnection()
      .execute('update rate_limit set points = case when points > ? then points - ? else 0 end where key = ?', [
        points,
        points,
        this.key(k),
      ]);
  }

  /** The key's live count, or null when it has none. */
  async get(k: string): Promise<RateLimiterRes | null> {
    const rows = await this.orm.em
      .getConnection()
      .execute<Row[]>('select points, expires_at_ms from rate_limit where key = ? and expires_at_ms > ?', [this.key(k), Date.now()]);
    return rows.length ? this.result(rows[0]) : null;
  }

  /** Sets the key's count outright for `durationS` seconds (used to remember a usual address). */
  async set(k: string, points: number, durationS: number): Promise<void> {
    const expires = Date.now() + durationS * 1000;
    await this.orm.em
      .getConnection()
      .execute(
        'insert into rate_limit (key, points, expires_at_ms) values (?, ?, ?) on conflict (key) do update set points = excluded.points, expires_at_ms = excluded.expires_at_ms',
        [this.key(k), points, expires],
      );
  }

  async delete(k: string): Promise<void> {
    await this.orm.em.getConnection().execute('delete from rate_limit where key = ?', [this.key(k)]);
  }
}

/** Deletes counters whose window ended before `beforeMs` (the sign-in limiter calls it now and then). */
export async function clearExpiredCounters(orm: Orm, beforeMs = Date.now()): Promise<void> {
  await orm.em.getConnection().execute('delete from rate_limit where expires_at_ms < ?', [beforeMs]);
}
