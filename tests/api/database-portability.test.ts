import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeScheme } from './helpers/schemes-fixture';
import { createTestApp, type TestApp } from './helpers/test-app';
import { testDialect } from './helpers/test-database';

// What must behave the same on SQLite and PostgreSQL (this file runs in both API passes):
// e-mail lookups ignore case, JSON and dates come back as they went in, transactions roll
// back whole, and racing writers cannot break the one-chosen-scheme or revision rules.

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

describe(`database portability (${testDialect})`, () => {
  it('when an e-mail is written in mixed case through the model, then it is stored lower-case and found by the API in any case', async () => {
    const signUp = await t.anonymous().post('/api/firms').send({
      firmName: 'Ostrander Frame Works',
      name: 'Petra Ostrander',
      email: 'Petra.Ostrander@Ostrander.EXAMPLE',
      password: 'portable-password-1',
    });
    expect(signUp.status).toBe(201);
    expect(signUp.body.user.email).toBe('petra.ostrander@ostrander.example');
    const stored = await t.ctx.db.models.User.findOne({ where: { email: 'petra.ostrander@ostrander.example' } });
    expect(stored?.getDataValue('name')).toBe('Petra Ostrander');

    // A write that bypasses the API's schema is normalised by the model itself.
    const direct = await t.ctx.db.models.User.create({ email: '  Quinn.Harrow@Example.COM ', name: 'Quinn Harrow', passwordHash: 'x' });
    expect(direct.getDataValue('email')).toBe('quinn.harrow@example.com');

    const { res } = await t.signIn('PETRA.OSTRANDER@ostrander.example', 'portable-password-1');
    expect(res.status).toBe(200);
    const again = await t.anonymous().post('/api/firms').send({ firmName: 'Copy', name: 'Copy', email: 'petra.ostrander@OSTRANDER.example', password: 'portable-password-2' });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('email_taken');
  });

  it('when JSON with nesting, nulls, unicode and fractions is stored, then it reads back deep-equal; dates keep their millisecond', async () => {
    const { schemeId } = await makeScheme(t);
    const result = { nested: { list: [1, 2.5, -0.125, null], text: 'Ø 12 — “quoted” \\ back' }, empty: {}, flag: false };
    const at = new Date('2026-03-04T05:06:07.089Z');
    const run = await t.ctx.db.models.DesignRun.create({
      schemeId,
      revision: 1,
      result,
      steelWeightLb: 1234.5,
      pieces: 7,
      floorAreaFt2: 900.25,
      failingMembers: 0,
      problemCount: 0,
      userId: null,
      createdAt: at,
    });
    const back = await t.ctx.db.models.DesignRun.findByPk(run.getDataValue('id'));
    expect(back!.getDataValue('result')).toEqual(result);
    expect(back!.getDataValue('steelWeightLb')).toBe(1234.5);
    expect(new Date(back!.getDataValue('createdAt')).toISOString()).toBe('2026-03-04T05:06:07.089Z');
    const raw = (await t.ctx.db.models.DesignRun.findByPk(run.getDataValue('id'), { raw: true })) as unknown as { result: unknown };
    const rawResult = typeof raw.result === 'string' ? JSON.parse(raw.result) : raw.result;
    expect(rawResult).toEqual(result);
  });

  it('when a transaction fails part way, then none of its writes are kept', async () => {
    const { projectId } = await makeScheme(t);
    const before = await t.ctx.db.models.Scheme.count({ where: { projectId } });
    await expect(
      t.ctx.db.sequelize.transaction(async (transaction) => {
        await t.ctx.db.models.Project.update({ name: 'Renamed inside' }, { where: { id: projectId }, transaction });
        await t.ctx.db.models.Scheme.update({ name: 'Renamed too' }, { where: { projectId }, transaction });
        throw new Error('stop here');
      }),
    ).rejects.toThrow('stop here');
    expect((await t.ctx.db.models.Project.findByPk(projectId))!.getDataValue('name')).toBe('Scheme fixture project');
    expect(await t.ctx.db.models.Scheme.count({ where: { projectId, name: 'Fixture scheme' } })).toBe(before);
  });

  it('when three schemes are chosen at the same moment, then exactly one ends chosen and nobody gets a 5xx', async () => {
    const first = await makeScheme(t, { name: 'Race A' });
    const ids = [first.schemeId];
    for (const name of ['Race B', 'Race C']) {
      const res = await t.agents.engineer.post(`/api/projects/${first.projectId}/schemes`).send({ name });
      expect(res.status).toBe(201);
      ids.push(res.body.scheme.id);
    }
    for (const id of ids) await t.agents.manager.post(`/api/schemes/${id}/status`).send({ status: 'in_review' }).expect(200);
    const answers = await Promise.all(ids.map((id) => t.agents.manager.post(`/api/schemes/${id}/status`).send({ status: 'chosen' })));
    for (const a of answers) expect([200, 409]).toContain(a.status);
    expect(answers.some((a) => a.status === 200)).toBe(true);
    expect(await t.ctx.db.models.Scheme.count({ where: { projectId: first.projectId, status: 'chosen' } })).toBe(1);
  });

  it('when two saves race on the same revision, then exactly one wins and the other is told the revision moved', async () => {
    const { schemeId } = await makeScheme(t);
    const plan = (await t.agents.engineer.get(`/api/schemes/${schemeId}/export`)).body;
    // Both change the same beam differently: a true conflict, so one must be told (different elements would merge).
    const edits = ['W21X44', 'W24X55'].map((shape) => ({ ...plan, members: plan.members.map((m: { id: string }) => (m.id === 'b2' ? { ...m, shape } : m)) }));
    const answers = await Promise.all(edits.map((p) => t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan: p })));
    expect(answers.map((a) => a.status).sort()).toEqual([200, 409]);
    const loser = answers.find((a) => a.status === 409)!;
    expect(loser.body.error.code).toBe('revision_conflict');
    const scheme = await t.ctx.db.models.Scheme.findByPk(schemeId);
    expect(scheme!.getDataValue('revision')).toBe(2);
    expect(await t.ctx.db.models.PlanRevision.count({ where: { schemeId } })).toBe(2);
  });
});
