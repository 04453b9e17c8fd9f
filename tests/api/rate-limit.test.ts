import { afterEach, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../server/db/seed-demo';
import { createTestApp, type TestApp } from './helpers/test-app';

let t: TestApp | undefined;
afterEach(async () => {
  expect(t?.serverErrors).toEqual([]);
  await t?.close();
  t = undefined;
});

describe('sign-in rate limits', () => {
  it('when an account has 5 failures, then the 6th attempt is 429 with Retry-After, even with the right password', async () => {
    t = await createTestApp();
    for (let i = 1; i <= 5; i++) {
      const { res } = await t.signIn('engineer@example.com', `wrong-${i}`);
      expect(res.status, `attempt ${i}`).toBe(401);
    }
    const { res } = await t.signIn('engineer@example.com', DEMO_PASSWORD);
    expect(res.status).toBe(429);
    expect(res.body.error.code).toBe('rate_limited');
    const retryAfter = Number(res.headers['retry-after']);
    expect(retryAfter).toBeGreaterThan(14 * 60); // 15-minute window
    expect(retryAfter).toBeLessThanOrEqual(15 * 60);

    // Another account from the same address is not locked.
    const other = await t.signIn('drafter@example.com', DEMO_PASSWORD);
    expect(other.res.status).toBe(200);
  });

  it('when a sign-in succeeds, then earlier failures for that account are forgotten', async () => {
    t = await createTestApp();
    for (let i = 1; i <= 4; i++) await t.signIn('manager@example.com', 'wrong-password');
    expect((await t.signIn('manager@example.com', DEMO_PASSWORD)).res.status).toBe(200);
    for (let i = 1; i <= 4; i++) {
      expect((await t.signIn('manager@example.com', 'wrong-password')).res.status).toBe(401);
    }
  });

  it('when one address makes more than 30 attempts in a minute, then the next is 429', async () => {
    t = await createTestApp();
    // createTestApp already made 5 attempts (4 sign-ins, 1 sign-up) from 127.0.0.1.
    for (let i = 6; i <= 30; i++) {
      const { res } = await t.signIn(`probe-${i}@example.com`, 'wrong-password');
      expect(res.status, `attempt ${i}`).toBe(401);
    }
    const { res } = await t.signIn('owner@example.com', DEMO_PASSWORD);
    expect(res.status).toBe(429);
    expect(res.body.error.code).toBe('rate_limited');
    expect(Number(res.headers['retry-after'])).toBeGreaterThanOrEqual(1);
    expect(Number(res.headers['retry-after'])).toBeLessThanOrEqual(60);
  });

  it('when RATE_LIMIT_RELAXED is on, then the per-address ceiling is lifted but the per-account one holds', async () => {
    t = await createTestApp({ rateLimitRelaxed: true });
    for (let i = 6; i <= 35; i++) {
      const { res } = await t.signIn(`probe-${i}@example.com`, 'wrong-password');
      expect(res.status, `attempt ${i}`).toBe(401);
    }
    for (let i = 1; i <= 5; i++) await t.signIn('owner@example.com', 'wrong-password');
    expect((await t.signIn('owner@example.com', DEMO_PASSWORD)).res.status).toBe(429);
  });
});
