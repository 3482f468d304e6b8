import { RateLimiterMemory, RateLimiterRes } from 'rate-limiter-flexible';

export interface SignInLimits {
  /** Failed attempts allowed per account (e-mail) in the window. */
  perAccount: number;
  /** Failed attempts allowed per client address in the window. */
  perAddress: number;
  windowS: number;
}

export const DEFAULT_SIGN_IN_LIMITS: SignInLimits = { perAccount: 5, perAddress: 20, windowS: 15 * 60 };

/**
 * Counts failed sign-ins per account and per client address. Both must be under their limit for
 * an attempt to be checked at all, so a guesser is slowed whether they spray one password over many
 * accounts or many passwords at one account. A success clears the account's count.
 */
export class SignInLimiter {
  private readonly byAccount: RateLimiterMemory;
  private readonly byAddress: RateLimiterMemory;

  constructor(readonly limits: SignInLimits = DEFAULT_SIGN_IN_LIMITS) {
    this.byAccount = new RateLimiterMemory({ keyPrefix: 'acct', points: limits.perAccount, duration: limits.windowS });
    this.byAddress = new RateLimiterMemory({ keyPrefix: 'addr', points: limits.perAddress, duration: limits.windowS });
  }

  /** Seconds to wait before another attempt is allowed, or 0 when one may be made now. */
  async waitSeconds(email: string, address: string): Promise<number> {
    const [acct, addr] = await Promise.all([this.byAccount.get(email), this.byAddress.get(address)]);
    let wait = 0;
    if (acct && acct.consumedPoints >= this.limits.perAccount) wait = Math.max(wait, acct.msBeforeNext);
    if (addr && addr.consumedPoints >= this.limits.perAddress) wait = Math.max(wait, addr.msBeforeNext);
    return Math.ceil(wait / 1000);
  }

  async recordFailure(email: string, address: string): Promise<void> {
    await Promise.all([swallowLimit(this.byAccount.penalty(email, 1)), swallowLimit(this.byAddress.penalty(address, 1))]);
  }

  async recordSuccess(email: string): Promise<void> {
    await this.byAccount.delete(email);
  }
}

async function swallowLimit<T>(p: Promise<T>): Promise<void> {
  try {
    await p;
  } catch (e) {
    if (!(e instanceof RateLimiterRes)) throw e;
  }
}
