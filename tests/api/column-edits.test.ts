import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeScheme, twoBayPlan } from './helpers/schemes-fixture';
import { createTestApp, type TestApp } from './helpers/test-app';

// Column edits from the Column stack go through the plan save: splice levels and locked tier
// sizes are stored and designed; drafters and managers are refused; bad tier locks are a 422
// naming the column and field, with the saved plan untouched.

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

/** The fixture with a second level above L2 that every column reaches. */
function twoLevelPlan() {
  const plan = { ...(twoBayPlan() as object), version: 2 } as unknown as { levels: Record<string, unknown>[]; columns: Record<string, unknown>[] };
  plan.levels.push({ id: 'L3', name: 'Level 3', elevation_ft: (plan.levels[0].elevation_ft as number) + 13 });
  plan.columns = plan.columns.map((c) => ({ ...c, levels: ['L2', 'L3'] }));
  return plan;
}

describe('column splices and tier sizes through PUT /api/schemes/:id/plan', () => {
  it('when an engineer splices a column and locks its upper tier, then both are stored, exported and designed', async () => {
    const { schemeId } = await makeScheme(t);
    const plan = twoLevelPlan();
    plan.columns[0] = { ...plan.columns[0], spliceLevels: ['L2'], tierShapes: [{ level: 'L3', shape: 'w14x90' }] };
    const res = await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.repairs).toEqual(['columns[0] (id C-A1): tierShapes[0] shape "w14x90" written as "W14X90"']);
    const exported = JSON.parse((await t.agents.drafter.get(`/api/schemes/${schemeId}/export`)).text);
    expect(exported.columns[0]).toMatchObject({ spliceLevels: ['L2'], tierShapes: [{ level: 'L3', shape: 'W14X90' }] });
    expect(exported.columns[1]).not.toHaveProperty('tierShapes');
    const schedule = await t.agents.drafter.get(`/api/schemes/${schemeId}/schedule`);
    expect(schedule.status).toBe(200);
    const col = schedule.body.columnSchedule.columns.find((c: { id: string }) => c.id === 'C-A1');
    expect(col.spliceLevels).toEqual(['L2']);
    // Two tiers: the length below L3 (tier 2, locked W14X90, checked not replaced) and below L2 (tier 1, sized).
    expect(col.tiers.map((x: { tier: number; shape: string; locked: boolean }) => [x.tier, x.shape, x.locked])).toEqual([
      [2, 'W14X90', true],
      [1, expect.stringMatching(/^W1[024]X\d+$/), false],
    ]);
    expect(col.tierShapes).toEqual([{ level: 'L3', shape: 'W14X90' }]);
  });

  it('when a drafter or a manager saves column splices, then 403 and the plan is untouched', async () => {
    const { schemeId } = await makeScheme(t);
    const plan = twoLevelPlan();
    plan.columns[0] = { ...plan.columns[0], spliceLevels: ['L2'] };
    for (const role of ['drafter', 'manager'] as const) {
      const res = await t.agents[role].put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan });
      expect(res.status).toBe(403);
    }
    expect((await t.ctx.db.models.Scheme.findByPk(schemeId))?.getDataValue('revision')).toBe(1);
  });

  it('when a tier lock names a level the column does not reach or is not a W-shape, then 422 naming the column and field, and nothing is saved', async () => {
    const { schemeId } = await makeScheme(t);
    const plan = twoLevelPlan();
    plan.columns[1] = { ...plan.columns[1], tierShapes: [{ level: 'L7', shape: 'W14X90' }, { level: 'L2', shape: 'HSS6X6X1/2' }] };
    const res = await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan });
    expect(res.status).toBe(422);
    const problems = res.body.error.problems as { code: string; elementId: string; path: string }[];
    expect(problems.map((p) => [p.code, p.elementId, p.path])).toEqual([
      ['column-tier-unreached', plan.columns[1].id, `columns[1] (id ${plan.columns[1].id}).tierShapes[0].level`],
      ['column-shape-not-w', plan.columns[1].id, `columns[1] (id ${plan.columns[1].id}).tierShapes[1].shape`],
    ]);
    expect((await t.ctx.db.models.Scheme.findByPk(schemeId))?.getDataValue('revision')).toBe(1);
  });
});
