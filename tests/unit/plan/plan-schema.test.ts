import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { exportPlanFile, parsePlanFile } from '../../../shared/schemas/plan.schema';
import { migratePlanDocument, type PlanMigration } from '../../../shared/schemas/plan-migrations';

const fixture = () => JSON.parse(readFileSync(new URL('../../fixtures/plans/two-bay.plan.json', import.meta.url), 'utf8'));

describe('parsePlanFile', () => {
  it('when the two-bay fixture is read, then it parses with no repairs and no problems', () => {
    const r = parsePlanFile(fixture());
    expect(r.problems).toEqual([]);
    expect(r.repairs).toEqual([]);
    expect(r.plan?.members).toHaveLength(11);
    expect(r.plan?.decks[0].spanDirection).toBe('x');
  });

  it('when a member has a bad coordinate, then the problem names the path and the member id', () => {
    const doc = fixture();
    doc.members[2].end = [30, 'x'];
    const r = parsePlanFile(doc);
    expect(r.plan).toBeNull();
    expect(r.problems[0].path).toBe('members[2] (id gB12).end[1]');
    expect(r.problems[0].elementId).toBe('gB12');
    expect(r.problems[0].message).toContain('members[2] (id gB12).end[1]');
  });

  it('when the format or version is wrong, then one problem names the field', () => {
    expect(parsePlanFile({ ...fixture(), format: 'other' }).problems[0].path).toBe('format');
    expect(parsePlanFile({ ...fixture(), version: 7 }).problems[0].code).toBe('plan-version-newer');
    expect(parsePlanFile([]).problems[0].code).toBe('plan-not-object');
    expect(parsePlanFile(null).plan).toBeNull();
  });

  it('when loads and openings have no ids, then repair assigns unused ids and lists each', () => {
    const doc = fixture();
    delete doc.pointLoads[0].id;
    delete doc.openings[0].id;
    doc.lineLoads.push({ level: 'L2', start: [0, 36], end: [30, 36], D_klf: 0.2 });
    const r = parsePlanFile(doc);
    expect(r.problems).toEqual([]);
    expect(r.plan!.pointLoads[0].id).toBe('P1');
    expect(r.plan!.openings[0].id).toBe('O1');
    expect(r.plan!.lineLoads[1].id).toBe('W1');
    expect(r.plan!.lineLoads[1].L_klf).toBe(0);
    expect(r.repairs).toEqual([
      'pointLoads[0]: had no id, assigned "P1"',
      'lineLoads[1]: had no id, assigned "W1"',
      'openings[0]: had no id, assigned "O1"',
    ]);
  });

  it('when a polygon is clockwise with a repeated and a closing point, then repair cleans and re-orients it', () => {
    const doc = fixture();
    doc.decks[0].polygon = [[0, 0], [0, 36], [0, 36], [60, 36], [60, 0], [0, 0]];
    const r = parsePlanFile(doc);
    expect(r.problems).toEqual([]);
    expect(r.plan!.decks[0].polygon).toEqual([[60, 0], [60, 36], [0, 36], [0, 0]]);
    expect(r.repairs).toEqual([
      'decks[0] (id d1): 2 duplicate polygon point(s) removed',
      'decks[0] (id d1): clockwise polygon re-oriented counter-clockwise',
    ]);
  });

  it('when references or ids are broken, then repair reports each with the element id', () => {
    const doc = fixture();
    doc.members[0].level = 'L9';
    doc.decks[0].zone = 'lab';
    doc.members[1].id = 'b1';
    doc.openings[0].polygon = [[1, 1], [2, 2], [1, 1]];
    const r = parsePlanFile(doc);
    const codes = r.problems.map((p) => `${p.code}:${p.elementId}`);
    expect(codes).toEqual(['duplicate-id:b1', 'unknown-level:gA12', 'unknown-zone:d1', 'polygon-degenerate:o1']);
  });

  it('when a plan is exported and imported again, then it is identical', () => {
    const first = parsePlanFile(fixture()).plan!;
    const again = parsePlanFile(JSON.parse(JSON.stringify(exportPlanFile(first))));
    expect(again.repairs).toEqual([]);
    expect(again.plan).toEqual(first);
  });
});

describe('migratePlanDocument', () => {
  const steps: PlanMigration[] = [
    { from: 2, describe: 'rename title to name', migrate: (d) => ({ ...d, name: d.title, title: undefined }) },
    { from: 1, describe: 'add tags', migrate: (d) => ({ ...d, tags: [] }) },
  ];
  it('when the file is older than the target, then migrations run in version order and are listed', () => {
    const r = migratePlanDocument({ format: 'baywright-plan', version: 1, title: 'T' }, steps, 3);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.document).toMatchObject({ version: 3, name: 'T', tags: [] });
    expect(r.applied).toEqual(['Migrated from version 1 to 2: add tags', 'Migrated from version 2 to 3: rename title to name']);
  });
  it('when a step is missing, then it reports the gap', () => {
    const r = migratePlanDocument({ format: 'baywright-plan', version: 0 }, steps, 3);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problem.code).toBe('plan-version-gap');
  });
  it('when the file is current, then nothing runs and the input is not mutated', () => {
    const doc = { format: 'baywright-plan', version: 1 };
    const r = migratePlanDocument(doc);
    expect(r.ok && r.applied).toEqual([]);
    expect(doc).toEqual({ format: 'baywright-plan', version: 1 });
  });
});
