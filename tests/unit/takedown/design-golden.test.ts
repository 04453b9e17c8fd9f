/**
 * Golden test: the full output of the takedown and the whole-scheme design, compared number for
 * number with a snapshot committed before the performance work on them. Any change to a result
 * (a reaction, a load, a design, a mark, a problem) fails here. JSON keeps every finite double
 * exactly (shortest round-trip form), so equality of the parsed values is bit-for-bit.
 *
 * To re-record after a deliberate change to results: BAYWRIGHT_UPDATE_GOLDEN=1 npx vitest run
 * --project unit tests/unit/takedown/design-golden.test.ts, and say why in the commit.
 */
import { describe, expect, it } from 'vitest';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { parsePlanFile, type Plan, type PlanMember } from '../../../shared/schemas/plan.schema';
import { designScheme } from '../../../shared/engine/scheme/design-scheme.scheme';
import { runTakedown, type TakedownResult } from '../../../shared/engine/takedown/gravity-takedown.takedown';
import { differences } from './differences';

const SNAPSHOT = new URL('./design-golden.snapshot.json', import.meta.url);

const twoBay = (): Plan => parsePlanFile(JSON.parse(readFileSync(new URL('../../fixtures/plans/two-bay.plan.json', import.meta.url), 'utf8'))).plan!;

/**
 * An invented three-storey building of our own (fixed here, independent of the benchmark): 30 ft
 * bays, beams at 7.5 ft, an office/corridor zone split, stair openings, a façade line load along a
 * girder, a line load across the deck, point loads on the deck and on a member, a locked shape, a
 * depth limit, a deck spanning y in one bay of the top floor, and a roof.
 */
export function goldenBuildingPlan(): Plan {
  const bay = 30;
  const baysX = 3;
  const baysY = 2;
  const beamsPerBay = 4;
  const levelIds = ['L2', 'L3', 'L4'];
  const levels = levelIds.map((id, i) => ({ id, name: `Level ${i + 2}`, elevation_ft: 14 * (i + 1), ...(i === levelIds.length - 1 ? { roof: true } : {}) }));
  const X = baysX * bay;
  const Y = baysY * bay;
  const plan: Plan = {
    format: 'baywright-plan',
    version: 2,
    name: 'Golden: three-storey building',
    designBasis: { method: 'LRFD', Fy_ksi: 50, liveLoadReduction: true, deflectionLimits: { live: 360, total: 240 } },
    levels,
    columns: [],
    members: [],
    zones: [
      { id: 'office', name: 'Office', dead_psf: 50, superimposedDead_psf: 15, partition_psf: 15, live_psf: 50, liveReducible: true, roofLive_psf: 0, snow_psf: 0 },
      { id: 'corridor', name: 'Corridor', dead_psf: 50, superimposedDead_psf: 15, partition_psf: 0, live_psf: 80, liveReducible: true, roofLive_psf: 0, snow_psf: 0 },
      { id: 'archive', name: 'Archive', dead_psf: 55, superimposedDead_psf: 10, partition_psf: 0, live_psf: 125, liveReducible: true, roofLive_psf: 0, snow_psf: 0 },
      { id: 'roof', name: 'Roof', dead_psf: 45, superimposedDead_psf: 10, partition_psf: 0, live_psf: 0, liveReducible: false, roofLive_psf: 20, snow_psf: 25 },
    ],
    decks: [],
    pointLoads: [],
    lineLoads: [],
    openings: [],
  };
  for (let i = 0; i <= baysX; i++) for (let j = 0; j <= baysY; j++) plan.columns.push({ id: `C${i}-${j}`, x_ft: i * bay, y_ft: j * bay, levels: [...levelIds] });
  for (const level of levels) {
    const L = level.id;
    const m = (id: string, kind: 'girder' | 'beam', start: [number, number], end: [number, number], extra: Partial<PlanMember> = {}): PlanMember => ({
      id: `${L}-${id}`, level: L, kind, start, end, shape: null, maxDepth_in: null, ...extra,
    });
    for (let j = 0; j <= baysY; j++) for (let i = 0; i < baysX; i++) plan.members.push(m(`G${i}-${j}`, 'girder', [i * bay, j * bay], [(i + 1) * bay, j * bay], j === 0 && i === 1 ? { maxDepth_in: 18.5 } : {}));
    for (let k = 0; k <= baysX * beamsPerBay; k++) {
      const x = (k * bay) / beamsPerBay;
      for (let j = 0; j < baysY; j++) plan.members.push(m(`B${k}-${j}`, 'beam', [x, j * bay], [x, (j + 1) * bay], k === 5 && j === 1 ? { shape: 'W21X44' } : {}));
    }
    if (level.roof) {
      plan.decks.push({ id: `${L}-d`, level: L, polygon: [[0, 0], [X, 0], [X, Y], [0, Y]], spanDirection: 'x', zone: 'roof' });
      continue;
    }
    plan.decks.push(
      { id: `${L}-d1`, level: L, polygon: [[0, 0], [X, 0], [X, 26], [0, 26]], spanDirection: 'x', zone: 'office' },
      { id: `${L}-d2`, level: L, polygon: [[0, 26], [X, 26], [X, 34], [0, 34]], spanDirection: 'x', zone: 'corridor' },
      { id: `${L}-d3`, level: L, polygon: [[0, 34], [2 * bay, 34], [2 * bay, Y], [0, Y]], spanDirection: 'x', zone: L === 'L2' ? 'archive' : 'office' },
      { id: `${L}-d4`, level: L, polygon: [[2 * bay, 34], [X, 34], [X, Y], [2 * bay, Y]], spanDirection: 'x', zone: 'office' },
    );
    plan.openings.push({ id: `${L}-stair`, level: L, polygon: [[31, 2], [44, 2], [44, 20], [31, 20]] });
    plan.lineLoads.push(
      { id: `${L}-facade`, level: L, start: [0, 0], end: [X, 0], D_klf: 0.4, L_klf: 0 },
      { id: `${L}-wall`, level: L, start: [3, 40], end: [50, 55], D_klf: 0.25, L_klf: 0.05 },
    );
    plan.pointLoads.push(
      { id: `${L}-unit`, level: L, x_ft: 2 * bay + 12, y_ft: bay + 14, D_kip: 3, L_kip: 0.5 },
      { id: `${L}-hanger`, level: L, x_ft: 45, y_ft: 10, D_kip: 1.5, L_kip: 2 },
    );
  }
  return plan;
}

/** The whole takedown as plain data (maps as entry lists; the topology's indexes left out). */
function takedownData(t: TakedownResult) {
  return {
    order: t.order,
    members: [...t.members.values()].map((m) => ({ ...m, supports: m.supports })),
    columns: t.columns,
    equilibrium: t.equilibrium,
    floorArea_ft2: t.floorArea_ft2,
    byLevelFloorArea_ft2: [...t.byLevelFloorArea_ft2],
    problems: t.problems,
    excluded: [...t.topology.excluded],
    carries: [...t.topology.members.values()].map((fm) => [fm.id, fm.carries]),
  };
}

function goldenCases(): Record<string, unknown> {
  const building = goldenBuildingPlan();
  const fixture = twoBay();
  const fixtureChanged = structuredClone(fixture);
  fixtureChanged.members.find((m) => m.id === 'b3')!.shape = 'W24X62';
  const fixtureFirst = designScheme(fixture);
  return {
    twoBayTakedown: takedownData(runTakedown(fixture)),
    twoBayDesign: fixtureFirst,
    twoBayGrouped: designScheme(fixture, { groupIdentical: true }),
    twoBayIncremental: designScheme(fixtureChanged, { previous: fixtureFirst, changedIds: ['b3'] }),
    buildingTakedown: takedownData(runTakedown(building)),
    buildingDesign: designScheme(building),
    buildingGrouped: designScheme(building, { groupIdentical: true }),
  };
}

/** Not in the snapshot: an incremental re-design must equal the full design of the changed plan. */
function incrementalCase(): { incremental: unknown; full: unknown } {
  const building = goldenBuildingPlan();
  const first = designScheme(building);
  const changed = structuredClone(building);
  const target = changed.members.find((m) => m.id === 'L3-B6-0')!;
  target.shape = 'W18X40';
  return {
    incremental: JSON.parse(JSON.stringify(designScheme(changed, { previous: first, changedIds: [target.id] }))),
    full: JSON.parse(JSON.stringify(designScheme(changed))),
  };
}

describe('golden: takedown and scheme design output is unchanged', () => {
  const actual = JSON.parse(JSON.stringify(goldenCases())) as Record<string, unknown>;
  if (process.env.BAYWRIGHT_UPDATE_GOLDEN === '1') {
    // One case per line, compact: the file is large and read by this test, not by people.
    writeFileSync(SNAPSHOT, `{\n${Object.entries(actual).map(([k, v]) => `${JSON.stringify(k)}: ${JSON.stringify(v)}`).join(',\n')}\n}\n`);
  }
  if (!existsSync(SNAPSHOT)) throw new Error(`golden snapshot missing: ${SNAPSHOT.pathname} (record it with BAYWRIGHT_UPDATE_GOLDEN=1)`);
  const expected = JSON.parse(readFileSync(SNAPSHOT, 'utf8')) as Record<string, unknown>;

  it('when the golden cases are run, then the snapshot holds every one of them', () => {
    expect(Object.keys(actual).sort()).toEqual(Object.keys(expected).sort());
  });
  for (const name of Object.keys(expected)) {
    it(`when "${name}" is recomputed, then every field equals the snapshot bit for bit`, () => {
      expect(actual[name]).toEqual(expected[name]);
      // Byte for byte, key order included (the snapshot's text keeps the order it was written in).
      expect(JSON.stringify(actual[name])).toBe(JSON.stringify(expected[name]));
    });
  }
  it('when a member changes and the previous result is passed, then the result equals a full design of the changed plan', () => {
    const { incremental, full } = incrementalCase();
    expect(incremental).toEqual(full);
  });
  it('when the edit changes geometry, zones, openings or loads and the previous result is passed, then each re-design equals a full design', () => {
    const base = goldenBuildingPlan();
    const first = designScheme(base);
    const edits: [string, (p: Plan) => void][] = [
      ['a beam moved', (p) => { const b = p.members.find((m) => m.id === 'L2-B6-0')!; b.start = [16, 0]; b.end = [16, 30]; }],
      ['a zone live load raised', (p) => { p.zones.find((z) => z.id === 'office')!.live_psf = 65; }],
      ['an opening added', (p) => { p.openings.push({ id: 'new', level: 'L3', polygon: [[62, 33], [70, 33], [70, 45], [62, 45]] }); }],
      ['a point load moved', (p) => { p.pointLoads[0].x_ft += 3; }],
      ['a depth limit set', (p) => { p.members.find((m) => m.id === 'L4-G1-1')!.maxDepth_in = 16.5; }],
      ['a column removed from a level', (p) => { p.columns.find((c) => c.id === 'C1-1')!.levels = ['L2', 'L4']; }],
    ];
    for (const [what, edit] of edits) {
      const changed = structuredClone(base);
      edit(changed);
      const incremental = JSON.parse(JSON.stringify(designScheme(changed, { previous: first })));
      const full = JSON.parse(JSON.stringify(designScheme(changed)));
      // The design memo reuses a design for an input equal to 1e-9 in every number (as it did
      // before this work), so a design kept from the previous run may differ from a fresh one
      // in the last bits; everything else must match exactly.
      expect(differences(incremental, full, 1e-9), what).toEqual([]);
    }
  });

  it('when the earlier plan object is edited in place after its design, then a re-design of an unedited copy is not affected', () => {
    const base = goldenBuildingPlan();
    const copy = structuredClone(base);
    const first = designScheme(base);
    base.zones.find((z) => z.id === 'office')!.live_psf = 100;
    base.decks[0].polygon[1] = [80, 0];
    base.members[0].end = [29, 0];
    const again = JSON.parse(JSON.stringify(designScheme(copy, { previous: first })));
    expect(again).toEqual(JSON.parse(JSON.stringify(designScheme(structuredClone(copy)))));
  });

  it('when the building is designed, then it has real members, loads and equilibrium (the snapshot is not empty)', () => {
    const d = actual.buildingDesign as { members: { passes: boolean }[]; equilibrium: { D: { applied_kip: number; reactions_kip: number } } };
    expect(d.members.length).toBe(3 * (3 * 3 + 13 * 2));
    expect(d.equilibrium.D.applied_kip).toBeGreaterThan(1000);
    expect(Math.abs(d.equilibrium.D.applied_kip - d.equilibrium.D.reactions_kip)).toBeLessThan(1e-6);
  });
});
