import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeScheme, twoBayPlan } from './helpers/schemes-fixture';
import { createTestApp, type TestApp } from './helpers/test-app';

// Two saves from the same base revision (two engineers with the scheme open): the later one
// is merged with the earlier on element ids. Different elements → both kept in a new
// revision, and the answer says what was taken in; the same element changed both ways → 409
// naming it by mark and grid location, and nothing is written.

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

type Member = { id: string; shape: string | null; mark?: string };
type PlanJson = { members: Member[]; pointLoads: { id: string; D_kip: number }[] };

/** The fixture plan with the marks the design issues (saved by the client with every edit). */
function markedPlan(): PlanJson {
  const plan = twoBayPlan() as unknown as PlanJson;
  const marks: Record<string, string> = { gA12: '2G1', gA23: '2G1', gB12: '2G1', gB23: '2G1', b1: '2B2', b2: '2B1', b3: '2B1', b4: '2B3', b5: '2B1', b6: '2B1', b7: '2B2' };
  for (const m of plan.members) m.mark = marks[m.id];
  return plan;
}

const withShape = (plan: PlanJson, id: string, shape: string): PlanJson => ({ ...plan, members: plan.members.map((m) => (m.id === id ? { ...m, shape } : m)) });

async function markedScheme(): Promise<string> {
  const { schemeId } = await makeScheme(t);
  const res = await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan: markedPlan() });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  expect(res.body.revision).toBe(2);
  return schemeId;
}

async function storedShapes(schemeId: string): Promise<Record<string, string | null>> {
  const rows = await t.ctx.db.models.Member.findAll({ where: { schemeId } });
  return Object.fromEntries(rows.map((r) => [r.getDataValue('elementId'), r.getDataValue('shape')]));
}

describe('PUT /api/schemes/:id/plan from an older revision', () => {
  it('when two saves from the same base touch different members, then both are kept in a new revision and the later is told what was merged in', async () => {
    const schemeId = await markedScheme();
    // The owner sizes beam b2; the engineer, still on revision 2, sizes beam b6 and adds a point load.
    const owner = await t.agents.owner.put(`/api/schemes/${schemeId}/plan`).send({ revision: 2, plan: withShape(markedPlan(), 'b2', 'W21X44') });
    expect(owner.status).toBe(200);
    expect(owner.body.revision).toBe(3);
    expect(owner.body.merged).toBeUndefined();

    const mine = withShape(markedPlan(), 'b6', 'W18X35');
    mine.pointLoads = [...mine.pointLoads, { ...mine.pointLoads[0], id: 'p2', D_kip: 4 }];
    const res = await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 2, plan: mine });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.revision).toBe(4);
    expect(res.body.merged).toMatchObject({ basedOn: 2, mergedWith: 3, by: ['Imogen Ashdown'] });
    // Named as the drawing names it: mark 2B1, between grid lines A–B, 10 ft past line 1.
    expect(res.body.merged.changes).toEqual([`beam 2B1 at A–B / 1+10'-0": size W21X44`]);
    expect(res.body.merged.plan.members.find((m: Member) => m.id === 'b2').shape).toBe('W21X44');

    // Stored: both sizes and the new load, at revision 4; revision 3 (the owner's) is kept.
    const shapes = await storedShapes(schemeId);
    expect(shapes.b2).toBe('W21X44');
    expect(shapes.b6).toBe('W18X35');
    expect(await t.ctx.db.models.PointLoad.count({ where: { schemeId } })).toBe(2);
    const scheme = await t.ctx.db.models.Scheme.findByPk(schemeId);
    expect(scheme!.getDataValue('revision')).toBe(4);
    const rev = await t.ctx.db.models.PlanRevision.findOne({ where: { schemeId, revision: 4 } });
    expect(rev!.getDataValue('note')).toBe('Merged with revision 3');
    expect(await t.ctx.db.models.PlanRevision.count({ where: { schemeId } })).toBe(4);
  });

  it('when two saves from the same base change the same member differently, then 409 names it by mark and grid location and nothing is written', async () => {
    const schemeId = await markedScheme();
    await t.agents.owner.put(`/api/schemes/${schemeId}/plan`).send({ revision: 2, plan: withShape(markedPlan(), 'b2', 'W21X44') }).expect(200);

    // The engineer changed b2 too (and b6, which the owner left alone).
    const mine = withShape(withShape(markedPlan(), 'b2', 'W24X55'), 'b6', 'W18X35');
    const res = await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 2, plan: mine });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('revision_conflict');
    expect(res.body.error.conflicts).toEqual([{ kind: 'members', id: 'b2', label: `beam 2B1 at A–B / 1+10'-0"`, mine: 'size W24X55', theirs: 'size W21X44' }]);
    expect(res.body.error.message).toContain(`Imogen Ashdown`);
    expect(res.body.error.message).toContain(`beam 2B1 at A–B / 1+10'-0"`);
    expect(res.body.error.message).not.toMatch(/\bb2\b/);
    expect(res.body.error.current.revision).toBe(3);
    // Nothing of the engineer's was written; the owner's save stands.
    const shapes = await storedShapes(schemeId);
    expect(shapes.b2).toBe('W21X44');
    expect(shapes.b6).toBeNull();
    expect((await t.ctx.db.models.Scheme.findByPk(schemeId))!.getDataValue('revision')).toBe(3);

    // The engineer keeps theirs for b2 and saves on revision 3: b6 goes in, b2 stays the owner's.
    const resolved = withShape(withShape(markedPlan(), 'b2', 'W21X44'), 'b6', 'W18X35');
    const again = await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 3, plan: resolved });
    expect(again.status).toBe(200);
    expect(again.body.revision).toBe(4);
    expect(await storedShapes(schemeId)).toMatchObject({ b2: 'W21X44', b6: 'W18X35' });
  });

  it('when two saves of different members race on the same revision, then both succeed and the scheme ends with both', async () => {
    const schemeId = await markedScheme();
    const answers = await Promise.all([
      t.agents.owner.put(`/api/schemes/${schemeId}/plan`).send({ revision: 2, plan: withShape(markedPlan(), 'b2', 'W21X44') }),
      t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 2, plan: withShape(markedPlan(), 'b6', 'W18X35') }),
    ]);
    expect(answers.map((a) => a.status)).toEqual([200, 200]);
    expect(answers.map((a) => a.body.revision).sort()).toEqual([3, 4]);
    expect(await storedShapes(schemeId)).toMatchObject({ b2: 'W21X44', b6: 'W18X35' });
    expect((await t.ctx.db.models.Scheme.findByPk(schemeId))!.getDataValue('revision')).toBe(4);
  });

  it('when the later save changed nothing the earlier did not, then no revision is written and the answer carries their plan', async () => {
    const schemeId = await markedScheme();
    await t.agents.owner.put(`/api/schemes/${schemeId}/plan`).send({ revision: 2, plan: withShape(markedPlan(), 'b2', 'W21X44') }).expect(200);
    const res = await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 2, plan: markedPlan() });
    expect(res.status).toBe(200);
    expect(res.body.revision).toBe(3);
    expect(res.body.merged.plan.members.find((m: Member) => m.id === 'b2').shape).toBe('W21X44');
    expect(await t.ctx.db.models.PlanRevision.count({ where: { schemeId } })).toBe(3);
  });

  it('when their save removed the level my new beam is on, then 409 says the merge cannot be saved and nothing is written', async () => {
    const schemeId = await markedScheme();
    const two = { ...(markedPlan() as unknown as Record<string, unknown>) } as Record<string, unknown> & { levels: { id: string; name: string; elevation_ft: number }[]; members: Record<string, unknown>[] };
    two.levels = [...two.levels, { id: 'L3', name: 'Level 3', elevation_ft: 28 }];
    const at3 = await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 2, plan: two });
    expect(at3.status, JSON.stringify(at3.body)).toBe(200);
    // The owner removes Level 3; the engineer, on revision 3, draws a beam on it.
    await t.agents.owner.put(`/api/schemes/${schemeId}/plan`).send({ revision: 3, plan: markedPlan() }).expect(200);
    const mine = structuredClone(two);
    mine.members.push({ id: 'b30', level: 'L3', kind: 'beam', start: [5, 0], end: [5, 36], shape: null, maxDepth_in: null });
    const res = await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 3, plan: mine });
    expect(res.status).toBe(409);
    expect(res.body.error.conflicts).toEqual([]);
    expect(res.body.error.mergeProblem).toMatch(/level/i);
    expect((await t.ctx.db.models.Scheme.findByPk(schemeId))!.getDataValue('revision')).toBe(4);
  });
});
