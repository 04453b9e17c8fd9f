import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../server/db/seed-demo';
import { RESET_REQUEST_RESPONSE_MS } from '../../server/services/password-reset.service';
import { createTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;

beforeAll(async () => {
  t = await createTestApp();
});

afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

async function mailsTo(email: string) {
  const rows = await t.ctx.db.models.OutboxMessage.findAll({ where: { toAddress: email }, order: [['sentAt', 'DESC']] });
  return rows.map((r) => r.get({ plain: true }));
}

function tokenIn(text: string): string {
  const m = text.match(/\/password-reset\/([a-z0-9]+)/);
  if (!m) throw new Error(`no reset link in: ${text}`);
  return m[1];
}

async function requestReset(email: string) {
  const started = performance.now();
  const res = await t.anonymous().post('/api/password-resets').send({ email });
  return { res, ms: performance.now() - started };
}

/** A person of the demo firm with their own password, so demo accounts stay as they are. */
async function newPerson(email: string, password = 'original-password-1') {
  const invite = await t.agents.owner.post('/api/invitations').send({ email, role: 'engineer' });
  expect(invite.status).toBe(201);
  const [mail] = await mailsTo(email);
  const token = mail.textBody.match(/\/invitations\/([a-z0-9]+)/)![1];
  const accept = await t.anonymous().post(`/api/invitations/${token}/accept`).send({ name: 'Nell Brightwater', password });
  expect(accept.status).toBe(201);
  return accept.body.user.id as string;
}

describe('POST /api/password-resets', () => {
  it('when the address has an account or not, then the status and body are identical and both answer after the same floor', async () => {
    const known = await requestReset('drafter@example.com');
    const unknown = await requestReset('nobody-at-all@example.com');
    // A second pair (within the 3 mails per address): on a loaded machine one answer can be
    // late for reasons of its own; a real difference between the two paths shows in both pairs.
    const knownAgain = await requestReset('drafter@example.com');
    const unknownAgain = await requestReset('nobody-at-all@example.com');
    expect(known.res.status).toBe(202);
    expect(unknown.res.status).toBe(202);
    expect(known.res.body).toEqual(unknown.res.body);
    expect(known.res.text).toBe(unknown.res.text);
    expect(known.res.body.message).toMatch(/If an account uses this address/);
    // Both wait the same fixed time (timers may fire a millisecond early).
    expect(known.ms).toBeGreaterThanOrEqual(RESET_REQUEST_RESPONSE_MS - 5);
    expect(unknown.ms).toBeGreaterThanOrEqual(RESET_REQUEST_RESPONSE_MS - 5);
    expect(knownAgain.res.text).toBe(unknownAgain.res.text);
    expect(Math.min(Math.abs(known.ms - unknown.ms), Math.abs(knownAgain.ms - unknownAgain.ms))).toBeLessThan(150);

    expect(await mailsTo('nobody-at-all@example.com')).toHaveLength(0);
    const [mail] = await mailsTo('drafter@example.com');
    expect(mail.subject).toBe('Choose a new Baywright password');
    expect(mail.textBody).toContain('Hello Priya Calloway');
    expect(mail.textBody).toContain(`${t.origin}/password-reset/`);
    expect(tokenIn(mail.textBody).length).toBeGreaterThanOrEqual(32);
    expect(mail.firmId).toBe(t.seed.firmId);
  });

  it('when the email is not an address, then 400 on the email field', async () => {
    const res = await t.anonymous().post('/api/password-resets').send({ email: 'nope' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.email).toBe('Enter a valid email address');
  });
});

describe('choosing the new password', () => {
  it('when the link is used, then the password changes, every session of the person ends, and reuse answers 410 reset_used', async () => {
    const email = 'nell@larkspur.example';
    await newPerson(email);
    const { agent: laptop } = await t.signIn(email, 'original-password-1');
    const { agent: phone } = await t.signIn(email, 'original-password-1');
    expect((await laptop.get('/api/session')).status).toBe(200);

    await requestReset(email);
    const token = tokenIn((await mailsTo(email)).find((m) => m.subject.includes('password'))!.textBody);
    const check = await t.anonymous().get(`/api/password-resets/${token}`);
    expect(check.status).toBe(200);
    expect(check.body.reset.email).toBe(email);

    const done = await t.anonymous().post(`/api/password-resets/${token}`).send({ password: 'brand-new-password-2' });
    expect(done.status, JSON.stringify(done.body)).toBe(200);
    expect(done.body.email).toBe(email);

    const user = await t.ctx.db.models.User.findOne({ where: { email } });
    expect(await t.ctx.db.models.Session.count({ where: { userId: user!.getDataValue('id') } })).toBe(0);
    expect((await laptop.get('/api/session')).status).toBe(401);
    expect((await phone.get('/api/session')).status).toBe(401);
    expect((await t.signIn(email, 'original-password-1')).res.status).toBe(401);
    expect((await t.signIn(email, 'brand-new-password-2')).res.status).toBe(200);

    const again = await t.anonymous().post(`/api/password-resets/${token}`).send({ password: 'third-long-password' });
    expect(again.status).toBe(410);
    expect(again.body.error.code).toBe('reset_used');
    expect((await t.signIn(email, 'brand-new-password-2')).res.status).toBe(200);
  });

  it('when the link is older than an hour, then 410 reset_expired and the password stays', async () => {
    const email = 'marlo@larkspur.example';
    const userId = await newPerson(email);
    await requestReset(email);
    const token = tokenIn((await mailsTo(email)).find((m) => m.subject.includes('password'))!.textBody);
    const row = await t.ctx.db.models.PasswordReset.findOne({ where: { userId, status: 'pending' } });
    const issuedMinutes = (new Date(row!.getDataValue('expiresAt')).getTime() - Date.now()) / 60_000;
    expect(issuedMinutes).toBeGreaterThan(59.9);
    expect(issuedMinutes).toBeLessThanOrEqual(60);
    await row!.update({ expiresAt: new Date(Date.now() - 1) });

    const res = await t.anonymous().post(`/api/password-resets/${token}`).send({ password: 'too-late-password' });
    expect(res.status).toBe(410);
    expect(res.body.error).toMatchObject({ code: 'reset_expired' });
    expect(res.body.error.message).toMatch(/one hour/);
    expect((await t.signIn(email, 'original-password-1')).res.status).toBe(200);
  });

  it('when a newer link is asked for, then the older one answers 410 reset_superseded', async () => {
    const email = 'ivo@larkspur.example';
    await newPerson(email);
    await requestReset(email);
    const first = tokenIn((await mailsTo(email)).find((m) => m.subject.includes('password'))!.textBody);
    await new Promise((r) => setTimeout(r, 5));
    await requestReset(email);
    const second = tokenIn((await mailsTo(email)).find((m) => m.subject.includes('password'))!.textBody);
    expect(second).not.toBe(first);
    const old = await t.anonymous().post(`/api/password-resets/${first}`).send({ password: 'some-long-password' });
    expect(old.status).toBe(410);
    expect(old.body.error.code).toBe('reset_superseded');
    const ok = await t.anonymous().post(`/api/password-resets/${second}`).send({ password: 'some-long-password' });
    expect(ok.status).toBe(200);
  });

  it('when the token is unknown or the password short, then 404 / 400 with the field named', async () => {
    const unknown = await t.anonymous().post(`/api/password-resets/${'b'.repeat(52)}`).send({ password: 'long-enough-password' });
    expect(unknown.status).toBe(404);
    expect(unknown.body.error.code).toBe('reset_not_found');
    const short = await t.anonymous().post(`/api/password-resets/${'b'.repeat(52)}`).send({ password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields.password).toBe('Password must be at least 10 characters');
  });

  it('when the demo owner signs in afterwards, then untouched accounts still work', async () => {
    expect((await t.signIn('owner@example.com', DEMO_PASSWORD)).res.status).toBe(200);
  });
});
