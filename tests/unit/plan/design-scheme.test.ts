import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { parsePlanFile, type Plan } from '../../../shared/schemas/plan.schema';
import { designScheme } from '../../../shared/engine/scheme/design-scheme.scheme';
import { assignMarks, levelMarkPrefix } from '../../../shared/engine/scheme/member-marks.scheme';

const fixture = (): Plan => parsePlanFile(JSON.parse(readFileSync(new URL('../../fixtures/plans/two-bay.plan.json', import.meta.url), 'utf8'))).plan!;

describe('designScheme on the two-bay fixture', () => {
  const r = designScheme(fixture());
  const m = (id: string) => r.members.find((x) => x.id === id)!;

  it('when designed, then every member passes and the output carries the calc-interface fields', () => {
    expect(r.problems).toEqual([]);
    expect(r.members).toHaveLength(11);
    for (const x of r.members) {
      expect(x.passes).toBe(true);
      expect(Object.keys(x)).toEqual(expect.arrayContaining(['id', 'mark', 'kind', 'shape', 'span_ft', 'passes', 'governing', 'ratio', 'tributaryWidth_ft', 'tributaryArea_ft2', 'KLL', 'liveReductionFactor', 'Lb_ft', 'Cb', 'Mr_kipft', 'Mc_kipft', 'reactions']));
    }
    expect(Object.keys(r.totals)).toEqual(expect.arrayContaining(['steelWeight_lb', 'floorArea_ft2', 'steel_psf', 'pieces']));
  });

  it('when a beam is sized, then its reactions include its self weight and match the sizing engine', () => {
    const b2 = m('b2');
    // deck 10 ft × 65 psf × 36 ft / 2 + lever-rule share of p1 (2 kip × ½ at 20 ft: 1 × 20/36 at the end) + self weight
    const expectedEnd = (0.65 * 36) / 2 + (1 * 20) / 36 + (b2.weight_plf / 1000) * 18;
    expect(b2.reactions.end.D_kip).toBeCloseTo(expectedEnd, 9);
    expect(b2.reactions.end.D_kip).toBeCloseTo(b2.design!.reactions.end.D_kip, 6);
    expect(b2.liveReductionFactor).toBeCloseTo(0.809017, 6); // ASCE 7-16 Eq. 4.7-1 at AT = 360, KLL = 2
    expect(b2.reactions.start.supportedBy).toBe('gA12');
  });

  it('when the girder is designed, then it carries the beams\u2019 reactions with their self weight', () => {
    const g = m('gA12');
    const fromB2 = g.loads.filter((l) => l.source === 'beam b2 reaction' && l.case === 'D');
    expect(fromB2).toHaveLength(1);
    expect(fromB2[0].kind === 'point' && fromB2[0].P_kip).toBeCloseTo(m('b2').reactions.start.D_kip, 12);
    expect(g.bracing).toEqual({ points_ft: [10, 20] });
  });

  it('when all members are sized, then the column reactions equal the applied load including steel', () => {
    const steelKip = r.totals.steelWeight_lb / 1000;
    const deckD = 2124 * 0.065; // net floor area × 65 psf
    expect(r.equilibrium.D.applied_kip).toBeCloseTo(deckD + 2 + 0.4 * 30 + steelKip, 9);
    expect(r.equilibrium.D.reactions_kip).toBeCloseTo(r.equilibrium.D.applied_kip, 9);
    expect(r.equilibrium.L.reactions_kip).toBeCloseTo(r.equilibrium.L.applied_kip, 9);
    expect(r.totals.floorArea_ft2).toBeCloseTo(60 * 36 - 36, 9);
  });

  it('when marks are assigned, then they follow level, kind and plan order and repeat for identical designs', () => {
    expect(m('gA12').mark).toBe('2G1');
    expect(m('b1').mark.startsWith('2B')).toBe(true);
    for (const a of r.members) for (const b of r.members) {
      if (a.kind === b.kind && a.shape === b.shape && a.span_ft === b.span_ft) expect(a.mark).toBe(b.mark);
      else expect(a.mark).not.toBe(b.mark);
    }
    expect(JSON.stringify(designScheme(fixture()))).toBe(JSON.stringify(r)); // deterministic
  });

  it('when one member changes and the previous result is passed, then the result equals a full re-design', () => {
    const plan = fixture();
    plan.members.find((x) => x.id === 'b3')!.shape = 'W24X62';
    const incremental = designScheme(plan, { previous: r, changedIds: ['b3'] });
    expect(JSON.stringify(incremental)).toBe(JSON.stringify(designScheme(plan)));
    expect(incremental.members.find((x) => x.id === 'b3')!.shape).toBe('W24X62');
  });

  it('when identical members are grouped, then each group shares the heaviest shape and still passes', () => {
    const g = designScheme(fixture(), { groupIdentical: true });
    expect(g.members.every((x) => x.passes)).toBe(true);
    expect(m('b2').shape).toBe(g.members.find((x) => x.id === 'b3')!.shape);
    expect(g.totals.steelWeight_lb).toBeGreaterThanOrEqual(r.totals.steelWeight_lb);
    expect(g.equilibrium.D.reactions_kip).toBeCloseTo(g.equilibrium.D.applied_kip, 9);
  });

  it('when a member has a locked mark, then it keeps it and no other design takes it', () => {
    const plan = fixture();
    Object.assign(plan.members.find((x) => x.id === 'b7')!, { mark: '2B1', markLocked: true });
    const locked = designScheme(plan);
    expect(locked.members.find((x) => x.id === 'b7')!.mark).toBe('2B1');
    expect(locked.members.filter((x) => x.mark === '2B1').map((x) => x.id)).toEqual(['b7']);
  });
});

describe('marks', () => {
  it('when the level id is "L2" or "3", then the prefix is the number; otherwise the id', () => {
    expect(levelMarkPrefix({ id: 'L2' })).toBe('2');
    expect(levelMarkPrefix({ id: '3' })).toBe('3');
    expect(levelMarkPrefix({ id: 'ROOF' })).toBe('ROOF');
  });
  it('when designs differ, then numbers follow plan order (y, then x)', () => {
    const base = { level: 'L2', kind: 'beam' as const, span_ft: 30, lockedMark: null };
    const marks = assignMarks(
      [
        { ...base, id: 'a', shape: 'W16X26', midpoint: [5, 20] },
        { ...base, id: 'b', shape: 'W18X35', midpoint: [15, 0] },
        { ...base, id: 'c', shape: 'W16X26', midpoint: [25, 20] },
      ],
      [{ id: 'L2' }],
    );
    expect(Object.fromEntries(marks)).toEqual({ a: '2B2', b: '2B1', c: '2B2' });
  });
});

describe('designScheme when framing is incomplete', () => {
  it('when a beam end lands on nothing, then that beam never reads as passing and the problem names it', () => {
    const plan = fixture();
    const b2 = plan.members.find((x) => x.id === 'b2')!;
    // Move the far end into open floor, 3 ft short of the girder it framed into.
    const [sx, sy] = b2.start;
    const [ex, ey] = b2.end;
    const len = Math.hypot(ex - sx, ey - sy);
    b2.end = [sx + ((ex - sx) * (len - 3)) / len, sy + ((ey - sy) * (len - 3)) / len];
    const r = designScheme(plan);
    const problem = r.problems.find((p) => p.code === 'member-end-unsupported' && p.elementId === 'b2');
    expect(problem?.severity).toBe('error');
    expect(r.members.find((x) => x.id === 'b2')!.passes).toBe(false);
  });
});
