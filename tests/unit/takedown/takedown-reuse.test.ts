/**
 * Re-design with the previous result: members whose own inputs are unchanged and which carry
 * only such members keep their earlier takedown (TakedownReuse); everything else is worked
 * out again. The result must be the full design of the edited plan. Invented plan of our own.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parsePlanFile, type Plan } from '../../../shared/schemas/plan.schema';
import { designScheme, reusedMemberTakedowns, type SchemeResult } from '../../../shared/engine/scheme/design-scheme.scheme';
import { emptyPlan, member, zone } from './plan-builder';
import { differences } from './differences';

/** One level: bays×bays of 30 ft, girders along x, beams at 7.5 ft along y, a point load and a line load. */
function level(baysX = 3, baysY = 2): Plan {
  const plan = emptyPlan(['L2']);
  plan.zones.push(zone('office', { superimposedDead_psf: 15, partition_psf: 15 }));
  const bay = 30;
  for (let i = 0; i <= baysX; i++) for (let j = 0; j <= baysY; j++) plan.columns.push({ id: `C${i}-${j}`, x_ft: i * bay, y_ft: j * bay, levels: ['L2'] });
  for (let j = 0; j <= baysY; j++) for (let i = 0; i < baysX; i++) plan.members.push(member(`G${i}-${j}`, 'girder', [i * bay, j * bay], [(i + 1) * bay, j * bay]));
  for (let k = 0; k <= baysX * 4; k++) for (let j = 0; j < baysY; j++) plan.members.push(member(`B${k}-${j}`, 'beam', [k * 7.5, j * bay], [k * 7.5, (j + 1) * bay]));
  plan.decks.push({ id: 'd', level: 'L2', polygon: [[0, 0], [baysX * bay, 0], [baysX * bay, baysY * bay], [0, baysY * bay]], spanDirection: 'x', zone: 'office' });
  plan.pointLoads.push({ id: 'p', level: 'L2', x_ft: 37.5, y_ft: 12, D_kip: 3, L_kip: 1 });
  plan.lineLoads.push({ id: 'facade', level: 'L2', start: [0, 0], end: [baysX * bay, 0], D_klf: 0.4, L_klf: 0 });
  return plan;
}

/** The same level with a composite slab on the deck (parsed, so the composite settings get their defaults). */
function compositeLevel(): Plan {
  const doc = JSON.parse(JSON.stringify(level()));
  doc.designBasis.composite = { enabled: true };
  doc.decks[0].slab = { ribHeight_in: 3, toppingThickness_in: 3.25, ribAvgWidth_in: 6, ribSpacing_in: 12, concreteWeight_pcf: 115, fc_ksi: 3, deckWeight_psf: 2 };
  return parsePlanFile(doc).plan!;
}

const data = (r: SchemeResult) => JSON.parse(JSON.stringify(r)) as unknown;
/** The memo reuses a design for inputs equal to 1e-9 in every number (design-scheme), hence the tolerance on numbers. */
const expectFullDesign = (incremental: SchemeResult, plan: Plan, what: string, options: { groupIdentical?: boolean } = {}) =>
  expect(differences(data(incremental), data(designScheme(structuredClone(plan), options)), 1e-9), what).toEqual([]);

describe('re-design reusing the previous takedown', () => {
  it('when one beam gets a locked shape, then only it and the girders it bears on are taken down again, and the result is the full design', () => {
    const plan = level();
    const first = designScheme(plan);
    const changed = structuredClone(plan);
    changed.members.find((m) => m.id === 'B5-0')!.shape = 'W21X50';
    const again = designScheme(changed, { previous: first, changedIds: ['B5-0'] });
    // B5-0 spans y from 0 to 30 at x = 37.5: it bears on G1-0 and G1-1, which bear on columns.
    expect(reusedMemberTakedowns(again)).toBe(changed.members.length - 3);
    expect(again.members.find((m) => m.id === 'B5-0')!.shape).toBe('W21X50');
    // Byte for byte: the reused designs are the very designs a full run makes for these inputs.
    expect(JSON.stringify(again)).toBe(JSON.stringify(designScheme(structuredClone(changed))));
  });

  it('when a girder changes, then nothing it carries is taken down again', () => {
    const plan = level();
    const first = designScheme(plan);
    const changed = structuredClone(plan);
    changed.members.find((m) => m.id === 'G1-1')!.maxDepth_in = 16.5;
    const again = designScheme(changed, { previous: first });
    expect(reusedMemberTakedowns(again)).toBe(changed.members.length - 1);
    expectFullDesign(again, changed, 'girder depth limit');
  });

  it('when a point load is added or moved or a line load changes, then only the members it lands on and what carries them are taken down again', () => {
    const plan = level();
    const first = designScheme(plan);
    const edits: [string, (p: Plan) => void, number][] = [
      // From beam B5-0 (x = 37.5): along it, B5-0 and the girders G1-0, G1-1 it bears on;
      // to B6-0 (x = 45, same girders), both beams and the two girders.
      ['point load moved along its beam', (p) => { p.pointLoads[0].y_ft = 20; }, 3],
      ['point load moved to the next beam', (p) => { p.pointLoads[0].x_ft = 45; }, 4],
      ['point load added on a beam of the other bay', (p) => { p.pointLoads.push({ id: 'p2', level: 'L2', x_ft: 15, y_ft: 44, D_kip: 2, L_kip: 2 }); }, 3],
      // The facade line along y = 0 is carried by the deck (spanning x) to the 13 beams of the
      // first bay row, B0-0 … B12-0, by the lever rule; they bear on the six girders of y = 0 and 30.
      ['line load raised', (p) => { p.lineLoads[0].D_klf = 0.6; }, 13 + 6],
    ];
    for (const [what, edit, redone] of edits) {
      const changed = structuredClone(plan);
      edit(changed);
      const again = designScheme(changed, { previous: first });
      expect(reusedMemberTakedowns(again), what).toBe(changed.members.length - redone);
      expectFullDesign(again, changed, what);
    }
  });

  it('when the design basis changes, then nothing is reused and the result is the full design', () => {
    const plan = level();
    const first = designScheme(plan);
    const edits: [string, (p: Plan) => void][] = [
      ['live load reduction off', (p) => { p.designBasis.liveLoadReduction = false; }],
      ['deflection limit changed', (p) => { p.designBasis.deflectionLimits.live = 480; }],
    ];
    for (const [what, edit] of edits) {
      const changed = structuredClone(plan);
      edit(changed);
      const again = designScheme(changed, { previous: first });
      expect(reusedMemberTakedowns(again), what).toBe(0);
      expectFullDesign(again, changed, what);
    }
  });

  it('when the plan passed before is edited in place and passed again, then the edit is seen (members are compared with copies)', () => {
    const plan = level();
    const first = designScheme(plan);
    const beam = plan.members.find((m) => m.id === 'B2-1')!;
    beam.shape = 'W24X55';
    beam.allowedNominalDepths = [24];
    const again = designScheme(plan, { previous: first });
    expect(again.members.find((m) => m.id === 'B2-1')!.shape).toBe('W24X55');
    expect(reusedMemberTakedowns(again)).toBe(plan.members.length - 3);
    expectFullDesign(again, plan, 'in-place edit');
    // An earlier plan edited in place after its design is never read through the kept takedowns.
    const braced = structuredClone(plan);
    braced.members.find((m) => m.id === 'B7-0')!.bracing = { points_ft: [10, 20] };
    const bracedFirst = designScheme(braced);
    const bracedCopy = structuredClone(braced);
    (braced.members.find((m) => m.id === 'B7-0')!.bracing as { points_ft: number[] }).points_ft[0] = 3;
    const bracedAgain = designScheme(bracedCopy, { previous: bracedFirst });
    expect(reusedMemberTakedowns(bracedAgain)).toBe(bracedCopy.members.length);
    expect(bracedAgain.members.find((m) => m.id === 'B7-0')!.bracing).toEqual({ points_ft: [10, 20] });
    expect(JSON.stringify(bracedAgain)).toBe(JSON.stringify(designScheme(structuredClone(bracedCopy))));
    // And an in-place edit of a nested list is seen as well.
    beam.allowedNominalDepths.push(21);
    beam.shape = null;
    const third = designScheme(plan, { previous: again });
    expect(reusedMemberTakedowns(third)).toBe(plan.members.length - 3);
    expectFullDesign(third, plan, 'nested in-place edit');
  });

  it('when nothing changes, then every takedown is reused and the result is the same text', () => {
    const plan = level();
    const first = designScheme(plan);
    const again = designScheme(structuredClone(plan), { previous: first });
    expect(reusedMemberTakedowns(again)).toBe(plan.members.length);
    expect(JSON.stringify(again)).toBe(JSON.stringify(first));
  });

  it('when the same members are grouped, then the takedown is not reused (a forced size depends on other members)', () => {
    const plan = level();
    const grouped = designScheme(plan, { groupIdentical: true });
    const again = designScheme(structuredClone(plan), { previous: grouped, groupIdentical: true });
    expect(reusedMemberTakedowns(again)).toBe(0);
    expectFullDesign(again, plan, 'grouped', { groupIdentical: true });
  });

  it('when the slab is composite, then a one-beam edit keeps the other members\' wet-stage and final takedowns, and the result is the full design', () => {
    const composite = compositeLevel();
    const wet = designScheme(composite);
    expect(wet.members.every((m) => typeof m.studs === 'number' && m.studs > 0)).toBe(true);
    const changed = structuredClone(composite);
    changed.members.find((m) => m.id === 'B5-0')!.shape = 'W21X50';
    const again = designScheme(changed, { previous: wet });
    // B5-0 and the girders G1-0, G1-1 it bears on (its weight reaches them in both stages).
    expect(reusedMemberTakedowns(again)).toBe(changed.members.length - 3);
    expect(again.members.find((m) => m.id === 'B5-0')!.shape).toBe('W21X50');
    expect(JSON.stringify(again)).toBe(JSON.stringify(designScheme(structuredClone(changed))));
    // Studs given on a member are part of its own data: that member (B9-1, x = 67.5) and the girders G2-1, G2-2 it bears on are redone.
    const studded = structuredClone(changed);
    studded.members.find((m) => m.id === 'B9-1')!.studs = 30;
    const third = designScheme(studded, { previous: again });
    expect(reusedMemberTakedowns(third)).toBe(studded.members.length - 3);
    expect(third.members.find((m) => m.id === 'B9-1')!.studs).toBe(30);
    expectFullDesign(third, studded, 'studs given');
    // A member made non-composite: its site changes (the others' sites are kept), it and its girders are redone.
    const bare = structuredClone(studded);
    bare.members.find((m) => m.id === 'B9-1')!.composite = false;
    const bareAgain = designScheme(bare, { previous: third });
    expect(reusedMemberTakedowns(bareAgain)).toBe(bare.members.length - 3);
    expect(bareAgain.members.find((m) => m.id === 'B9-1')!.studs).toBeNull();
    expect(bareAgain.members.find((m) => m.id === 'B9-1')!.compositeNote).toBe('non-composite by the engineer');
    expect(JSON.stringify(bareAgain)).toBe(JSON.stringify(designScheme(structuredClone(bare))));
    // A slab change is a geometry change (decks): nothing is reused.
    const thicker = structuredClone(studded);
    thicker.decks[0].slab!.toppingThickness_in = 4.5;
    const fourth = designScheme(thicker, { previous: third });
    expect(reusedMemberTakedowns(fourth)).toBe(0);
    expectFullDesign(fourth, thicker, 'slab thicker');
  });

  it('when the composite plan designed before is edited in place afterwards, then a re-design of an unedited copy reads none of it', () => {
    const plan = compositeLevel();
    const copy = structuredClone(plan);
    const first = designScheme(plan);
    plan.decks[0].polygon[1] = [80, 0];
    plan.decks[0].slab!.toppingThickness_in = 5;
    plan.designBasis.composite!.constructionLive_psf = 50;
    const again = designScheme(copy, { previous: first });
    expect(reusedMemberTakedowns(again)).toBe(copy.members.length);
    expect(JSON.stringify(again)).toBe(JSON.stringify(designScheme(structuredClone(copy))));
  });

  it('property: any chain of member edits, each re-designed from the last result, ends at the full design of the final plan (bare and composite)', () => {
    const shapes = [null, 'W12X19', 'W16X26', 'W18X35', 'W21X44', 'W24X55'];
    const edit = fc.record({
      member: fc.nat(),
      what: fc.constantFrom('shape', 'depth', 'Lb', 'limits', 'mark', 'point', 'composite', 'studs'),
      flag: fc.constantFrom(true, false, null),
      studs: fc.integer({ min: 0, max: 60 }),
      x: fc.integer({ min: 0, max: 60 }),
      y: fc.integer({ min: 0, max: 60 }),
      shape: fc.constantFrom(...shapes),
      depth: fc.constantFrom(null, 14.5, 18.5, 21.5),
      Lb: fc.constantFrom(undefined, 0, 7.5, 15),
    });
    fc.assert(
      fc.property(fc.array(edit, { minLength: 1, maxLength: 5 }), fc.boolean(), (edits, composite) => {
        const plan = composite ? compositeLevel() : level(2, 2);
        let result = designScheme(plan);
        for (const e of edits) {
          const m = plan.members[e.member % plan.members.length];
          const before = JSON.stringify(m);
          if (e.what === 'shape') m.shape = e.shape;
          else if (e.what === 'depth') m.maxDepth_in = e.depth;
          else if (e.what === 'Lb') m.Lb_override_ft = e.Lb;
          else if (e.what === 'limits') m.deflectionLimits = { live: 480, total: 360 };
          else if (e.what === 'point') plan.pointLoads[0] = { ...plan.pointLoads[0], x_ft: e.x, y_ft: e.y };
          else if (e.what === 'composite') m.composite = e.flag;
          else if (e.what === 'studs') m.studs = e.studs;
          else m.mark = 'X1';
          const copy = structuredClone(plan);
          result = designScheme(copy, { previous: result, changedIds: [m.id] });
          // An edit that changes the member's data is always taken down again (one that only adds
          // an undefined key may be too: the comparison is by keys and values, the safe side).
          if (e.what === 'point') expect(reusedMemberTakedowns(result)).toBeGreaterThan(0);
          else if (JSON.stringify(m) !== before) expect(reusedMemberTakedowns(result)).toBeLessThan(plan.members.length);
          else expect(reusedMemberTakedowns(result)).toBeGreaterThanOrEqual(plan.members.length - 3);
        }
        expect(differences(data(result), data(designScheme(structuredClone(plan))), 1e-9)).toEqual([]);
        expect(Math.abs(result.equilibrium.D.applied_kip - result.equilibrium.D.reactions_kip)).toBeLessThan(1e-9 * result.equilibrium.D.applied_kip);
      }),
      { numRuns: 40 },
    );
  });
});
