import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AppError } from '../../server/errors/app-error';
import { createTestApp, type TestApp } from './helpers/test-app';

describe('with no SMTP server (local outbox)', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => {
    expect(t.serverErrors).toEqual([]);
    await t.close();
  });

  it('when an owner reads the outbox, then each message has to, subject, text, html and sentAt, newest first', async () => {
    await t.agents.owner.post('/api/invitations').send({ email: 'first@outbox.example', role: 'drafter' });
    await new Promise((r) => setTimeout(r, 5));
    await t.agents.owner.post('/api/invitations').send({ email: 'second@outbox.example', role: 'manager' });
    const res = await t.agents.owner.get('/api/outbox');
    expect(res.status).toBe(200);
    const [newest, older] = res.body.messages;
    expect(newest).toMatchObject({ to: 'second@outbox.example', from: 'Baywright <no-reply@baywright.invalid>' });
    expect(older.to).toBe('first@outbox.example');
    expect(newest.subject).toMatch(/invited you to Larkspur Structural Partners/);
    expect(newest.text).toMatch(/as a manager/);
    expect(newest.html).toMatch(/<a href="http:\/\/127\.0\.0\.1:\d+\/invitations\/[a-z0-9]{52}"/);
    expect(Date.parse(newest.sentAt)).toBeGreaterThanOrEqual(Date.parse(older.sentAt));
  });

  it.each(['engineer', 'drafter', 'manager'] as const)('when a %s asks for the outbox, then 403', async (role) => {
    const res = await t.agents[role].get('/api/outbox');
    expect(res.status).toBe(403);
  });

  it("when another firm's owner reads the outbox, then none of this firm's messages (and links) are there", async () => {
    const res = await t.otherOwner.get('/api/outbox');
    expect(res.status).toBe(200);
    expect(res.body.messages.map((m: { to: string }) => m.to)).not.toContain('first@outbox.example');
    // A reset for this firm's engineer stays out of the other firm's outbox too.
    await t.anonymous().post('/api/password-resets').send({ email: 'engineer@example.com' });
    const again = await t.otherOwner.get('/api/outbox');
    expect(again.body.messages.map((m: { to: string }) => m.to)).not.toContain('engineer@example.com');
    const own = await t.agents.owner.get('/api/outbox');
    expect(own.body.messages.map((m: { to: string }) => m.to)).toContain('engineer@example.com');
  });
});

describe('with an SMTP server configured', () => {
  let t: TestApp;
  beforeAll(async () => {
    // Port 9 on loopback refuses connections, standing in for an unreachable server.
    t = await createTestApp({
      smtp: { host: '127.0.0.1', port: 9, from: 'noreply@larkspur.example' },
      appUrl: 'https://baywright.larkspur.example',
    });
  });
  afterAll(async () => {
    await t.close();
  });

  it('when an owner asks for the outbox, then 404 (mail goes out by SMTP, nothing is kept)', async () => {
    const res = await t.agents.owner.get('/api/outbox');
    expect(res.status).toBe(404);
    expect(res.body.error.message).toMatch(/only kept when no mail server is configured/);
  });

  it('when the SMTP server cannot be reached, then inviting answers 502 mail_failed, keeps the invitation and writes no outbox row', async () => {
    const res = await t.agents.owner.post('/api/invitations').send({ email: 'smtp-down@outbox.example', role: 'engineer' });
    expect(res.status).toBe(502);
    expect(res.body.error.code).toBe('mail_failed');
    expect(res.body.error.message).toMatch(/use Resend/);
    expect(await t.ctx.db.models.Invitation.count({ where: { email: 'smtp-down@outbox.example', status: 'pending' } })).toBe(1);
    expect(await t.ctx.db.models.OutboxMessage.count()).toBe(0);
    expect(t.serverErrors).toHaveLength(1);
    expect((t.serverErrors[0] as AppError).code).toBe('mail_failed');
  });

  it('when a reset is asked for while SMTP fails, then the answer is still the same 202', async () => {
    const errors: unknown[] = [];
    const original = console.error;
    console.error = (err: unknown) => errors.push(err);
    try {
      const known = await t.anonymous().post('/api/password-resets').send({ email: 'owner@example.com' });
      const unknown = await t.anonymous().post('/api/password-resets').send({ email: 'ghost@example.com' });
      expect(known.status).toBe(202);
      expect(known.text).toBe(unknown.text);
      await new Promise((r) => setTimeout(r, 300));
    } finally {
      console.error = original;
    }
    expect(errors.length).toBe(1);
  });
});
