import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_UNIT_PRICES } from '../../server/db/seed-demo';
import { createTestApp, type TestApp } from './helpers/test-app';
import { makeScheme } from './helpers/schemes-fixture';
import { WEST_BAY_STUDY } from './helpers/study-fixture';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

const STUDY_BOTH_WAYS = { ...WEST_BAY_STUDY, spacing_ft: { from: 8, to: 15, step: 1 }, directions: ['x', 'y'] };

describe('bay studies', () => {
  it('when an engineer runs a study of the west bay, then 16 options come back priced with the firm’s prices and the study is kept against the revision', async () => {
    const { schemeId } = await makeScheme(t);
    const res = await t.agents.engineer.post(`/api/schemes/${schemeId}/studies`).send(STUDY_BOTH_WAYS);
    expect(res.status).toBe(201);
    const { study } = res.body;
    expect(study).toMatchObject({ schemeId, revision: 1, stale: false, level: 'L2', optionCount: 16 });
    expect(study.result.unitPrices).toEqual({ steel_usd_per_ton: DEMO_UNIT_PRICES.steelUsdPerTon, connection_usd_each: DEMO_UNIT_PRICES.connectionUsdEach });
    const o = study.result.options[0];
    // shared/tonnage/cost.ts: tons of 2,000 lb (common practice) × price per ton + connections × price each
    expect(o.scheme.cost).toBeCloseTo((o.scheme.steelWeight_lb / 2000) * DEMO_UNIT_PRICES.steelUsdPerTon + o.scheme.connections * DEMO_UNIT_PRICES.connectionUsdEach, 6);
    expect(study.result.options.filter((x: { lightest: boolean }) => x.lightest).length).toBeGreaterThan(0);
    expect(study.result.caution).toMatch(/licensed engineer/);

    const stored = await t.ctx.db.models.BayStudy.findByPk(study.id);
    expect(stored?.getDataValue('optionCount')).toBe(16);
    expect(stored?.getDataValue('revision')).toBe(1);

    const list = await t.agents.manager.get(`/api/schemes/${schemeId}/studies`);
    expect(list.status).toBe(200);
    expect(list.body.studies.map((s: { id: string }) => s.id)).toEqual([study.id]);
    const one = await t.agents.drafter.get(`/api/schemes/${schemeId}/studies/${study.id}`);
    expect(one.status).toBe(200);
    expect(one.body.study.result.options).toEqual(study.result.options);
  });

  it('when the range is bad (step 0, negative spacing, thousands of options), then 422 naming the field and nothing is stored', async () => {
    const { schemeId } = await makeScheme(t);
    const before = await t.ctx.db.models.BayStudy.count();
    const zero = await t.agents.engineer.post(`/api/schemes/${schemeId}/studies`).send({ ...WEST_BAY_STUDY, spacing_ft: { from: 6, to: 15, step: 0 } });
    expect(zero.status).toBe(422);
    expect(zero.body.error).toMatchObject({ code: 'study_invalid', fields: { 'spacing_ft.step': 'must be more than 0 ft (got 0)' } });
    const negative = await t.agents.engineer.post(`/api/schemes/${schemeId}/studies`).send({ ...WEST_BAY_STUDY, spacing_ft: { from: -3, to: 15, step: 1 } });
    expect(negative.body.error.fields).toEqual({ 'spacing_ft.from': 'must be more than 0 ft (got -3)' });
    const many = await t.agents.engineer.post(`/api/schemes/${schemeId}/studies`).send({ ...WEST_BAY_STUDY, spacing_ft: { from: 1, to: 100, step: 0.5 }, directions: ['x', 'y'] });
    expect(many.status).toBe(422);
    expect(many.body.error.fields['spacing_ft.step'] ?? many.body.error.fields.spacing_ft).toMatch(/at most 200/);
    const level = await t.agents.engineer.post(`/api/schemes/${schemeId}/studies`).send({ ...WEST_BAY_STUDY, region: { level: 'L7', wholeLevel: true } });
    expect(level.status).toBe(422);
    expect(level.body.error.fields).toEqual({ 'region.level': 'the plan has no level "L7"' });
    expect(await t.ctx.db.models.BayStudy.count()).toBe(before);
  });

  it('when a manager or drafter runs a study or makes a scheme from one, then 403', async () => {
    const { schemeId } = await makeScheme(t);
    for (const role of ['manager', 'drafter'] as const) {
      expect((await t.agents[role].post(`/api/schemes/${schemeId}/studies`).send(WEST_BAY_STUDY)).status).toBe(403);
    }
  });

  it('when the lightest option is made a scheme, then the new scheme’s Tonnage equals the option’s scheme figures', async () => {
    const { schemeId, projectId } = await makeScheme(t);
    const { body } = await t.agents.engineer.post(`/api/schemes/${schemeId}/studies`).send(STUDY_BOTH_WAYS);
    const best = body.study.result.options.find((o: { lightest: boolean }) => o.lightest);
    const made = await t.agents.engineer.post(`/api/schemes/${schemeId}/studies/${body.study.id}/schemes`).send({ optionId: best.id });
    expect(made.status).toBe(201);
    expect(made.body.scheme.name).toMatch(/^Fixture scheme – beams [xy] @ \d+ ft, Fy 50$/);
    expect(made.body.scheme.projectId).toBe(projectId);

    const cmp = await t.agents.manager.get(`/api/projects/${projectId}/comparison`);
    expect(cmp.status).toBe(200);
    const row = cmp.body.schemes.find((s: { id: string }) => s.id === made.body.scheme.id);
    expect(row.totals.steelWeight_lb).toBeCloseTo(best.scheme.steelWeight_lb, 9);
    expect(row.totals.pieces).toBe(best.scheme.pieces);
    expect(row.totals.cost_usd).toBeCloseTo(best.scheme.cost, 6);
  });

  it('when the plan was saved after the study, then making a scheme from it is refused as stale (409) and no scheme is added', async () => {
    const { schemeId } = await makeScheme(t);
    const { body } = await t.agents.engineer.post(`/api/schemes/${schemeId}/studies`).send(WEST_BAY_STUDY);
    const plan = (await t.agents.engineer.get(`/api/schemes/${schemeId}`)).body.scheme.plan;
    expect((await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan: { ...plan, name: 'Edited' } })).status).toBe(200);
    const before = await t.ctx.db.models.Scheme.count();
    const made = await t.agents.engineer.post(`/api/schemes/${schemeId}/studies/${body.study.id}/schemes`).send({ optionId: body.study.result.options[0].id });
    expect(made.status).toBe(409);
    expect(made.body.error.code).toBe('study_stale');
    expect(await t.ctx.db.models.Scheme.count()).toBe(before);
    const unknown = await t.agents.engineer.post(`/api/schemes/${schemeId}/studies`).send({ ...WEST_BAY_STUDY, revision: 1 });
    expect(unknown.status).toBe(409);
    expect(unknown.body.error.fields).toEqual({ revision: 'the scheme is at revision 2' });
  });

  it('when a study tries composite and bare steel on a slab plan, then the composite option is lighter, a bad value names composite.0, and a scheme made from it is composite in the bay', async () => {
    const { schemeId, projectId } = await makeScheme(t);
    const plan = (await t.agents.engineer.get(`/api/schemes/${schemeId}`)).body.scheme.plan;
    // An invented slab build-up of our own over every deck (calc-interface.md "Additions" field names).
    const slab = { ribHeight_in: 3, toppingThickness_in: 3.25, ribAvgWidth_in: 6, ribSpacing_in: 12, concreteWeight_pcf: 115, fc_ksi: 3, deckWeight_psf: 2 };
    const withSlab = { ...plan, decks: plan.decks.map((d: Record<string, unknown>) => ({ ...d, slab })) };
    expect((await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan: withSlab })).status).toBe(200);

    const bad = await t.agents.engineer.post(`/api/schemes/${schemeId}/studies`).send({ ...WEST_BAY_STUDY, composite: ['yes'] });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields)).toEqual(['composite.0']);

    const res = await t.agents.engineer.post(`/api/schemes/${schemeId}/studies`).send({ ...WEST_BAY_STUDY, spacing_ft: { from: 10, to: 10, step: 1 }, composite: [true, false] });
    expect(res.status).toBe(201);
    const [c, b] = res.body.study.result.options;
    expect([c.id, c.composite, b.id, b.composite]).toEqual(['y-s10-dany-f50-c', true, 'y-s10-dany-f50-b', false]);
    // AISC 360-16 I3.2a: composite flexural strength exceeds the bare steel's (common practice: lighter framing).
    expect(c.scheme.steelWeight_lb).toBeLessThan(b.scheme.steelWeight_lb);
    expect(c.lightest).toBe(true);

    const made = await t.agents.engineer.post(`/api/schemes/${schemeId}/studies/${res.body.study.id}/schemes`).send({ optionId: c.id });
    expect(made.status).toBe(201);
    expect(made.body.scheme.name).toBe('Fixture scheme – beams y @ 10 ft, Fy 50, composite');
    const madePlan = (await t.agents.engineer.get(`/api/schemes/${made.body.scheme.id}`)).body.scheme.plan;
    const west = madePlan.members.filter((m: { start: number[]; end: number[] }) => Math.max(m.start[0], m.end[0]) <= 30);
    expect(west.length).toBeGreaterThan(0);
    expect(west.every((m: { composite?: boolean }) => m.composite === true)).toBe(true);
    const cmp = await t.agents.manager.get(`/api/projects/${projectId}/comparison`);
    const row = cmp.body.schemes.find((s: { id: string }) => s.id === made.body.scheme.id);
    expect(row.totals.steelWeight_lb).toBeCloseTo(c.scheme.steelWeight_lb, 9);
  });
});
