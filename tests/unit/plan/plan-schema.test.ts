import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { exportPlanFile, parsePlanFile } from '../../../shared/schemas/plan.schema';
import { migratePlanDocument, type PlanMigration } from '../../../shared/schemas/plan-migrations';

const V1_TO_V2 = 'Migrated from version 1 to 2: composite settings added with composite off (members follow them, studs designed, columns sized)';
const fixture = () => JSON.parse(readFileSync(new URL('../../fixtures/plans/two-bay.plan.json', import.meta.url), 'utf8'));

describe('parsePlanFile', () => {
  it('when the two-bay fixture (version 1) is read, then it migrates to version 2 and parses with no other repairs and no problems', () => {
    const r = parsePlanFile(fixture());
    expect(r.problems).toEqual([]);
    expect(r.repairs).toEqual([V1_TO_V2]);
    expect(r.plan?.version).toBe(2);
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
      V1_TO_V2,
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
      V1_TO_V2,
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

  it('when repairs are made (repaired in place on the schema output), then the document read is not changed and a second read repairs again alike', () => {
    const doc = fixture();
    doc.version = 2;
    doc.composite = { enabled: false };
    delete doc.pointLoads[0].id;
    doc.members[0].shape = ' w18x35 ';
    doc.decks[0].polygon = [[0, 0], [0, 36], [0, 36], [60, 36], [60, 0], [0, 0]];
    doc.columns[0].levels = [...doc.columns[0].levels, doc.columns[0].levels[0]];
    const before = JSON.stringify(doc);
    const first = parsePlanFile(doc);
    expect(first.problems).toEqual([]);
    expect(first.plan!.members[0].shape).toBe('W18X35');
    expect(first.plan!.pointLoads[0].id).toBe('P1');
    expect(first.plan!.decks[0].polygon).toEqual([[60, 0], [60, 36], [0, 36], [0, 0]]);
    // The caller's document is as it was: nothing of it is shared with the plan, so nothing was repaired in it.
    expect(JSON.stringify(doc)).toBe(before);
    expect(first.plan!.members[0]).not.toBe(doc.members[0]);
    expect(first.plan!.decks[0].polygon).not.toBe(doc.decks[0].polygon);
    const second = parsePlanFile(doc);
    expect(second.repairs).toEqual(first.repairs);
    expect(second.plan).toEqual(first.plan);
    // Defaults the schema fills in are not shared between reads (a repair or an edit of one plan never reaches another).
    second.plan!.designBasis.deflectionLimits.live = 480;
    expect(parsePlanFile(doc).plan!.designBasis.deflectionLimits.live).toBe(first.plan!.designBasis.deflectionLimits.live);
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
    const doc = { format: 'baywright-plan', version: 2 };
    const r = migratePlanDocument(doc);
    expect(r.ok && r.applied).toEqual([]);
    expect(doc).toEqual({ format: 'baywright-plan', version: 2 });
  });
});

describe('plan file version 1 → 2 (calc-interface.md "Additions for composite beams and columns")', () => {
  it('when a version 1 file is read, then composite is off with the published defaults, members follow it with studs designed, columns are sized, and nothing else changes', () => {
    const v1 = fixture();
    const r = parsePlanFile(v1);
    const plan = r.plan!;
    // calc-interface.md "Additions": the defaults shown, version 1 files migrate to enabled: false
    expect(plan.designBasis.composite).toEqual({
      enabled: false, studDiameter_in: 0.75, studFu_ksi: 65, minPercentComposite: 0.25, constructionLive_psf: 20, shored: false, camber: true,
    });
    // members[].composite / studs and columns[].shape default to null; absent reads as null
    expect(plan.members.every((m) => (m.composite ?? null) === null && (m.studs ?? null) === null)).toBe(true);
    expect(plan.columns.every((c) => (c.shape ?? null) === null && c.spliceLevels === undefined)).toBe(true);
    expect(plan.decks.every((d) => d.slab === undefined)).toBe(true);
    // the rest of the file is untouched
    expect(plan.members.map((m) => [m.id, m.start, m.end, m.shape])).toEqual(v1.members.map((m: { id: string; start: unknown; end: unknown; shape: unknown }) => [m.id, m.start, m.end, m.shape]));
    expect(plan.zones).toEqual(v1.zones);
  });

  it('when a version 1 file already carries a version 2 field, then the migration keeps it', () => {
    const doc = fixture();
    doc.members[0].studs = 12;
    doc.designBasis.composite = { enabled: true };
    const plan = parsePlanFile(doc).plan!;
    expect(plan.members[0].studs).toBe(12);
    expect(plan.designBasis.composite).toMatchObject({ enabled: true, studDiameter_in: 0.75, minPercentComposite: 0.25 });
  });

  it('when a version 2 file with every new field is exported and imported again, then it is identical', () => {
    const doc = { ...fixture(), version: 2 };
    doc.designBasis.composite = { enabled: true, studDiameter_in: 0.75, studFu_ksi: 65, minPercentComposite: 0.3, constructionLive_psf: 20, shored: false, camber: true, studEquivalentWeight_lb: 10 };
    doc.decks[0].slab = { ribHeight_in: 3, toppingThickness_in: 3.25, ribAvgWidth_in: 6, ribSpacing_in: 12, concreteWeight_pcf: 115, fc_ksi: 3, deckWeight_psf: 2 };
    doc.members[0].composite = false;
    doc.members[1].studs = 20;
    doc.columns[0].shape = 'W10X33';
    doc.columns[0].spliceLevels = ['L2'];
    const first = parsePlanFile(doc);
    expect(first.problems).toEqual([]);
    expect(first.repairs).toEqual([]);
    const again = parsePlanFile(JSON.parse(JSON.stringify(exportPlanFile(first.plan!))));
    expect(again.repairs).toEqual([]);
    expect(again.plan).toEqual(first.plan);
    expect(again.plan!.decks[0].slab?.concreteWeight_pcf).toBe(115);
    expect(again.plan!.columns[0]).toMatchObject({ shape: 'W10X33', spliceLevels: ['L2'] });
  });

  it('when a version 2 field is malformed, then the problem names its path and element', () => {
    const doc = { ...fixture(), version: 2 };
    doc.members[1].studs = -3;
    doc.decks[0].slab = { ribHeight_in: 3, toppingThickness_in: 3.25, ribAvgWidth_in: 14, ribSpacing_in: 12, concreteWeight_pcf: 115, fc_ksi: 3, deckWeight_psf: 2 };
    const r = parsePlanFile(doc);
    expect(r.plan).toBeNull();
    expect(r.problems.map((p) => p.path)).toEqual(['members[1] (id gA23).studs', 'decks[0] (id d1).slab.ribAvgWidth_in']);
  });
});
