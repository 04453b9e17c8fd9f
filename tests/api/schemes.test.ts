import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_SCHEMES } from '../../server/db/seed-demo-building';
import { seedDemo } from '../../server/db/seed-demo';
import { getSchemeDesign } from '../../server/services/scheme-design.service';
import { unpackDesignResult } from '../../server/services/design-run-storage';
import { makeScheme, twoBayPlan } from './helpers/schemes-fixture';
import { createTestApp, type TestApp } from './helpers/test-app';

// Schemes of a project: create, list, read, rename/archive, delete, clone, design runs and
// their staleness, and the demo building the seed creates.

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

const models = () => t.ctx.db.models;

describe('create and list', () => {
  it('when an engineer creates a scheme with a name, then it starts as an empty draft plan at revision 1 with one level', async () => {
    const { projectId } = await makeScheme(t);
    const res = await t.agents.engineer.post(`/api/projects/${projectId}/schemes`).send({ name: '  Scheme C — long span ' });
    expect(res.status).toBe(201);
    const s = res.body.scheme;
    expect(s).toMatchObject({ projectId, name: 'Scheme C — long span', status: 'draft', archived: false, revision: 1, design: null, designStale: true });
    expect(s.createdBy).toEqual({ id: t.seed.userIds.engineer, name: 'Tobias Renfrew' });
    expect(s.plan).toEqual({
      format: 'baywright-plan',
      version: 2,
      name: 'Scheme C — long span',
      designBasis: {
        method: 'LRFD', Fy_ksi: 50, liveLoadReduction: true, deflectionLimits: { live: 360, total: 240 },
        // plan file version 2 defaults, composite on for a new scheme (calc-interface.md "Additions")
        composite: { enabled: true, studDiameter_in: 0.75, studFu_ksi: 65, minPercentComposite: 0.25, constructionLive_psf: 20, shored: false, camber: true },
      },
      grids: [],
      levels: [{ id: 'L2', name: 'Level 2', elevation_ft: 14 }],
      columns: [], members: [], zones: [], decks: [], pointLoads: [], lineLoads: [], openings: [],
    });
    const row = await models().Scheme.findByPk(s.id);
    expect(row?.get({ plain: true })).toMatchObject({ projectId, status: 'draft', archived: false, revision: 1, createdBy: t.seed.userIds.engineer });
    expect(await models().Level.count({ where: { schemeId: s.id } })).toBe(1);
    expect(await models().PlanRevision.count({ where: { schemeId: s.id } })).toBe(1);
  });

  it('when the body has neither name nor plan, or a blank name, then 400 naming name', async () => {
    for (const body of [{}, { name: '   ' }]) {
      const res = await t.agents.engineer.post(`/api/projects/${t.seed.projectId}/schemes`).send(body);
      expect(res.status).toBe(400);
      expect(Object.keys(res.body.error.fields)).toEqual(['name']);
    }
  });

  it('when the project belongs to another firm, then 404 and nothing is created', async () => {
    const { projectId } = await makeScheme(t, { firm: 'foreign' });
    const before = await models().Scheme.count();
    const res = await t.agents.owner.post(`/api/projects/${projectId}/schemes`).send({ name: 'Sneaky' });
    expect(res.status).toBe(404);
    expect(await models().Scheme.count()).toBe(before);
  });

  it('when a project has schemes, then the list shows each with revision, design summary and staleness', async () => {
    const { projectId, schemeId } = await makeScheme(t, { designed: true, name: 'Designed' });
    const fresh = await t.agents.engineer.post(`/api/projects/${projectId}/schemes`).send({ name: 'Fresh' });
    const res = await t.agents.drafter.get(`/api/projects/${projectId}/schemes`);
    expect(res.status).toBe(200);
    expect(res.body.schemes.map((s: { name: string }) => s.name)).toEqual(['Designed', 'Fresh']);
    const designed = res.body.schemes[0];
    expect(designed).toMatchObject({ id: schemeId, revision: 1, status: 'draft', archived: false, designStale: false });
    // Two-bay fixture, designed: 11 pieces (4 girders + 7 beams); weight is the engine's sum.
    const run = await models().DesignRun.findOne({ where: { schemeId } });
    expect(designed.design).toMatchObject({ revision: 1, stale: false, pieces: 11, steelWeight_lb: run?.getDataValue('steelWeightLb') });
    expect(designed.design.steel_psf).toBeCloseTo(run!.getDataValue('steelWeightLb') / run!.getDataValue('floorAreaFt2'), 10);
    expect(res.body.schemes[1]).toMatchObject({ id: fresh.body.scheme.id, design: null, designStale: true });
  });

  it('when archived schemes are filtered, then include, exclude and only each hold', async () => {
    const { projectId, schemeId } = await makeScheme(t);
    await t.agents.engineer.post(`/api/projects/${projectId}/schemes`).send({ name: 'Kept' }).expect(201);
    await t.agents.engineer.patch(`/api/schemes/${schemeId}`).send({ archived: true }).expect(200);
    const names = async (q: string) =>
      (await t.agents.manager.get(`/api/projects/${projectId}/schemes${q}`)).body.schemes.map((s: { name: string }) => s.name);
    expect(await names('')).toEqual(['Fixture scheme', 'Kept']);
    expect(await names('?archived=exclude')).toEqual(['Kept']);
    expect(await names('?archived=only')).toEqual(['Fixture scheme']);
    const bad = await t.agents.manager.get(`/api/projects/${projectId}/schemes?archived=maybe`);
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.archived).toBe('archived must be include, exclude or only');
  });
});

describe('read, rename, archive, delete', () => {
  it('when a scheme is read, then it carries its revision and plan file', async () => {
    const { schemeId, projectId } = await makeScheme(t);
    const res = await t.agents.manager.get(`/api/schemes/${schemeId}`);
    expect(res.status).toBe(200);
    expect(res.body.scheme).toMatchObject({ id: schemeId, projectId, revision: 1, name: 'Fixture scheme' });
    expect(res.body.scheme.plan.format).toBe('baywright-plan');
    expect(res.body.scheme.plan.name).toBe('Fixture scheme');
    expect(res.body.scheme.plan.members).toHaveLength(11);
  });

  it('when the id is not a uuid, then 400; when unknown, then 404', async () => {
    expect((await t.agents.manager.get('/api/schemes/not-an-id')).status).toBe(400);
    const res = await t.agents.manager.get('/api/schemes/6f1d3c1e-2b7a-4c55-9a0e-1f2e3d4c5b6a');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });

  it('when a scheme is renamed and archived, then the row changes, the revision does not, and the export takes the new name', async () => {
    const { schemeId } = await makeScheme(t);
    const res = await t.agents.owner.patch(`/api/schemes/${schemeId}`).send({ name: 'Scheme D', archived: true });
    expect(res.status).toBe(200);
    expect(res.body.scheme).toMatchObject({ name: 'Scheme D', archived: true, revision: 1 });
    const row = await models().Scheme.findByPk(schemeId);
    expect(row?.get({ plain: true })).toMatchObject({ name: 'Scheme D', archived: true, revision: 1, updatedBy: t.seed.userIds.owner });
    const exported = await t.agents.drafter.get(`/api/schemes/${schemeId}/export`);
    expect(JSON.parse(exported.text).name).toBe('Scheme D');
    expect(exported.headers['content-disposition']).toBe('attachment; filename="scheme-d.plan.json"');
  });

  it('when a patch is empty or carries a status, then 400 (status is not changed here)', async () => {
    const { schemeId } = await makeScheme(t);
    expect((await t.agents.owner.patch(`/api/schemes/${schemeId}`).send({})).status).toBe(400);
    expect((await t.agents.owner.patch(`/api/schemes/${schemeId}`).send({ status: 'chosen' })).status).toBe(400);
    expect((await models().Scheme.findByPk(schemeId))?.getDataValue('status')).toBe('draft');
  });

  it('when a scheme is deleted, then its rows, revisions and design runs go with it', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    expect(await models().DesignRun.count({ where: { schemeId } })).toBe(1);
    const res = await t.agents.engineer.delete(`/api/schemes/${schemeId}`);
    expect(res.status).toBe(204);
    expect(await models().Scheme.findByPk(schemeId)).toBeNull();
    for (const name of ['Member', 'Column', 'Level', 'Deck', 'Zone', 'PointLoad', 'LineLoad', 'Opening', 'GridLine', 'PlanRevision', 'DesignRun'] as const) {
      expect(await (models()[name] as typeof models.prototype).count({ where: { schemeId } }), name).toBe(0);
    }
    expect((await t.agents.engineer.get(`/api/schemes/${schemeId}`)).status).toBe(404);
  });
});

describe('design', () => {
  it('when a scheme is designed, then the calc plan output is stored against its revision', async () => {
    const { schemeId } = await makeScheme(t);
    const none = await t.agents.drafter.get(`/api/schemes/${schemeId}/design`);
    expect(none.status).toBe(404);
    expect(none.body.error.code).toBe('not_designed');

    const res = await t.agents.engineer.post(`/api/schemes/${schemeId}/design`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ revision: 1, stale: false });
    expect(Object.keys(res.body)).toEqual(expect.arrayContaining(['members', 'columns', 'totals', 'equilibrium', 'problems', 'designedAt']));
    expect(res.body.members).toHaveLength(11);
    expect(res.body.totals.pieces).toBe(11);
    // Equilibrium per case (design-basis §2): applied load = reactions, to rounding.
    for (const c of ['D', 'L'] as const) {
      expect(res.body.equilibrium[c].reactions_kip).toBeCloseTo(res.body.equilibrium[c].applied_kip, 6);
    }
    expect(res.body.caution).toMatch(/licensed engineer/);

    const runs = await models().DesignRun.findAll({ where: { schemeId } });
    expect(runs).toHaveLength(1);
    expect(runs[0].get({ plain: true })).toMatchObject({
      revision: 1,
      userId: t.seed.userIds.engineer,
      pieces: 11,
      steelWeightLb: res.body.totals.steelWeight_lb,
      failingMembers: 0,
    });
    const stored = unpackDesignResult(runs[0].getDataValue('result')) as { members: { id: string; shape: string }[] };
    expect(stored.members.map((m) => m.shape)).toEqual(res.body.members.map((m: { shape: string }) => m.shape));

    const got = await t.agents.manager.get(`/api/schemes/${schemeId}/design`);
    expect(got.status).toBe(200);
    expect(got.body).toEqual(res.body);
  });

  it('when the plan is edited after a design, then the stored design is stale until designed again', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    const plan = twoBayPlan() as { pointLoads: Record<string, unknown>[] };
    plan.pointLoads[0] = { ...plan.pointLoads[0], D_kip: 6 };
    await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan }).expect(200);

    const stale = await t.agents.drafter.get(`/api/schemes/${schemeId}/design`);
    expect(stale.body).toMatchObject({ revision: 1, stale: true });
    const list = (await t.agents.drafter.get(`/api/schemes/${schemeId}`)).body.scheme;
    expect(list).toMatchObject({ revision: 2, designStale: true, design: { revision: 1, stale: true } });

    const again = await t.agents.owner.post(`/api/schemes/${schemeId}/design`);
    expect(again.body).toMatchObject({ revision: 2, stale: false });
    // 4 kip more dead load on the floor (6 − 2): applied D less member self weight grows by
    // exactly that (self weight may change with the sizes).
    type Run = { equilibrium: { D: { applied_kip: number } }; members: { weight_plf: number; span_ft: number }[] };
    const placedD = (r: Run) => r.equilibrium.D.applied_kip - r.members.reduce((sum, m) => sum + (m.weight_plf * m.span_ft) / 1000, 0);
    expect(placedD(again.body) - placedD(stale.body)).toBeCloseTo(4, 6);
    expect((await models().DesignRun.findAll({ where: { schemeId } })).map((r) => r.getDataValue('revision')).sort()).toEqual([1, 2]);
  });

  it('when another feature asks for the design with designIfStale, then a stale design is recomputed and stored', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan: twoBayPlan() }).expect(200);
    const ctx = { db: t.ctx.db, actor: { firmId: t.seed.firmId!, userId: t.seed.userIds.drafter! } };
    const kept = await getSchemeDesign(ctx, schemeId, { designIfStale: false });
    expect(kept).toMatchObject({ revision: 1, stale: true });
    const fresh = await getSchemeDesign(ctx, schemeId, { designIfStale: true });
    expect(fresh).toMatchObject({ revision: 2, stale: false });
    expect(await models().DesignRun.count({ where: { schemeId } })).toBe(2);
    // Current now: asking again does not design again.
    await getSchemeDesign(ctx, schemeId, { designIfStale: true });
    expect(await models().DesignRun.count({ where: { schemeId } })).toBe(2);
    const foreign = { db: t.ctx.db, actor: { firmId: t.otherFirmId, userId: t.seed.userIds.drafter! } };
    await expect(getSchemeDesign(foreign, schemeId, { designIfStale: true })).rejects.toMatchObject({ status: 404 });
  });
});

describe('clone', () => {
  it('when a designed scheme is cloned, then the copy has the same plan at revision 1 and a copy of the design', async () => {
    const { schemeId, projectId } = await makeScheme(t, { designed: true });
    const source = (await t.agents.engineer.get(`/api/schemes/${schemeId}`)).body.scheme;
    const res = await t.agents.engineer.post(`/api/schemes/${schemeId}/clone`).send({ name: 'Fixture scheme, deeper girders' });
    expect(res.status).toBe(201);
    const copy = res.body.scheme;
    expect(copy.id).not.toBe(schemeId);
    expect(copy).toMatchObject({ projectId, name: 'Fixture scheme, deeper girders', revision: 1, status: 'draft', designStale: false });
    expect(copy.plan).toEqual({ ...source.plan, name: 'Fixture scheme, deeper girders' });
    expect(await models().Member.count({ where: { schemeId: copy.id } })).toBe(11);
    const runs = await models().DesignRun.findAll({ where: { schemeId: copy.id } });
    expect(runs).toHaveLength(1);
    expect(runs[0].getDataValue('revision')).toBe(1);
    const design = await t.agents.drafter.get(`/api/schemes/${copy.id}/design`);
    const sourceDesign = await t.agents.drafter.get(`/api/schemes/${schemeId}/design`);
    expect(design.body.members).toEqual(sourceDesign.body.members);
    expect(design.body.totals).toEqual(sourceDesign.body.totals);
    const revs = await t.agents.drafter.get(`/api/schemes/${copy.id}/revisions`);
    expect(revs.body.revisions[0].note).toBe('Cloned from "Fixture scheme" revision 1');
    // The source is untouched.
    expect(await models().Member.count({ where: { schemeId } })).toBe(11);
  });

  it('when a scheme is cloned without a name, then it is called "<name> (copy)"; a stale design stays stale', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan: twoBayPlan() }).expect(200);
    const res = await t.agents.engineer.post(`/api/schemes/${schemeId}/clone`).send({});
    expect(res.body.scheme.name).toBe('Fixture scheme (copy)');
    expect(res.body.scheme).toMatchObject({ designStale: true, design: { stale: true } });
  });
});

describe('demo building', () => {
  it('when the demo is seeded, then the project has the two clinic schemes, each designed at its revision', async () => {
    const res = await t.agents.manager.get(`/api/projects/${t.seed.projectId}/schemes`);
    const demo = res.body.schemes.filter((s: { name: string }) => DEMO_SCHEMES.some((d) => d.name === s.name));
    expect(demo.map((s: { name: string }) => s.name)).toEqual(DEMO_SCHEMES.map((d) => d.name));
    for (const s of demo) {
      expect(s).toMatchObject({ revision: 1, designStale: false, design: { revision: 1, stale: false, failingMembers: 0, problemCount: 0 } });
    }
    const [a, b] = demo;
    // Builder counts: per level 15 girders + 16 column-line beams + infill (24 at ~10 ft,
    // 36 at ~7.5 ft); four levels (L2, L3, L4, roof).
    expect(a.design.pieces).toBe(4 * (15 + 16 + 24));
    expect(b.design.pieces).toBe(4 * (15 + 16 + 36));
    // 120 ft × 90 ft on four levels less three 20 ft × 5.5 ft stair openings.
    expect(a.design.floorArea_ft2).toBeCloseTo(4 * 120 * 90 - 3 * 20 * 5.5, 6);
    expect(b.design.steelWeight_lb).toBeGreaterThan(a.design.steelWeight_lb);

    const plan = (await t.agents.drafter.get(`/api/schemes/${a.id}`)).body.scheme.plan;
    expect(plan.levels.map((l: { id: string }) => l.id)).toEqual(['L2', 'L3', 'L4', 'R']);
    expect(plan.levels[3].roof).toBe(true);
    expect(plan.columns).toHaveLength(20);
    expect(plan.columns.every((c: { levels: string[] }) => c.levels.length === 4)).toBe(true);
    expect(plan.zones.map((z: { id: string; live_psf: number; liveReducible: boolean }) => [z.id, z.live_psf, z.liveReducible])).toEqual([
      ['office', 50, true],
      ['corridor', 80, true],
      ['mechanical', 125, false],
      ['roof', 0, false],
    ]);
    expect(plan.zones[3]).toMatchObject({ roofLive_psf: 20, snow_psf: 21 });
    expect(plan.openings).toHaveLength(3);
    const design = (await t.agents.drafter.get(`/api/schemes/${a.id}/design`)).body;
    for (const c of ['D', 'L', 'Lr', 'S'] as const) {
      expect(design.equilibrium[c].reactions_kip).toBeCloseTo(design.equilibrium[c].applied_kip, 6);
    }
  });

  it('when the seed runs again, then no scheme, row, revision or design is duplicated', async () => {
    const count = async () =>
      Promise.all([models().Scheme.count(), models().Member.count(), models().PlanRevision.count(), models().DesignRun.count()]);
    const before = await count();
    const started = Date.now();
    await seedDemo(t.ctx.db);
    expect(Date.now() - started).toBeLessThan(3000);
    expect(await count()).toEqual(before);
  });
});
