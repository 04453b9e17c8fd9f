import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeScheme, twoBayPlan } from './helpers/schemes-fixture';
import { createTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

async function statusOf(id: string) {
  return (await t.ctx.db.models.Scheme.findByPk(id))!.getDataValue('status');
}

/** Two schemes in one new project of the demo firm. */
async function twoSchemes() {
  const a = await makeScheme(t, { name: 'Option A' });
  const b = await t.agents.engineer.post(`/api/projects/${a.projectId}/schemes`).send({ name: 'Option B', plan: twoBayPlan() });
  expect(b.status).toBe(201);
  return { projectId: a.projectId, a: a.schemeId, b: b.body.scheme.id as string };
}

describe('scheme status', () => {
  it('when a manager submits, returns and chooses, then each allowed move is stored with its activity and audit entry', async () => {
    const { a } = await twoSchemes();
    let res = await t.agents.manager.post(`/api/schemes/${a}/status`).send({ status: 'in_review' });
    expect(res.status).toBe(200);
    expect(res.body.scheme).toMatchObject({ id: a, status: 'in_review' });
    expect(await statusOf(a)).toBe('in_review');
    res = await t.agents.manager.post(`/api/schemes/${a}/status`).send({ status: 'draft' });
    expect(res.body.scheme.status).toBe('draft');
    await t.agents.engineer.post(`/api/schemes/${a}/status`).send({ status: 'in_review' }).expect(200);
    res = await t.agents.owner.post(`/api/schemes/${a}/status`).send({ status: 'chosen' });
    expect(res.status).toBe(200);
    expect(await statusOf(a)).toBe('chosen');

    const activity = await t.agents.drafter.get(`/api/schemes/${a}/activity`);
    expect(activity.status).toBe(200);
    const changes = activity.body.activity.filter((e: { kind: string }) => e.kind === 'status_changed');
    expect(changes.map((e: { detail: { from: string; to: string } }) => `${e.detail.from}>${e.detail.to}`)).toEqual([
      'in_review>chosen',
      'draft>in_review',
      'in_review>draft',
      'draft>in_review',
    ]);
    expect(changes[0].actor.name).toBe('Imogen Ashdown');
    const audits = await t.ctx.db.models.AuditEvent.findAll({ where: { action: 'scheme.status_changed' } });
    expect(audits.filter((r) => JSON.parse(r.getDataValue('detail')!).schemeId === a)).toHaveLength(4);
  });

  it('when a second scheme is chosen, then the first goes back to in review in the same change: one chosen per project', async () => {
    const { projectId, a, b } = await twoSchemes();
    for (const id of [a, b]) await t.agents.manager.post(`/api/schemes/${id}/status`).send({ status: 'in_review' }).expect(200);
    await t.agents.manager.post(`/api/schemes/${a}/status`).send({ status: 'chosen' }).expect(200);
    const res = await t.agents.manager.post(`/api/schemes/${b}/status`).send({ status: 'chosen' });
    expect(res.status).toBe(200);
    expect(res.body.unchosen).toEqual([{ id: a, name: 'Option A' }]);
    expect(await statusOf(a)).toBe('in_review');
    expect(await statusOf(b)).toBe('chosen');
    expect(await t.ctx.db.models.Scheme.count({ where: { projectId, status: 'chosen' } })).toBe(1);
    const activityA = await t.agents.manager.get(`/api/schemes/${a}/activity`);
    expect(activityA.body.activity[0].summary).toBe('Status changed from chosen to in review (because "Option B" was chosen)');
  });

  it('when the database is asked to hold two chosen schemes of one project, then the unique index refuses', async () => {
    const { a, b } = await twoSchemes();
    await t.ctx.db.models.Scheme.update({ status: 'chosen' }, { where: { id: a } });
    await expect(t.ctx.db.models.Scheme.update({ status: 'chosen' }, { where: { id: b } })).rejects.toThrow();
    expect(await statusOf(b)).toBe('draft');
  });

  it('when a move is not allowed (draft to chosen, draft to draft), then 409 invalid_transition and nothing changes', async () => {
    const { a } = await twoSchemes();
    let res = await t.agents.manager.post(`/api/schemes/${a}/status`).send({ status: 'chosen' });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('invalid_transition');
    expect(res.body.error.message).toBe('"Option A" is draft; it can go to in review, not chosen.');
    expect(res.body.error.allowed).toEqual(['in_review']);
    res = await t.agents.manager.post(`/api/schemes/${a}/status`).send({ status: 'draft' });
    expect(res.status).toBe(409);
    expect(await statusOf(a)).toBe('draft');
    expect(await t.ctx.db.models.SchemeActivity.count({ where: { schemeId: a } })).toBe(0);
  });

  it('when an archived scheme is chosen, then 409 scheme_archived', async () => {
    const { a } = await twoSchemes();
    await t.agents.manager.post(`/api/schemes/${a}/status`).send({ status: 'in_review' }).expect(200);
    await t.agents.engineer.patch(`/api/schemes/${a}`).send({ archived: true }).expect(200);
    const res = await t.agents.manager.post(`/api/schemes/${a}/status`).send({ status: 'chosen' });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('scheme_archived');
    expect(await statusOf(a)).toBe('in_review');
  });

  it('when the status is not one of the three, then 400 naming the field', async () => {
    const { a } = await twoSchemes();
    const res = await t.agents.manager.post(`/api/schemes/${a}/status`).send({ status: 'approved' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.status).toBe('status must be draft, in_review or chosen');
  });

  it('when a drafter sets a status, then 403; when a manager saves a plan, then 403 and the revision is unchanged', async () => {
    const { a } = await twoSchemes();
    const drafter = await t.agents.drafter.post(`/api/schemes/${a}/status`).send({ status: 'in_review' });
    expect(drafter.status).toBe(403);
    const plan = await t.agents.manager.put(`/api/schemes/${a}/plan`).send({ revision: 1, plan: twoBayPlan() });
    expect(plan.status).toBe(403);
    expect(plan.body.error.code).toBe('forbidden');
    expect((await t.ctx.db.models.Scheme.findByPk(a))!.getDataValue('revision')).toBe(1);
  });

  it('when a scheme is submitted and then chosen, then managers and then its engineer are mailed through the outbox', async () => {
    const { a } = await twoSchemes();
    const submitted = await t.agents.engineer.post(`/api/schemes/${a}/status`).send({ status: 'in_review' });
    expect(submitted.body.notified).toEqual(['manager@example.com']);
    const chosen = await t.agents.manager.post(`/api/schemes/${a}/status`).send({ status: 'chosen' });
    expect(chosen.body.notified).toEqual(['engineer@example.com']);
    const mail = await t.ctx.db.models.OutboxMessage.findAll({ where: { toAddress: 'engineer@example.com' } });
    expect(mail.some((m) => m.getDataValue('subject').includes('Option A'))).toBe(true);
  });

  it("when another firm's scheme is targeted, then 404", async () => {
    const foreign = await makeScheme(t, { firm: 'foreign' });
    const res = await t.agents.manager.post(`/api/schemes/${foreign.schemeId}/status`).send({ status: 'in_review' });
    expect(res.status).toBe(404);
  });
});
