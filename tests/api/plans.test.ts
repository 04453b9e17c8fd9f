import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { parsePlanFile } from '../../shared/schemas/plan.schema';
import { makeScheme, twoBayPlan } from './helpers/schemes-fixture';
import { createTestApp, type TestApp } from './helpers/test-app';

// The plan of a scheme: PUT with optimistic revisions, 409/422/400, import/export round
// trip, revision history and restore. Every case checks the stored rows, not only the
// response.

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

const models = () => t.ctx.db.models;

async function memberIds(schemeId: string): Promise<string[]> {
  const rows = await models().Member.findAll({ where: { schemeId }, order: [['position', 'ASC']] });
  return rows.map((r) => r.getDataValue('elementId'));
}

describe('import and export', () => {
  it('when the two-bay fixture is imported and exported, then the export deep-equals the parsed input', async () => {
    const raw = twoBayPlan();
    const res = await t.agents.engineer.post(`/api/projects/${t.seed.projectId}/schemes`).send({ name: raw.name, plan: raw });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const id = res.body.scheme.id;
    expect(res.body.scheme.revision).toBe(1);

    const exported = await t.agents.drafter.get(`/api/schemes/${id}/export`);
    expect(exported.status).toBe(200);
    expect(exported.headers['content-disposition']).toBe(
      'attachment; filename="harbour-lane-studio-level-2-invented-example.plan.json"',
    );
    const expected = parsePlanFile(twoBayPlan()).plan;
    expect(JSON.parse(exported.text)).toEqual(JSON.parse(JSON.stringify(expected)));

    // Stored as rows, one per element, keyed by the plan's ids.
    expect(await memberIds(id)).toEqual((raw.members as { id: string }[]).map((m) => m.id));
    expect(await models().Column.count({ where: { schemeId: id } })).toBe(6);
    expect(await models().GridLine.count({ where: { schemeId: id } })).toBe(5);
    const beam = await models().Member.findOne({ where: { schemeId: id, elementId: 'b2' } });
    expect(beam?.get({ plain: true })).toMatchObject({ levelId: 'L2', kind: 'beam', startXFt: 10, startYFt: 0, endXFt: 10, endYFt: 36, shape: null });
    const load = await models().LineLoad.findOne({ where: { schemeId: id, elementId: 'w1' } });
    expect(load?.get({ plain: true })).toMatchObject({ dKlf: 0.4, lKlf: 0, lrKlf: null, sKlf: null });
    // The first revision holds the same plan.
    const rev = await models().PlanRevision.findOne({ where: { schemeId: id, revision: 1 } });
    expect(rev?.getDataValue('plan')).toEqual(JSON.parse(exported.text));
  });

  it('when optional fields are given, absent or null, then the round trip keeps each of them as written', async () => {
    const raw = twoBayPlan() as { members: Record<string, unknown>[]; levels: Record<string, unknown>[]; pointLoads: Record<string, unknown>[] };
    raw.members[0] = { ...raw.members[0], minDepth_in: null, mark: 'G7', markLocked: true, bracing: { points_ft: [10, 20] }, allowedNominalDepths: [18, 21] };
    raw.members[1] = { ...raw.members[1], Lb_override_ft: 7.5, mark: null, shape: 'w18x35 ' };
    raw.levels[0] = { ...raw.levels[0], roof: false };
    raw.pointLoads[0] = { ...raw.pointLoads[0], S_kip: 0.25 };
    delete (raw as Record<string, unknown>).grids;
    const res = await t.agents.owner.post(`/api/projects/${t.seed.projectId}/schemes`).send({ plan: raw });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.repairs).toEqual([
      'Migrated from version 1 to 2: composite settings added with composite off (members follow them, studs designed, columns sized)',
      'members[1] (id gA23): shape "w18x35 " written as "W18X35"',
    ]);
    const expected = JSON.parse(JSON.stringify(parsePlanFile(raw).plan));
    const got = await t.agents.manager.get(`/api/schemes/${res.body.scheme.id}`);
    expect(got.body.scheme.plan).toEqual(expected);
    expect('grids' in got.body.scheme.plan).toBe(false);
    expect(got.body.scheme.plan.members[0]).toHaveProperty('minDepth_in', null);
    expect(got.body.scheme.plan.members[1]).not.toHaveProperty('minDepth_in');
    expect(got.body.scheme.plan.members[1].shape).toBe('W18X35');
  });

  it('when a version 2 plan with slab, member composite/studs and column shape/splices is imported, then the export keeps each as written', async () => {
    const raw = { ...twoBayPlan(), version: 2 } as Record<string, any>;
    raw.designBasis.composite = { enabled: true, studDiameter_in: 0.75, studFu_ksi: 65, minPercentComposite: 0.25, constructionLive_psf: 20, shored: false, camber: true, studEquivalentWeight_lb: 10 };
    raw.decks[0].slab = { ribHeight_in: 3, toppingThickness_in: 3.25, ribAvgWidth_in: 6, ribSpacing_in: 12, concreteWeight_pcf: 115, fc_ksi: 3, deckWeight_psf: 2, profile: 'B3-12' };
    raw.members[0] = { ...raw.members[0], composite: false, studs: null };
    raw.members[1] = { ...raw.members[1], composite: null, studs: 18 };
    raw.columns[0] = { ...raw.columns[0], shape: null, spliceLevels: ['L2'] };
    raw.columns[1] = { ...raw.columns[1], shape: 'W10X33' };
    const res = await t.agents.engineer.post(`/api/projects/${t.seed.projectId}/schemes`).send({ plan: raw });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.repairs).toEqual([]);
    const exported = await t.agents.drafter.get(`/api/schemes/${res.body.scheme.id}/export`);
    const plan = JSON.parse(exported.text);
    expect(plan).toEqual(JSON.parse(JSON.stringify(parsePlanFile(raw).plan)));
    expect(plan.version).toBe(2);
    expect(plan.members[0]).toMatchObject({ composite: false, studs: null });
    expect(plan.members[2]).not.toHaveProperty('composite');
    expect(plan.columns[0]).toMatchObject({ shape: null, spliceLevels: ['L2'] });
    expect(plan.columns[2]).not.toHaveProperty('shape');
    const deck = await models().Deck.findOne({ where: { schemeId: res.body.scheme.id, elementId: raw.decks[0].id } });
    expect(JSON.parse(JSON.stringify(deck?.getDataValue('slab')))).toMatchObject({ ribHeight_in: 3, concreteWeight_pcf: 115 });
  });

  it('when an imported plan cannot be repaired, then 422 plan_invalid names each element and nothing is stored', async () => {
    const raw = twoBayPlan() as { members: Record<string, unknown>[] };
    raw.members[3] = { ...raw.members[3], id: 'gA12' };
    raw.members[5] = { ...raw.members[5], level: 'L9' };
    const before = await models().Scheme.count();
    const res = await t.agents.engineer.post(`/api/projects/${t.seed.projectId}/schemes`).send({ name: 'Broken', plan: raw });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('plan_invalid');
    const problems = res.body.error.problems as { elementId: string; path: string; code: string }[];
    expect(problems.map((p) => [p.code, p.elementId, p.path])).toEqual([
      ['duplicate-id', 'gA12', 'members[3].id'],
      ['unknown-level', 'b2', 'members[5].level'],
    ]);
    expect(await models().Scheme.count()).toBe(before);
  });

  it('when the file is not a plan at all, then 422 naming the path', async () => {
    const res = await t.agents.engineer
      .post(`/api/projects/${t.seed.projectId}/schemes`)
      .send({ name: 'Nope', plan: { format: 'baywright-plan', version: 1, name: 'x', designBasis: { method: 'LRFD' }, levels: [] } });
    expect(res.status).toBe(422);
    expect(res.body.error.problems.map((p: { path: string }) => p.path)).toContain('designBasis.liveLoadReduction');
  });
});

describe('PUT /api/schemes/:id/plan', () => {
  it('when the revision is current, then 200 with the next revision and rows replaced in place', async () => {
    const { schemeId } = await makeScheme(t);
    const plan = { ...(twoBayPlan() as object), version: 2 } as unknown as { members: Record<string, unknown>[] };
    plan.members = plan.members.filter((m) => m.id !== 'b3');
    const res = await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan, note: 'dropped b3' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toEqual({ revision: 2, repairs: [], problems: [] });
    expect(await memberIds(schemeId)).not.toContain('b3');
    expect(await models().Member.count({ where: { schemeId } })).toBe(10);
    const scheme = await models().Scheme.findByPk(schemeId);
    expect(scheme?.getDataValue('revision')).toBe(2);
    expect(scheme?.getDataValue('updatedBy')).toBe(t.seed.userIds.engineer);
    const rev = await models().PlanRevision.findOne({ where: { schemeId, revision: 2 } });
    expect(rev?.getDataValue('note')).toBe('dropped b3');
    expect(rev?.getDataValue('userId')).toBe(t.seed.userIds.engineer);
  });

  it('when the revision is stale and both changed the same member, then 409 revision_conflict carries the current plan and nothing is lost', async () => {
    const { schemeId } = await makeScheme(t);
    const first = twoBayPlan() as { members: Record<string, unknown>[] };
    first.members.push({ id: 'b8', level: 'L2', kind: 'beam', start: [5, 0], end: [5, 36], shape: null, maxDepth_in: null });
    first.members = first.members.map((m) => (m.id === 'b2' ? { ...m, shape: 'W21X44' } : m));
    expect((await t.agents.owner.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan: first })).status).toBe(200);

    const second = twoBayPlan() as { members: Record<string, unknown>[] };
    second.members = second.members.filter((m) => m.id !== 'b2');
    const res = await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan: second });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('revision_conflict');
    expect(res.body.error.message).toContain('Imogen Ashdown');
    expect(res.body.error.conflicts).toEqual([{ kind: 'members', id: 'b2', label: `beam at A–B / 1+10'-0"`, mine: 'removed', theirs: 'size W21X44' }]);
    const current = res.body.error.current;
    expect(current.revision).toBe(2);
    expect(current.updatedBy).toEqual({ id: t.seed.userIds.owner, name: 'Imogen Ashdown' });
    expect(typeof current.updatedAt).toBe('string');
    expect(current.plan.members.map((m: { id: string }) => m.id)).toContain('b8');
    // The owner's save stands; the engineer's was not applied.
    const ids = await memberIds(schemeId);
    expect(ids).toContain('b8');
    expect(ids).toContain('b2');
    expect(await models().PlanRevision.count({ where: { schemeId } })).toBe(2);
  });

  it('when a member lands on nothing, then it is saved and reported as a problem naming the member', async () => {
    const { schemeId } = await makeScheme(t);
    const plan = twoBayPlan() as { members: Record<string, unknown>[] };
    plan.members.push({ id: 'loose', level: 'L2', kind: 'beam', start: [5, 5], end: [5, 20], shape: null, maxDepth_in: null });
    const res = await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan });
    expect(res.status).toBe(200);
    expect(res.body.revision).toBe(2);
    expect(res.body.problems.map((p: { code: string; elementId: string }) => [p.code, p.elementId])).toEqual([
      ['member-end-unsupported', 'loose'],
      ['member-end-unsupported', 'loose'],
    ]);
    expect(await memberIds(schemeId)).toContain('loose');
  });

  it('when the plan has duplicate ids, then 422 naming the element and the saved plan is untouched', async () => {
    const { schemeId } = await makeScheme(t);
    const plan = twoBayPlan() as { columns: Record<string, unknown>[] };
    plan.columns[2] = { ...plan.columns[2], id: 'C-A1' };
    const res = await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('plan_invalid');
    expect(res.body.error.problems).toEqual([
      expect.objectContaining({ code: 'duplicate-id', elementId: 'C-A1', path: 'columns[2].id' }),
    ]);
    expect((await models().Scheme.findByPk(schemeId))?.getDataValue('revision')).toBe(1);
    expect(await models().Column.count({ where: { schemeId } })).toBe(6);
  });

  it('when a point or line load is negative, then 422 naming the load and field, and the saved plan is untouched', async () => {
    const { schemeId } = await makeScheme(t);
    const plan = twoBayPlan() as { levels: { id: string }[]; pointLoads: Record<string, unknown>[]; lineLoads: Record<string, unknown>[] };
    plan.pointLoads[0] = { ...plan.pointLoads[0], D_kip: -5 };
    plan.lineLoads = [{ id: 'w1', level: plan.levels[0].id, start: [0, 0], end: [30, 0], D_klf: 0.2, L_klf: -0.1 }];
    const res = await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('plan_invalid');
    expect(res.body.error.problems).toEqual([
      expect.objectContaining({ code: 'negative-load', path: `pointLoads[0] (id ${String(plan.pointLoads[0].id)}).D_kip` }),
      expect.objectContaining({ code: 'negative-load', path: 'lineLoads[0] (id w1).L_klf', elementId: 'w1' }),
    ]);
    expect(res.body.error.message).toContain('must be 0 or more');
    expect((await models().Scheme.findByPk(schemeId))?.getDataValue('revision')).toBe(1);
    // zero stays allowed (a placed load with only live, or only dead)
    plan.pointLoads[0].D_kip = 0;
    plan.lineLoads = [];
    expect((await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan })).status).toBe(200);
  });

  it('when a negative load is imported as a new scheme, then 422 naming it and no scheme is made', async () => {
    const plan = twoBayPlan() as { pointLoads: Record<string, unknown>[] };
    plan.pointLoads[0] = { ...plan.pointLoads[0], L_kip: -1 };
    const projectId = (await makeScheme(t)).projectId;
    const before = await models().Scheme.count();
    const res = await t.agents.engineer.post(`/api/projects/${projectId}/schemes`).send({ name: 'Uplift', plan });
    expect(res.status).toBe(422);
    expect(res.body.error.problems[0]).toMatchObject({ code: 'negative-load', path: `pointLoads[0] (id ${String(plan.pointLoads[0].id)}).L_kip` });
    expect(await models().Scheme.count()).toBe(before);
  });

  it('when an element id is longer than the store holds, then 422 naming it', async () => {
    const { schemeId } = await makeScheme(t);
    const plan = twoBayPlan() as { decks: Record<string, unknown>[] };
    plan.decks[0] = { ...plan.decks[0], id: 'd'.repeat(300) };
    const res = await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan });
    expect(res.status).toBe(422);
    expect(res.body.error.problems[0]).toMatchObject({ code: 'value-too-long', path: 'decks[0].id' });
  });

  it.each([
    ['no revision', () => ({ plan: twoBayPlan() }), 'revision'],
    ['a revision that is not a number', () => ({ revision: 'latest', plan: twoBayPlan() }), 'revision'],
    ['no plan', () => ({ revision: 1 }), 'plan'],
  ])('when the body has %s, then 400 naming the field', async (_label, body, field) => {
    const { schemeId } = await makeScheme(t);
    const res = await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send(body());
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(Object.keys(res.body.error.fields)).toEqual([field]);
  });

  it('when the body is not JSON, then 400 invalid_json', async () => {
    const { schemeId } = await makeScheme(t);
    const res = await t.agents.engineer
      .put(`/api/schemes/${schemeId}/plan`)
      .set('Content-Type', 'application/json')
      .send('{"revision": 1, "plan": ');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_json');
  });

  it('when writing the rows fails half way, then the transaction rolls back and the saved plan and revision stay', async () => {
    const { schemeId } = await makeScheme(t);
    const spy = vi.spyOn(models().Opening, 'bulkCreate').mockRejectedValueOnce(new Error('disk full (simulated)'));
    const plan = twoBayPlan() as { members: Record<string, unknown>[] };
    plan.members = plan.members.slice(0, 4);
    const res = await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan });
    spy.mockRestore();
    expect(res.status).toBe(500);
    expect(t.serverErrors.splice(0)).toHaveLength(1);
    expect((await models().Scheme.findByPk(schemeId))?.getDataValue('revision')).toBe(1);
    expect(await models().Member.count({ where: { schemeId } })).toBe(11);
    expect(await models().PlanRevision.count({ where: { schemeId } })).toBe(1);
  });
});

describe('revisions', () => {
  it('when a scheme is saved twice, then the revisions list who and when, newest first', async () => {
    const { schemeId } = await makeScheme(t);
    const plan = twoBayPlan();
    await t.agents.owner.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan, note: 'owner pass' }).expect(200);
    await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 2, plan }).expect(200);
    const res = await t.agents.manager.get(`/api/schemes/${schemeId}/revisions`);
    expect(res.status).toBe(200);
    expect(
      res.body.revisions.map((r: { revision: number; userName: string; note: string | null; current: boolean }) => [r.revision, r.userName, r.note, r.current]),
    ).toEqual([
      [3, 'Tobias Renfrew', null, true],
      [2, 'Imogen Ashdown', 'owner pass', false],
      [1, 'Tobias Renfrew', 'Imported from a plan file', false],
    ]);
    expect(Number.isNaN(Date.parse(res.body.revisions[0].createdAt))).toBe(false);
  });

  it('when a size is locked and a beam removed, then the revisions list says what each revision changed, in words without ids', async () => {
    const { schemeId } = await makeScheme(t);
    const saved = (await t.agents.engineer.get(`/api/schemes/${schemeId}`)).body.scheme.plan;
    const edited = structuredClone(saved) as { members: { id: string; shape: string | null }[] };
    edited.members.find((m) => m.id === 'b2')!.shape = 'W16X26';
    edited.members = edited.members.filter((m) => m.id !== 'b6');
    await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan: edited }).expect(200);
    const res = await t.agents.manager.get(`/api/schemes/${schemeId}/revisions`);
    const [r2, r1] = res.body.revisions as { revision: number; summary: string }[];
    expect(r1.summary).toBe('First revision: 11 members, 6 columns, 1 level');
    expect(r2.summary).toMatch(/^1 beam removed( \(\w+\))?, 1 size locked( \(\w+\))?$/);
    expect(r2.summary).not.toMatch(/\bb2\b|\bb6\b/);
  });

  it('when an old revision is restored, then a new revision holds its plan and the one in between is kept', async () => {
    const { schemeId } = await makeScheme(t);
    const original = (await t.agents.engineer.get(`/api/schemes/${schemeId}`)).body.scheme.plan;
    const edited = twoBayPlan() as { members: Record<string, unknown>[] };
    edited.members = edited.members.slice(0, 5);
    await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan: edited }).expect(200);
    expect(await models().Member.count({ where: { schemeId } })).toBe(5);

    const res = await t.agents.owner.post(`/api/schemes/${schemeId}/revisions/1/restore`);
    expect(res.status).toBe(200);
    expect(res.body.restoredFrom).toBe(1);
    expect(res.body.scheme.revision).toBe(3);
    expect(res.body.scheme.plan).toEqual(original);
    expect(await models().Member.count({ where: { schemeId } })).toBe(11);
    const revs = await models().PlanRevision.findAll({ where: { schemeId }, order: [['revision', 'ASC']] });
    expect(revs.map((r) => r.getDataValue('revision'))).toEqual([1, 2, 3]);
    expect(revs[2].getDataValue('note')).toBe('Restored revision 1');
    expect(revs[2].getDataValue('userId')).toBe(t.seed.userIds.owner);
    expect((revs[1].getDataValue('plan') as { members: unknown[] }).members).toHaveLength(5);
  });

  it('when the revision does not exist, then 404; when it is not a number, then 400', async () => {
    const { schemeId } = await makeScheme(t);
    const missing = await t.agents.engineer.post(`/api/schemes/${schemeId}/revisions/9/restore`);
    expect(missing.status).toBe(404);
    expect(missing.body.error.message).toBe('Revision 9 not found.');
    const bad = await t.agents.engineer.post(`/api/schemes/${schemeId}/revisions/first/restore`);
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(['revision']);
  });
});
