// Fixed-window counters kept in memory (one process). Enough for one server; a cluster
// would need a shared store.

export interface RateLimitDecision {
  allowed: boolean;
  /** Seconds until the window resets (≥ 1) when not allowed. */
  retryAfterSeconds: number;
}

interface Window {
  count: number;
  resetAtMs: number;
}

export class RateLimiter {
  private readonly windows = new Map<string, Window>();

  constructor(
    private readonly limit: number,
    private readonly windowMs: number,
    private readonly now: () => number = Date.now,
  ) {}

  private current(key: string): Window | undefined {
    const w = this.windows.get(key);
    if (w && w.resetAtMs <= this.now()) {
      this.windows.delete(key);
      return undefined;
    }
    return w;
  }

  /** Whether another event for key is still under the limit (does not count it). */
  check(key: string): RateLimitDecision {
    const w = this.current(key);
    if (w && w.count >= this.limit) {
      return {
        allowed: false,
        retryAfterSeconds: Math.max(1, Math.ceil((w.resetAtMs - this.now()) / 1000)),
      };
    }
    return { allowed: true, retryAfterSeconds: 0 };
  }

  /** Counts one event for key. */
  hit(key: string): void {
    const w = this.current(key);
    if (w) w.count += 1;
    else this.windows.set(key, { count: 1, resetAtMs: this.now() + this.windowMs });
    if (this.windows.size > 10_000) this.sweep();
  }

  /** check then hit: true when the event is allowed and counted. */
  consume(key: string): RateLimitDecision {
    const decision = this.check(key);
    if (decision.allowed) this.hit(key);
    return decision;
  }

  reset(key: string): void {
    this.windows.delete(key);
  }

  private sweep(): void {
    const now = this.now();
    for (const [key, w] of this.windows) if (w.resetAtMs <= now) this.windows.delete(key);
  }
}

export interface SignInLimiters {
  /** Failed sign-ins per account (email): 5 per 15 minutes. */
  perAccountFailures: RateLimiter;
  /** Sign-in and sign-up attempts per client IP: 30 per minute (relaxed for e2e). */
  perIpAttempts: RateLimiter;
  /**
   * Uses of a one-time link per client IP (password reset check and completion, invitation
   * preview and acceptance): 30 per minute, relaxed like sign-in. Completion and acceptance
   * hash a password, so without it one address could keep the server hashing.
   */
  perIpTokenUses: RateLimiter;
}

export const ACCOUNT_FAILURE_LIMIT = 5;
export const ACCOUNT_WINDOW_MS = 15 * 60 * 1000;
export const IP_ATTEMPT_LIMIT = 30;
export const IP_ATTEMPT_LIMIT_RELAXED = 1000;
export const IP_WINDOW_MS = 60 * 1000;

export function createSignInLimiters(
  options: { relaxed: boolean },
  now: () => number = Date.now,
): SignInLimiters {
  return {
    perAccountFailures: new RateLimiter(ACCOUNT_FAILURE_LIMIT, ACCOUNT_WINDOW_MS, now),
    perIpAttempts: new RateLimiter(
      options.relaxed ? IP_ATTEMPT_LIMIT_RELAXED : IP_ATTEMPT_LIMIT,
      IP_WINDOW_MS,
      now,
    ),
    perIpTokenUses: new RateLimiter(
      options.relaxed ? IP_ATTEMPT_LIMIT_RELAXED : IP_ATTEMPT_LIMIT,
      IP_WINDOW_MS,
      now,
    ),
  };
}
