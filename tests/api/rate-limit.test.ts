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

/** The token in the newest outbox mail to email (a reset or invitation link). */
async function tokenMailedTo(app: TestApp, email: string, kind: 'password-reset' | 'invitations'): Promise<string> {
  const mail = await app.ctx.db.models.OutboxMessage.findOne({ where: { toAddress: email }, order: [['sentAt', 'DESC']] });
  const m = mail?.getDataValue('textBody').match(new RegExp(`/${kind}/([a-z0-9]+)`));
  if (!m) throw new Error(`no ${kind} link mailed to ${email}`);
  return m[1];
}

async function waitForMail(app: TestApp, email: string, kind: 'password-reset' | 'invitations'): Promise<string> {
  for (let i = 0; i < 50; i++) {
    try {
      return await tokenMailedTo(app, email, kind);
    } catch {
      await new Promise((r) => setTimeout(r, 50));
    }
  }
  return tokenMailedTo(app, email, kind);
}

describe('one-time link rate limits (password reset and invitation acceptance)', () => {
  it('when one address asks for more than 30 reset links in a minute (with sign-ins), then the next request is 429 and no mail is sent', async () => {
    t = await createTestApp();
    // createTestApp already made 5 sign-in attempts from 127.0.0.1; requests share that ceiling.
    const allowed = await Promise.all(
      Array.from({ length: 25 }, (_, i) => t!.anonymous().post('/api/password-resets').send({ email: `nobody-${i}@example.com` })),
    );
    expect(allowed.map((r) => r.status)).toEqual(Array(25).fill(202));
    const refused = await t.anonymous().post('/api/password-resets').send({ email: 'drafter@example.com' });
    expect(refused.status).toBe(429);
    expect(refused.body.error.code).toBe('rate_limited');
    expect(Number(refused.headers['retry-after'])).toBeGreaterThanOrEqual(1);
    expect(await t.ctx.db.models.OutboxMessage.count({ where: { toAddress: 'drafter@example.com' } })).toBe(0);
  });

  it('when one address tries 30 reset links in a minute, then the 31st is 429 even with a valid link, and the password is unchanged', async () => {
    t = await createTestApp();
    expect((await t.anonymous().post('/api/password-resets').send({ email: 'drafter@example.com' })).status).toBe(202);
    const token = await waitForMail(t, 'drafter@example.com', 'password-reset');
    for (let i = 1; i <= 30; i++) {
      // Guessed links: each is a 404 and each counts.
      const res = i % 2 ? await t.anonymous().get(`/api/password-resets/${'a'.repeat(40)}${i}`) : await t.anonymous().post(`/api/password-resets/${'b'.repeat(40)}${i}`).send({ password: 'a-new-long-password' });
      expect(res.status, `attempt ${i}`).toBe(404);
    }
    const refused = await t.anonymous().post(`/api/password-resets/${token}`).send({ password: 'a-new-long-password' });
    expect(refused.status).toBe(429);
    expect(refused.body.error.code).toBe('rate_limited');
    const retryAfter = Number(refused.headers['retry-after']);
    expect(retryAfter).toBeGreaterThanOrEqual(1);
    expect(retryAfter).toBeLessThanOrEqual(60);
    // The old password still signs in; the link is still pending.
    expect((await t.signIn('drafter@example.com', DEMO_PASSWORD)).res.status).toBe(200);
    expect(await t.ctx.db.models.PasswordReset.count({ where: { status: 'pending' } })).toBe(1);
  });

  it('when one address tries 30 invitation links in a minute, then accepting a valid one is 429 and no account is made; sign-in is not blocked', async () => {
    t = await createTestApp();
    expect((await t.agents.owner.post('/api/invitations').send({ email: 'new.hire@example.com', role: 'drafter' })).status).toBe(201);
    const token = await waitForMail(t, 'new.hire@example.com', 'invitations');
    for (let i = 1; i <= 30; i++) {
      const res = i % 2 ? await t.anonymous().get(`/api/invitations/${'c'.repeat(40)}${i}`) : await t.anonymous().post(`/api/invitations/${'d'.repeat(40)}${i}/accept`).send({ name: 'Guess Work', password: 'a-new-long-password' });
      expect(res.status, `attempt ${i}`).toBe(404);
    }
    const refused = await t.anonymous().post(`/api/invitations/${token}/accept`).send({ name: 'New Hire', password: 'a-new-long-password' });
    expect(refused.status).toBe(429);
    expect(refused.body.error.code).toBe('rate_limited');
    expect(Number(refused.headers['retry-after'])).toBeLessThanOrEqual(60);
    expect(await t.ctx.db.models.User.count({ where: { email: 'new.hire@example.com' } })).toBe(0);
    // A separate ceiling from sign-in: the same address still signs in.
    expect((await t.signIn('manager@example.com', DEMO_PASSWORD)).res.status).toBe(200);
  });

  it('when RATE_LIMIT_RELAXED is on, then 40 link uses from one address are all answered', async () => {
    t = await createTestApp({ rateLimitRelaxed: true });
    for (let i = 1; i <= 40; i++) {
      expect((await t.anonymous().get(`/api/invitations/${'e'.repeat(40)}${i}`)).status, `attempt ${i}`).toBe(404);
    }
  });
});
