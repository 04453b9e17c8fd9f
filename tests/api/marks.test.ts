import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeScheme, twoBayPlan } from './helpers/schemes-fixture';
import { createTestApp, type TestApp } from './helpers/test-app';

// Piece marks: manual marks (locked) with the per-level sharing rule, stale revisions,
// renumbering with and without the manual ones, and who may do it.

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

const storedMember = async (schemeId: string, id: string) =>
  (await t.ctx.db.models.Member.findOne({ where: { schemeId, elementId: id }, raw: true })) as unknown as {
    mark: string | null;
    markLocked: boolean | number | null;
  };

const marksOf = async (schemeId: string) => {
  const res = await t.agents.drafter.get(`/api/schemes/${schemeId}/design`);
  expect(res.status).toBe(200);
  return { stale: res.body.stale as boolean, revision: res.body.revision as number, byId: new Map<string, string>(res.body.members.map((m: { id: string; mark: string }) => [m.id, m.mark])) };
};

describe('PATCH /api/schemes/:id/marks', () => {
  it('when a drafter sets a mark, then it is locked, saved as a new revision, and the design carries it without going stale', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    const before = await marksOf(schemeId);
    expect(before.byId.get('b2')).toBe('2B2');
    const res = await t.agents.drafter.patch(`/api/schemes/${schemeId}/marks`).send({ revision: 1, marks: [{ memberId: 'b2', mark: ' 2B9 ' }] });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.revision).toBe(2);
    expect(res.body.marks.find((m: { memberId: string }) => m.memberId === 'b2')).toEqual({ memberId: 'b2', level: 'L2', mark: '2B9', manual: true });
    const stored = await storedMember(schemeId, 'b2');
    expect(stored.mark).toBe('2B9');
    expect(Boolean(stored.markLocked)).toBe(true);
    expect(await t.ctx.db.models.PlanRevision.count({ where: { schemeId } })).toBe(2);
    const after = await marksOf(schemeId);
    expect(after).toMatchObject({ stale: false, revision: 2 });
    expect(after.byId.get('b2')).toBe('2B9');
    // The others of b2's design keep the rule's mark.
    expect(after.byId.get('b3')).toBe('2B2');
  });

  it('when two members of one size and span get the same manual mark, then it is accepted', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    const res = await t.agents.engineer.patch(`/api/schemes/${schemeId}/marks`).send({
      revision: 1,
      marks: [{ memberId: 'b3', mark: 'B-INT' }, { memberId: 'b5', mark: 'B-INT' }],
    });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
  });

  it('when a manual mark would be shared by members of different sizes on a level, then 422 names the member and the mark and nothing is saved', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    // b1 is an edge beam (W18X35 in the two-bay design), b2 an interior one (W21X48).
    const res = await t.agents.drafter.patch(`/api/schemes/${schemeId}/marks`).send({
      revision: 1,
      marks: [{ memberId: 'b1', mark: '2B5' }, { memberId: 'b2', mark: '2B5' }],
    });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('marks_invalid');
    expect(res.body.error.message).toContain('Mark 2B5 on Level 2');
    // By kind and grid location: b1 lies on line 1, b2 10 ft east of it.
    expect(res.body.error.message).toContain('the beam at A–B / 1 (');
    expect(res.body.error.message).toContain(`the beam at A–B / 1+10'-0" is`);
    expect(res.body.error).toMatchObject({ memberId: 'b2', mark: '2B5' });
    expect((await storedMember(schemeId, 'b2')).mark).toBeNull();
    expect(await t.ctx.db.models.PlanRevision.count({ where: { schemeId } })).toBe(1);
  });

  it('when the member is not in the scheme, then 422 names it', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    const res = await t.agents.drafter.patch(`/api/schemes/${schemeId}/marks`).send({ revision: 1, marks: [{ memberId: 'nope', mark: 'X1' }] });
    expect(res.status).toBe(422);
    expect(res.body.error.message).toBe('A member of this mark edit is not in this scheme (deleted since it was opened?); reload the plan and edit the marks again.');
    // The id stays where a program reads it: the field key and the details.
    expect(res.body.error.fields).toHaveProperty(['marks.nope']);
  });

  it('when the mark is blank or too long, then 400 names the field', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    const blank = await t.agents.drafter.patch(`/api/schemes/${schemeId}/marks`).send({ revision: 1, marks: [{ memberId: 'b2', mark: '  ' }] });
    expect(blank.status).toBe(400);
    expect(Object.keys(blank.body.error.fields)).toEqual(['marks.0.mark']);
    const long = await t.agents.drafter.patch(`/api/schemes/${schemeId}/marks`).send({ revision: 1, marks: [{ memberId: 'b2', mark: 'M'.repeat(41) }] });
    expect(long.status).toBe(400);
  });

  it('when the revision is stale, then 409 revision_conflict and the newer plan is untouched', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    const save = await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan: twoBayPlan() });
    expect(save.status).toBe(200);
    const res = await t.agents.drafter.patch(`/api/schemes/${schemeId}/marks`).send({ revision: 1, marks: [{ memberId: 'b2', mark: '2B9' }] });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('revision_conflict');
    expect(res.body.error.current).toEqual({ revision: 2 });
    expect((await storedMember(schemeId, 'b2')).mark).toBeNull();
  });

  it('when a manual mark is released (null), then the member goes back to the rule', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    await t.agents.drafter.patch(`/api/schemes/${schemeId}/marks`).send({ revision: 1, marks: [{ memberId: 'b2', mark: 'ZZ1' }] });
    const res = await t.agents.drafter.patch(`/api/schemes/${schemeId}/marks`).send({ revision: 2, marks: [{ memberId: 'b2', mark: null }] });
    expect(res.status).toBe(200);
    expect(res.body.marks.find((m: { memberId: string }) => m.memberId === 'b2')).toMatchObject({ mark: '2B2', manual: false });
  });
});

describe('marks once issued stay put', () => {
  it('when one member of a mark is given that same mark by hand, then the others keep it and no later mark moves', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    const before = await marksOf(schemeId);
    const sharers = [...before.byId].filter(([, mark]) => mark === before.byId.get('b3')).map(([id]) => id);
    expect(sharers.length).toBeGreaterThan(1);
    const res = await t.agents.drafter.patch(`/api/schemes/${schemeId}/marks`).send({ revision: 1, marks: [{ memberId: 'b3', mark: before.byId.get('b3') }] });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const after = await marksOf(schemeId);
    expect(Object.fromEntries(after.byId)).toEqual(Object.fromEntries(before.byId));
  });

  it('when an engineer adds an unrelated beam first in plan order, then every existing mark stays and the new beam gets the next number', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    // A drafter's edit stores the marks as issued on every member.
    expect((await t.agents.drafter.patch(`/api/schemes/${schemeId}/marks`).send({ revision: 1, marks: [{ memberId: 'gA12', mark: '2G1' }] })).status).toBe(200);
    const before = await marksOf(schemeId);
    const plan = (await t.agents.engineer.get(`/api/schemes/${schemeId}/export`)).body;
    // A beam west of the framing, column to column, carries only itself (a new design that
    // changes no other member) and sits first among the beams in plan order (midpoint y = 0).
    plan.columns.push({ id: 'C-W', x_ft: -20, y_ft: 0, levels: ['L2'] });
    plan.members.push({ id: 'bNew', level: 'L2', kind: 'beam', start: [-20, 0], end: [0, 0], shape: null, maxDepth_in: null });
    const put = await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: 2, plan });
    expect(put.status, JSON.stringify(put.body)).toBe(200);
    expect((await t.agents.engineer.post(`/api/schemes/${schemeId}/design`).send({})).status).toBe(200);
    const after = await marksOf(schemeId);
    for (const [id, mark] of before.byId) expect(after.byId.get(id), id).toBe(mark);
    const highest = Math.max(...[...before.byId.values()].filter((m) => /^2B\d+$/.test(m)).map((m) => Number(m.slice(2))));
    expect(after.byId.get('bNew')).toBe(`2B${highest + 1}`);
  });

  it('when a drafter gives a member a mark another design already carries, then 422 names both members and nothing is saved', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    const before = await marksOf(schemeId);
    const otherMark = before.byId.get('b2')!;
    expect(otherMark).not.toBe(before.byId.get('b1'));
    const res = await t.agents.drafter.patch(`/api/schemes/${schemeId}/marks`).send({ revision: 1, marks: [{ memberId: 'b1', mark: otherMark }] });
    expect(res.status).toBe(422);
    // Both members by kind and grid location (b2 is 10 ft east of line 1, b1 on line 1), never by id.
    expect(res.body.error.message).toContain(`Mark ${otherMark} on Level 2 is already used by the beam at A–B / 1+10'-0"`);
    expect(res.body.error.message).toContain(`the beam at A–B / 1 is`);
    expect(res.body.error.message).not.toMatch(/\bb[12]\b/);
    expect(await t.ctx.db.models.PlanRevision.count({ where: { schemeId } })).toBe(1);
  });
});

describe('POST /api/schemes/:id/marks/renumber', () => {
  async function withManualMark() {
    const { schemeId } = await makeScheme(t, { designed: true });
    const res = await t.agents.drafter.patch(`/api/schemes/${schemeId}/marks`).send({ revision: 1, marks: [{ memberId: 'b2', mark: '2B9' }] });
    expect(res.status).toBe(200);
    return schemeId;
  }

  it('when keepManual is true, then manual marks stay and nothing needs saving', async () => {
    const schemeId = await withManualMark();
    const res = await t.agents.drafter.post(`/api/schemes/${schemeId}/marks/renumber`).send({ keepManual: true });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ revision: 2, changed: false });
    expect(res.body.marks.find((m: { memberId: string }) => m.memberId === 'b2')).toMatchObject({ mark: '2B9', manual: true });
    expect(Boolean((await storedMember(schemeId, 'b2')).markLocked)).toBe(true);
  });

  it('when keepManual is false, then manual marks are released and every member is marked by the rule in a new revision', async () => {
    const schemeId = await withManualMark();
    const res = await t.agents.drafter.post(`/api/schemes/${schemeId}/marks/renumber`).send({ keepManual: false });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ revision: 3, changed: true });
    expect(res.body.marks.find((m: { memberId: string }) => m.memberId === 'b2')).toMatchObject({ mark: '2B2', manual: false });
    // Stored as issued (not locked), so later designs keep it.
    const stored = await storedMember(schemeId, 'b2');
    expect(stored.mark).toBe('2B2');
    expect(stored.markLocked).toBeNull();
    const design = await marksOf(schemeId);
    expect(design).toMatchObject({ stale: false, revision: 3 });
    expect(design.byId.get('b2')).toBe('2B2');
  });
});

describe('roles', () => {
  it('when a drafter tries to change geometry, loads, sizes or run a design, then 403 and nothing changes', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    const plan = twoBayPlan() as { members: { id: string; shape: string | null }[] };
    plan.members[0].shape = 'W24X55';
    const put = await t.agents.drafter.put(`/api/schemes/${schemeId}/plan`).send({ revision: 1, plan });
    expect(put.status).toBe(403);
    expect((await t.agents.drafter.post(`/api/schemes/${schemeId}/design`)).status).toBe(403);
    const row = await t.ctx.db.models.Scheme.findByPk(schemeId);
    expect(row?.getDataValue('revision')).toBe(1);
  });

  it('when a manager tries to edit or renumber marks, then 403', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    const patch = await t.agents.manager.patch(`/api/schemes/${schemeId}/marks`).send({ revision: 1, marks: [{ memberId: 'b2', mark: '2B9' }] });
    expect(patch.status).toBe(403);
    const renumber = await t.agents.manager.post(`/api/schemes/${schemeId}/marks/renumber`).send({ keepManual: false });
    expect(renumber.status).toBe(403);
  });
});
