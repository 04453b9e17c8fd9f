import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../server/db/seed-demo';
import { recordAudit } from '../../server/services/audit.service';
import { createTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;

beforeAll(async () => {
  t = await createTestApp();
});

afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

type Event = { action: string; userId: string | null; actor: string | null; target: string | null; detail: Record<string, unknown> | null; createdAt: string };

async function audit(query = ''): Promise<Event[]> {
  const res = await t.agents.owner.get(`/api/audit${query}`);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body.events;
}

describe('what is recorded', () => {
  it('when the demo people sign in (test set-up), then a session.signed_in row exists for each', async () => {
    const events = await audit('?action=session.signed_in');
    const who = new Set(events.map((e) => e.userId));
    for (const role of ['owner', 'engineer', 'drafter', 'manager'] as const) expect(who).toContain(t.seed.userIds[role]);
    expect(events[0].actor).toMatch(/<.+@example\.com>$/);
  });

  it('when a known account types a wrong password, then session.sign_in_failed is recorded against it; an unknown address records nothing', async () => {
    expect((await t.signIn('manager@example.com', 'wrong-password')).res.status).toBe(401);
    expect((await t.signIn('stranger@example.com', 'wrong-password')).res.status).toBe(401);
    const failed = await audit('?action=session.sign_in_failed');
    expect(failed).toHaveLength(1);
    expect(failed[0]).toMatchObject({ userId: t.seed.userIds.manager, target: 'manager@example.com' });
    expect(failed[0].detail).toHaveProperty('ip');
  });

  it('when invitations are sent, accepted, resent and revoked, and roles change and people leave, then each is recorded', async () => {
    const owner = t.agents.owner;
    const a = await owner.post('/api/invitations').send({ email: 'audit-a@larkspur.example', role: 'engineer' });
    const b = await owner.post('/api/invitations').send({ email: 'audit-b@larkspur.example', role: 'drafter' });
    await owner.post(`/api/invitations/${b.body.invitation.id}/resend`);
    const resentId = (await owner.get('/api/invitations')).body.invitations.find((i: { email: string }) => i.email === 'audit-b@larkspur.example').id;
    await owner.delete(`/api/invitations/${resentId}`);
    const mail = await t.ctx.db.models.OutboxMessage.findOne({ where: { toAddress: 'audit-a@larkspur.example' } });
    const token = mail!.getDataValue('textBody').match(/\/invitations\/([a-z0-9]+)/)![1];
    const joined = await t.anonymous().post(`/api/invitations/${token}/accept`).send({ name: 'Audra Penn', password: 'audit-long-password' });
    const newId = joined.body.user.id;
    await owner.patch(`/api/team/${newId}`).send({ role: 'manager' });
    await owner.delete(`/api/team/${newId}`);

    const invitation = await audit('?action=invitation');
    expect(invitation.map((e) => `${e.action} ${e.target}`).reverse()).toEqual([
      'invitation.sent audit-a@larkspur.example',
      'invitation.sent audit-b@larkspur.example',
      'invitation.resent audit-b@larkspur.example',
      'invitation.revoked audit-b@larkspur.example',
      'invitation.accepted audit-a@larkspur.example',
    ]);
    expect(invitation[0]).toMatchObject({ userId: newId, detail: { role: 'engineer', invitationId: a.body.invitation.id } });

    const team = await audit('?action=team');
    expect(team.map((e) => [e.action, e.target, e.detail?.from ?? e.detail?.role]).reverse()).toEqual([
      ['team.role_changed', 'audit-a@larkspur.example', 'engineer'],
      ['team.member_removed', 'audit-a@larkspur.example', 'manager'],
    ]);
    expect(team[0].userId).toBe(t.seed.userIds.owner);
  });

  it('when a password is reset, then the request and the reset are recorded', async () => {
    await t.anonymous().post('/api/password-resets').send({ email: 'drafter@example.com' });
    const mail = await t.ctx.db.models.OutboxMessage.findOne({ where: { toAddress: 'drafter@example.com' } });
    const token = mail!.getDataValue('textBody').match(/\/password-reset\/([a-z0-9]+)/)![1];
    expect((await t.anonymous().post(`/api/password-resets/${token}`).send({ password: DEMO_PASSWORD })).status).toBe(200);
    const events = await audit('?action=password');
    expect(events.map((e) => e.action)).toEqual(['password.reset', 'password.reset_requested']);
    expect(events.every((e) => e.userId === t.seed.userIds.drafter)).toBe(true);
    expect(events[0].detail).toEqual({ sessionsEnded: true });
  });
});

describe('GET /api/audit filters', () => {
  it('when filtered by person, then only that person’s events come back', async () => {
    const events = await audit(`?userId=${t.seed.userIds.manager}`);
    expect(events.length).toBeGreaterThanOrEqual(2);
    expect(events.every((e) => e.userId === t.seed.userIds.manager)).toBe(true);
  });

  it('when filtered by a time window and a limit, then only events inside it, at most limit, newest first', async () => {
    const { AuditEvent } = t.ctx.db.models;
    const firmId = t.seed.firmId!;
    for (const day of ['2024-03-01T10:00:00Z', '2024-03-02T10:00:00Z', '2024-03-03T10:00:00Z']) {
      await AuditEvent.create({ firmId, action: 'design.run', target: `Run on ${day}`, createdAt: new Date(day) });
    }
    const window = await audit('?from=2024-03-02&to=2024-03-03&action=design.run');
    expect(window.map((e) => e.target)).toEqual(['Run on 2024-03-03T10:00:00Z', 'Run on 2024-03-02T10:00:00Z']);
    // Bounded by "to": the demo seed's own design runs (recorded today) are newer.
    const limited = await audit('?action=design&to=2024-12-31&limit=1');
    expect(limited.map((e) => e.target)).toEqual(['Run on 2024-03-03T10:00:00Z']);
  });

  it('when a filter is malformed, then 400 names it', async () => {
    const res = await t.agents.owner.get('/api/audit?from=yesterday&limit=0&userId=7');
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['from', 'limit', 'userId']);
  });

  it("when another firm's owner reads the log, then none of this firm's events are there", async () => {
    const res = await t.otherOwner.get('/api/audit');
    expect(res.status).toBe(200);
    expect(res.body.events.every((e: { firmId: string }) => e.firmId === t.otherFirmId)).toBe(true);
  });

  it.each(['engineer', 'drafter', 'manager'] as const)('when a %s asks for the log, then 403', async (role) => {
    // Fresh sessions: the drafter's earlier ones ended with the password reset above.
    expect((await (await t.freshAgent(role)).get('/api/audit')).status).toBe(403);
  });
});

describe('recordAudit for other features', () => {
  it('when a feature records an event with detail, then it is stored and listed as given', async () => {
    const view = await recordAudit(t.ctx, {
      firmId: t.seed.firmId!,
      userId: t.seed.userIds.manager,
      action: 'scheme.status_changed',
      target: 'Scheme B',
      detail: { from: 'draft', to: 'in_review' },
    });
    expect(view).toMatchObject({ action: 'scheme.status_changed', actor: 'Dominic Hale <manager@example.com>' });
    const [listed] = await audit('?action=scheme.status_changed');
    expect(listed).toMatchObject({ target: 'Scheme B', detail: { from: 'draft', to: 'in_review' } });
  });
});
