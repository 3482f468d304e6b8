import { RateLimiterRes } from 'rate-limiter-flexible';
import type { Orm } from '../../db';
import { clearExpiredCounters, DbRateLimiter } from '../limits/db-rate-limiter';

export interface SignInLimits {
  /** Attempts allowed per account and client address together in the window: the tight limit. */
  perPair: number;
  /** Attempts allowed per client address over all accounts in the window (spraying many accounts). */
  perAddress: number;
  /** Attempts on one account from addresses it has not signed in from before, before delays start. */
  accountFreeAttempts: number;
  /** The longest delay between attempts on one account once delays have started. */
  accountMaxDelayS: number;
  windowS: number;
  /** How long an address where the account signed in successfully stays "usual" for it. */
  knownAddressDays: number;
}

export const DEFAULT_SIGN_IN_LIMITS: SignInLimits = {
  perPair: 5,
  perAddress: 50,
  accountFreeAttempts: 10,
  accountMaxDelayS: 5 * 60,
  windowS: 15 * 60,
  knownAddressDays: 30,
};

export type Admission = { ok: true; release(success: boolean): Promise<void> } | { ok: false; retryAfterS: number };

/** The delay before the next attempt on an account that has had `attempts` from unusual addresses. */
export function accountDelayS(attempts: number, limits: Pick<SignInLimits, 'accountFreeAttempts' | 'accountMaxDelayS'>): number {
  const over = attempts - limits.accountFreeAttempts;
  if (over <= 0) return 0;
  return Math.min(2 ** Math.min(over, 30), limits.accountMaxDelayS);
}

/**
 * Sign-in limits that protect an account without letting a stranger lock its owner out.
 *
 * Every count lives in the database (`rate_limit`, through `DbRateLimiter`), so all instances
 * behind a proxy share them, and every limit is *consumed before* the password is checked: each
 * count is one atomic upsert that answers the new total, so 100 simultaneous attempts cannot all
 * read "under the limit" before any of them counts. A success gives the points back.
 *
 * - account + address pair: tight (5 per 15 minutes). A guesser at one address is stopped quickly.
 * - address: looser (50 per 15 minutes over all accounts), against spraying one password widely.
 * - account: loose, never a lock. After `accountFreeAttempts` attempts from unusual addresses, one
 *   attempt is let through per delay, and the delay doubles (2 s, 4 s, … up to 5 minutes). An address
 *   the account has signed in from before skips this gate, so the real user at their usual
 *   address still gets in while someone elsewhere hammers the account.
 */
export class SignInLimiter {
  private readonly byPair: DbRateLimiter;
  private readonly byAddress: DbRateLimiter;
  private readonly accountAttempts: DbRateLimiter;
  private readonly accountGate: DbRateLimiter;
  /** account|address pairs that signed in: "usual" for `knownAddressDays`. */
  private readonly knownPairs: DbRateLimiter;
  private admitted = 0;

  constructor(
    private readonly orm: Orm,
    readonly limits: SignInLimits = DEFAULT_SIGN_IN_LIMITS,
  ) {
    this.byPair = new DbRateLimiter(orm, { keyPrefix: 'pair', points: limits.perPair, duration: limits.windowS });
    this.byAddress = new DbRateLimiter(orm, { keyPrefix: 'addr', points: limits.perAddress, duration: limits.windowS });
    // Counts attempts; never refuses by itself (the gate below does the slowing).
    this.accountAttempts = new DbRateLimiter(orm, { keyPrefix: 'acct', points: 2 ** 31 - 1, duration: limits.windowS });
    this.accountGate = new DbRateLimiter(orm, { keyPrefix: 'gate', points: 1, duration: 1 });
    this.knownPairs = new DbRateLimiter(orm, { keyPrefix: 'known', points: 1, duration: limits.knownAddressDays * 24 * 60 * 60 });
  }

  /** The delay before the next attempt on an account that has had `attempts` from unusual addresses. */
  delayS(attempts: number): number {
    return accountDelayS(attempts, this.limits);
  }

  /**
   * Reserves one attempt for `email` from `address` before the password is checked. On `ok`, call
   * `release(success)` once the answer is known.
   */
  async admit(email: string, address: string): Promise<Admission> {
    // Now and then, counters whose windows ended are removed (any instance may do it).
    if (++this.admitted % 200 === 0) await clearExpiredCounters(this.orm);
    const pairKey = `${email}|${address}`;
    const known = (await this.knownPairs.get(pairKey)) !== null;
    const consumed: [DbRateLimiter, string][] = [];
    const refuse = async (res: RateLimiterRes): Promise<Admission> => {
      // Attempts that were never checked do not count against the other limits.
      await Promise.all(consumed.map(([l, k]) => l.reward(k, 1)));
      return { ok: false, retryAfterS: Math.max(1, Math.ceil(res.msBeforeNext / 1000)) };
    };
    try {
      await this.byPair.consume(pairKey);
      consumed.push([this.byPair, pairKey]);
      if (!known) {
        await this.byAddress.consume(address);
        consumed.push([this.byAddress, address]);
        const attempts = (await this.accountAttempts.consume(email)).consumedPoints;
        consumed.push([this.accountAttempts, email]);
        const delay = this.delayS(attempts);
        if (delay > 0) await this.accountGate.consume(email, 1, { customDuration: delay });
      }
    } catch (e) {
      if (e instanceof RateLimiterRes) return refuse(e);
      throw e;
    }
    return {
      ok: true,
      release: async (success) => {
        if (!success) return;
        await Promise.all([
          this.byPair.delete(pairKey),
          this.byAddress.reward(address, 1),
          this.accountAttempts.delete(email),
          this.accountGate.delete(email),
        ]);
        await this.knownPairs.set(pairKey, 1, this.limits.knownAddressDays * 24 * 60 * 60);
      },
    };
  }
}
