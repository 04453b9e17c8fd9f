import { describe, expect, it } from 'vitest';
import { createSignInLimiters, RateLimiter } from '../../../server/auth/rate-limiter';

describe('RateLimiter', () => {
  it('when the limit is reached, then further events are refused until the window ends', () => {
    let nowMs = 1_000_000;
    const limiter = new RateLimiter(3, 60_000, () => nowMs);
    expect([1, 2, 3].map(() => limiter.consume('k').allowed)).toEqual([true, true, true]);
    const refused = limiter.consume('k');
    expect(refused).toEqual({ allowed: false, retryAfterSeconds: 60 });
    nowMs += 59_001;
    expect(limiter.check('k')).toEqual({ allowed: false, retryAfterSeconds: 1 });
    nowMs += 1_000;
    expect(limiter.consume('k').allowed).toBe(true);
  });

  it('when keys differ, then they are counted apart', () => {
    const limiter = new RateLimiter(1, 60_000, () => 0);
    expect(limiter.consume('a').allowed).toBe(true);
    expect(limiter.consume('b').allowed).toBe(true);
    expect(limiter.consume('a').allowed).toBe(false);
  });

  it('when a key is reset, then its count starts again', () => {
    const limiter = new RateLimiter(2, 60_000, () => 0);
    limiter.hit('a');
    limiter.hit('a');
    expect(limiter.check('a').allowed).toBe(false);
    limiter.reset('a');
    expect(limiter.check('a').allowed).toBe(true);
  });

  it('when relaxed, then only the per-IP ceiling rises (30 → 1000); per-account stays 5 per 15 min', () => {
    let nowMs = 0;
    const strict = createSignInLimiters({ relaxed: false }, () => nowMs);
    const relaxed = createSignInLimiters({ relaxed: true }, () => nowMs);
    for (let i = 0; i < 30; i++) {
      strict.perIpAttempts.hit('ip');
      relaxed.perIpAttempts.hit('ip');
    }
    expect(strict.perIpAttempts.check('ip').allowed).toBe(false);
    expect(relaxed.perIpAttempts.check('ip').allowed).toBe(true);
    for (let i = 0; i < 5; i++) relaxed.perAccountFailures.hit('a@example.com');
    expect(relaxed.perAccountFailures.check('a@example.com')).toEqual({
      allowed: false,
      retryAfterSeconds: 900,
    });
    nowMs = 15 * 60 * 1000;
    expect(relaxed.perAccountFailures.check('a@example.com').allowed).toBe(true);
  });
});
