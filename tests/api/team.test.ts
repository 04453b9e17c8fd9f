import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;

beforeAll(async () => {
  t = await createTestApp();
});

afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

describe('GET /api/team', () => {
  it('when an owner lists the team, then the four demo people come back with their roles, owners first', async () => {
    const res = await t.agents.owner.get('/api/team');
    expect(res.status).toBe(200);
    expect(res.body.members.map((m: { email: string; role: string }) => [m.email, m.role])).toEqual([
      ['owner@example.com', 'owner'],
      ['engineer@example.com', 'engineer'],
      ['manager@example.com', 'manager'],
      ['drafter@example.com', 'drafter'],
    ]);
    expect(res.body.members[0]).toMatchObject({ userId: t.seed.userIds.owner, name: 'Imogen Ashdown' });
  });

  it.each(['engineer', 'drafter', 'manager'] as const)('when a %s asks, then 403', async (role) => {
    expect((await t.agents[role].get('/api/team')).status).toBe(403);
  });
});

describe('PATCH /api/team/:userId', () => {
  it('when an owner makes the drafter a manager and back, then the role is stored and takes effect at once', async () => {
    const drafterId = t.seed.userIds.drafter!;
    const res = await t.agents.owner.patch(`/api/team/${drafterId}`).send({ role: 'manager' });
    expect(res.status).toBe(200);
    expect(res.body.member).toMatchObject({ userId: drafterId, role: 'manager' });
    // The drafter's open session now acts as a manager.
    expect((await t.agents.drafter.get('/api/session')).body.role).toBe('manager');
    const back = await t.agents.owner.patch(`/api/team/${drafterId}`).send({ role: 'drafter' });
    expect(back.body.member.role).toBe('drafter');
  });

  it('when the only owner would be demoted, then 409 last_owner and the role stays', async () => {
    const res = await t.agents.owner.patch(`/api/team/${t.seed.userIds.owner}`).send({ role: 'engineer' });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('last_owner');
    expect(res.body.error.message).toMatch(/at least one owner/);
    const m = await t.ctx.db.models.Membership.findOne({ where: { userId: t.seed.userIds.owner } });
    expect(m!.getDataValue('role')).toBe('owner');
  });

  it('when there is a second owner, then the first may step down, and the last one left may not', async () => {
    const engineerId = t.seed.userIds.engineer!;
    expect((await t.agents.owner.patch(`/api/team/${engineerId}`).send({ role: 'owner' })).status).toBe(200);
    expect((await t.agents.owner.patch(`/api/team/${t.seed.userIds.owner}`).send({ role: 'engineer' })).status).toBe(200);
    // The engineer is now the only owner; the former owner is an engineer and is refused.
    const engineerAsOwner = await t.freshAgent('engineer');
    const refused = await engineerAsOwner.patch(`/api/team/${engineerId}`).send({ role: 'drafter' });
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('last_owner');
    expect((await t.agents.owner.get('/api/team')).status).toBe(403);
    // Put things back.
    expect((await engineerAsOwner.patch(`/api/team/${t.seed.userIds.owner}`).send({ role: 'owner' })).status).toBe(200);
    expect((await t.agents.owner.patch(`/api/team/${engineerId}`).send({ role: 'engineer' })).status).toBe(200);
  });

  it('when the role is not one of the four or the id is not a uuid, then 400 names the field', async () => {
    const bad = await t.agents.owner.patch(`/api/team/${t.seed.userIds.drafter}`).send({ role: 'admin' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.role).toMatch(/Role must be one of owner, engineer, drafter, manager/);
    const badId = await t.agents.owner.patch('/api/team/42').send({ role: 'drafter' });
    expect(badId.status).toBe(400);
    expect(badId.body.error.fields.userId).toBe('Must be a valid person id');
  });

  it("when an owner targets another firm's person, then 404", async () => {
    const other = await t.ctx.db.models.User.findOne({ where: { email: 'rosalind@quillon.example' } });
    const res = await t.agents.owner.patch(`/api/team/${other!.getDataValue('id')}`).send({ role: 'drafter' });
    expect(res.status).toBe(404);
  });
});

describe('DELETE /api/team/:userId', () => {
  it('when the owner removes a person, then the membership and their sessions for the firm are gone', async () => {
    const invite = await t.agents.owner.post('/api/invitations').send({ email: 'leaving@larkspur.example', role: 'engineer' });
    expect(invite.status).toBe(201);
    const mail = await t.ctx.db.models.OutboxMessage.findOne({ where: { toAddress: 'leaving@larkspur.example' } });
    const token = mail!.getDataValue('textBody').match(/\/invitations\/([a-z0-9]+)/)![1];
    const member = t.anonymous();
    const accepted = await member.post(`/api/invitations/${token}/accept`).send({ name: 'Leah Marrow', password: 'leaving-long-password' });
    const userId = accepted.body.user.id;
    expect((await member.get('/api/projects')).status).toBe(200);

    const res = await t.agents.owner.delete(`/api/team/${userId}`);
    expect(res.status).toBe(204);
    expect(await t.ctx.db.models.Membership.count({ where: { userId } })).toBe(0);
    expect(await t.ctx.db.models.Session.count({ where: { userId } })).toBe(0);
    expect((await member.get('/api/projects')).status).toBe(401);
    expect((await t.signIn('leaving@larkspur.example', 'leaving-long-password')).res.status).toBe(401);
    expect((await t.agents.owner.get('/api/team')).body.members.map((m: { userId: string }) => m.userId)).not.toContain(userId);
  });

  it('when the owner removes the only owner (themselves), then 409 last_owner', async () => {
    const res = await t.agents.owner.delete(`/api/team/${t.seed.userIds.owner}`);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('last_owner');
    expect(await t.ctx.db.models.Membership.count({ where: { userId: t.seed.userIds.owner } })).toBe(1);
  });

  it('when someone not in the firm is removed, then 404', async () => {
    const res = await t.agents.owner.delete('/api/team/00000000-0000-4000-8000-000000000000');
    expect(res.status).toBe(404);
  });

  it.each(['engineer', 'drafter', 'manager'] as const)('when a %s tries to remove someone, then 403 and nobody leaves', async (role) => {
    const res = await t.agents[role].delete(`/api/team/${t.seed.userIds.drafter}`);
    expect(res.status).toBe(403);
    expect(await t.ctx.db.models.Membership.count({ where: { userId: t.seed.userIds.drafter } })).toBe(1);
  });
});
