import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeScheme } from './helpers/schemes-fixture';
import { createTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

describe('scheme comments and activity', () => {
  it('when an engineer and a manager comment, then the thread lists both oldest first with authors, and the drafter reads it', async () => {
    const { schemeId } = await makeScheme(t, { name: 'Thread scheme' });
    const first = await t.agents.engineer.post(`/api/schemes/${schemeId}/comments`).send({ body: '  Beams at 8 ft keep W12s.  ' });
    expect(first.status).toBe(201);
    expect(first.body.comment).toMatchObject({ body: 'Beams at 8 ft keep W12s.', author: { name: 'Tobias Renfrew' } });
    await t.agents.manager.post(`/api/schemes/${schemeId}/comments`).send({ body: 'Compare with the 10 ft option.' }).expect(201);

    const res = await t.agents.drafter.get(`/api/schemes/${schemeId}/comments`);
    expect(res.status).toBe(200);
    expect(res.body.comments.map((c: { body: string; author: { name: string } }) => [c.author.name, c.body])).toEqual([
      ['Tobias Renfrew', 'Beams at 8 ft keep W12s.'],
      ['Dominic Hale', 'Compare with the 10 ft option.'],
    ]);
    const stored = await t.ctx.db.models.SchemeComment.count({ where: { schemeId } });
    expect(stored).toBe(2);
    const audit = await t.ctx.db.models.AuditEvent.count({ where: { action: 'scheme.commented', target: 'Thread scheme' } });
    expect(audit).toBe(2);
  });

  it('when a drafter posts, then 403 and nothing is stored', async () => {
    const { schemeId } = await makeScheme(t);
    const res = await t.agents.drafter.post(`/api/schemes/${schemeId}/comments`).send({ body: 'May I?' });
    expect(res.status).toBe(403);
    expect(await t.ctx.db.models.SchemeComment.count({ where: { schemeId } })).toBe(0);
  });

  it('when the comment is blank or too long, then 400 naming body', async () => {
    const { schemeId } = await makeScheme(t);
    const blank = await t.agents.manager.post(`/api/schemes/${schemeId}/comments`).send({ body: '   ' });
    expect(blank.status).toBe(400);
    expect(blank.body.error.fields.body).toBe('Comment text is required');
    const long = await t.agents.manager.post(`/api/schemes/${schemeId}/comments`).send({ body: 'x'.repeat(4001) });
    expect(long.body.error.fields.body).toBe('A comment is at most 4,000 characters');
  });

  it('when a scheme is created, designed, saved, cloned, commented and submitted, then the activity tells it newest first', async () => {
    const { schemeId } = await makeScheme(t, { name: 'Story scheme', designed: true });
    const scheme = await t.agents.engineer.get(`/api/schemes/${schemeId}`);
    await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan: scheme.body.scheme.plan, note: 'Moved a beam' }).expect(200);
    await t.agents.engineer.post(`/api/schemes/${schemeId}/comments`).send({ body: 'Ready for a look.' }).expect(201);
    await t.agents.engineer.post(`/api/schemes/${schemeId}/status`).send({ status: 'in_review' }).expect(200);
    const clone = await t.agents.engineer.post(`/api/schemes/${schemeId}/clone`).send({ name: 'Story copy' });
    expect(clone.status).toBe(201);

    const res = await t.agents.manager.get(`/api/schemes/${schemeId}/activity`);
    expect(res.status).toBe(200);
    const kinds = res.body.activity.map((e: { kind: string }) => e.kind);
    expect(kinds).toEqual(['status_changed', 'commented', 'plan_saved', 'designed', 'imported']);
    expect(res.body.activity[2].summary).toBe('Plan saved as revision 2: Moved a beam');
    expect(res.body.activity[3].summary).toMatch(/^Designed revision 1: \d+\.\d tons, \d+ pieces/);

    const cloned = await t.agents.manager.get(`/api/schemes/${clone.body.scheme.id}/activity`);
    expect(cloned.body.activity.map((e: { kind: string }) => e.kind)).toContain('cloned');
    expect(cloned.body.activity.find((e: { kind: string }) => e.kind === 'cloned').summary).toBe('Cloned from "Story scheme" revision 2');
  });

  it("when another firm's scheme thread is read, then 404", async () => {
    const foreign = await makeScheme(t, { firm: 'foreign' });
    expect((await t.agents.manager.get(`/api/schemes/${foreign.schemeId}/comments`)).status).toBe(404);
    expect((await t.agents.manager.get(`/api/schemes/${foreign.schemeId}/activity`)).status).toBe(404);
  });
});
