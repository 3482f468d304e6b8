import { RateLimiterMemory, RateLimiterRes } from 'rate-limiter-flexible';

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

/**
 * Sign-in limits that protect an account without letting a stranger lock its owner out.
 *
 * Every limit is *consumed before* the password is checked (rate-limiter-flexible's consume-first
 * pattern): the memory limiter counts synchronously, so 100 simultaneous attempts cannot all read
 * "under the limit" before any of them counts. A success gives the points back.
 *
 * - account + address pair: tight (5 per 15 minutes). A guesser at one address is stopped quickly.
 * - address: looser (50 per 15 minutes over all accounts), against spraying one password widely.
 * - account: loose, never a lock. After `accountFreeAttempts` attempts from unusual addresses, one
 *   attempt is let through per delay, and the delay doubles (2 s, 4 s, … up to 5 minutes). An address
 *   the account has signed in from before skips this gate, so the real user at their usual
 *   address still gets in while someone elsewhere hammers the account.
 */
export class SignInLimiter {
  private readonly byPair: RateLimiterMemory;
  private readonly byAddress: RateLimiterMemory;
  private readonly accountAttempts: RateLimiterMemory;
  private readonly accountGate: RateLimiterMemory;
  /** account|address → when it stops being "usual". A Map: the memory limiter's timers overflow past 24.8 days. */
  private readonly knownPairs = new Map<string, number>();

  constructor(readonly limits: SignInLimits = DEFAULT_SIGN_IN_LIMITS) {
    this.byPair = new RateLimiterMemory({ keyPrefix: 'pair', points: limits.perPair, duration: limits.windowS });
    this.byAddress = new RateLimiterMemory({ keyPrefix: 'addr', points: limits.perAddress, duration: limits.windowS });
    // Counts attempts; never refuses by itself (the gate below does the slowing).
    this.accountAttempts = new RateLimiterMemory({ keyPrefix: 'acct', points: Number.MAX_SAFE_INTEGER, duration: limits.windowS });
    this.accountGate = new RateLimiterMemory({ keyPrefix: 'gate', points: 1, duration: 1 });
  }

  /** Marks an address as usual for an account; the oldest entries go first past 100,000 pairs. */
  private remember(pairKey: string): void {
    this.knownPairs.delete(pairKey);
    this.knownPairs.set(pairKey, Date.now() + this.limits.knownAddressDays * 24 * 60 * 60 * 1000);
    if (this.knownPairs.size > 100_000) {
      const oldest = this.knownPairs.keys().next().value;
      if (oldest !== undefined) this.knownPairs.delete(oldest);
    }
  }

  /** The delay before the next attempt on an account that has had `attempts` from unusual addresses. */
  delayS(attempts: number): number {
    const over = attempts - this.limits.accountFreeAttempts;
    if (over <= 0) return 0;
    return Math.min(2 ** Math.min(over, 30), this.limits.accountMaxDelayS);
  }

  /**
   * Reserves one attempt for `email` from `address` before the password is checked. On `ok`, call
   * `release(success)` once the answer is known.
   */
  async admit(email: string, address: string): Promise<Admission> {
    const pairKey = `${email}|${address}`;
    const knownUntil = this.knownPairs.get(pairKey);
    const known = knownUntil !== undefined && knownUntil > Date.now();
    const consumed: Array<[RateLimiterMemory, string]> = [];
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
        this.remember(pairKey);
      },
    };
  }
}
