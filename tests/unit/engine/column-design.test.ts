import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { designColumn, columnCandidates, slendernessE2, LC_OVER_R_PREFERRED_MAX, type ColumnDesignInput } from '../../../shared/engine/sizing/column-design';
import { assignTiers } from '../../../shared/engine/sizing/column-tiers';
import { compressionConstantsFor, compressionStrengthE1 } from '../../../shared/engine/design/aisc360/chapter-e/e1';
import { loadCombinations } from '../../../shared/engine/loads/combinations';
import { designScheme } from '../../../shared/engine/scheme/design-scheme.scheme';
import { columnLengths } from '../../../shared/engine/scheme/column-design.scheme';
import { singleBay, zone } from '../takedown/plan-builder';

const SERIES = ['W14', 'W12', 'W10'];

/** Independent check of one shape on one tier: every combination of ASCE 7-16 §2.3.1/§2.4.1, every length. */
function bruteForcePasses(input: ColumnDesignInput, label: string, indices: number[], aboveKip: number): boolean {
  const kk = compressionConstantsFor(label, input.Fy_ksi)!;
  let sw = aboveKip;
  for (const i of indices) {
    const l = input.lengths[i];
    sw += (kk.weightPlf * l.Lc_ft) / 1000;
    const combos = loadCombinations(input.method, ['D', 'L', 'Lr', 'S']);
    const pr = Math.max(...combos.map((c) => c.factors.D * (l.D_kip + sw) + c.factors.L * l.L_kip + c.factors.Lr * l.Lr_kip + c.factors.S * l.S_kip));
    if (pr > compressionStrengthE1(kk, l.Lc_ft * 12, l.Lc_ft * 12, input.method).pcKip) return false;
  }
  return true;
}

const columnArbitrary = fc
  .record({
    method: fc.constantFrom('LRFD' as const, 'ASD' as const),
    storeys: fc.array(fc.record({ h: fc.integer({ min: 8, max: 30 }), D: fc.double({ min: 0, max: 250, noNaN: true }), L: fc.double({ min: 0, max: 150, noNaN: true }), Lr: fc.double({ min: 0, max: 20, noNaN: true }) }), { minLength: 1, maxLength: 8 }),
    per: fc.integer({ min: 1, max: 3 }),
  })
  .map((g): ColumnDesignInput => {
    // Cumulative loads top down.
    let D = 0, L = 0;
    const tiers = assignTiers(g.storeys.map((_, i) => ({ level: `L${i}`, bottomLevel: i + 1 < g.storeys.length ? `L${i + 1}` : null })), null, g.per);
    const lengths = g.storeys.map((s, i) => {
      D += s.D;
      L += s.L;
      return { level: `L${i}`, Lc_ft: s.h, tier: tiers[i], D_kip: D, L_kip: L, Lr_kip: i === 0 ? s.Lr : g.storeys[0].Lr, S_kip: 0 };
    });
    return { method: g.method, Fy_ksi: 50, series: SERIES, lengths };
  });

describe('column tiers', () => {
  it('when a column has five lengths and no splice levels, then tiers of two storeys count from the bottom (common practice)', () => {
    const lengths = ['R', 'L5', 'L4', 'L3', 'L2'].map((level, i, a) => ({ level, bottomLevel: a[i + 1] ?? null }));
    expect(assignTiers(lengths, null)).toEqual([3, 2, 2, 1, 1]);
    // Splice levels: a new tier starts above L4 only
    expect(assignTiers(lengths, ['L4'])).toEqual([2, 2, 1, 1, 1]);
    expect(assignTiers(lengths, [])).toEqual([1, 1, 1, 1, 1]);
  });

  it('when a column starts at L3 above an existing L2, then its lowest length runs down to L2; otherwise to elevation 0', () => {
    const plan = singleBay(30, 30, 10, ['L2', 'L3', 'L4']);
    expect(columnLengths(plan, ['L4', 'L3']).map((l) => [l.Lc_ft, l.bottomLevel])).toEqual([[14, 'L3'], [14, 'L2']]);
    expect(columnLengths(plan, ['L4', 'L2']).map((l) => [l.Lc_ft, l.bottomLevel])).toEqual([[28, 'L2'], [14, null]]);
  });
});

describe('column sizing', () => {
  it('when a tier is locked, then its size is checked, not replaced, and a locked size that fails is reported', () => {
    const lengths = [{ level: 'L2', Lc_ft: 14, tier: 1, D_kip: 400, L_kip: 200, Lr_kip: 0, S_kip: 0 }];
    const r = designColumn({ method: 'LRFD', Fy_ksi: 50, series: SERIES, lengths, locked: new Map([[1, 'W10X33']]) });
    expect(r.tiers[0].shape).toBe('W10X33');
    expect(r.tiers[0].locked).toBe(true);
    expect(r.passes).toBe(false);
    expect(r.tiers[0].failure).toMatch(/^locked size W10X33 reaches ratio/);
  });

  it('when the tiers are sized, then the selected shape passes and no lighter allowed shape does (brute force), and tiers are never lighter below', () => {
    fc.assert(
      fc.property(columnArbitrary, (input) => {
        const r = designColumn(input);
        const candidates = columnCandidates(SERIES, 50);
        let above = 0;
        let minWeight = 0;
        for (const t of r.tiers) {
          const indices = input.lengths.map((l, i) => (l.tier === t.tier ? i : -1)).filter((i) => i >= 0);
          // Lc/r ≤ 200 over the tier's longest length (AISC 360-16 E2 User Note, taken as a limit).
          const longestIn = Math.max(...indices.map((i) => input.lengths[i].Lc_ft * 12));
          const slenderOk = (label: string) => {
            const k = compressionConstantsFor(label, 50)!;
            return longestIn / Math.min(k.rxIn, k.ryIn) <= 200;
          };
          if (t.passes) {
            expect(bruteForcePasses(input, t.shape!, indices, above)).toBe(true);
            expect(slenderOk(t.shape!)).toBe(true);
            for (const c of candidates) {
              if (c.weightPlf >= t.weight_plf) break;
              if (c.weightPlf < minWeight) continue;
              expect(bruteForcePasses(input, c.label, indices, above) && slenderOk(c.label), `${c.label} lighter than ${t.shape}`).toBe(false);
            }
          }
          expect(t.weight_plf).toBeGreaterThanOrEqual(minWeight); // common practice: never heavier above than below
          minWeight = t.weight_plf;
          for (const i of indices) above += (t.weight_plf * input.lengths[i].Lc_ft) / 1000;
        }
        // The column's weight is Σ shape weight × length.
        expect(r.weight_lb).toBeCloseTo(input.lengths.reduce((a, l) => a + r.tiers.find((t) => t.tier === l.tier)!.weight_plf * l.Lc_ft, 0), 6);
      }),
      { numRuns: 120 },
    );
  });
});

describe('column slenderness, AISC 360-16 E2 User Note (Lc/r preferably not over 200, taken as a limit when sizing)', () => {
  // ry: W10X12 0.785 in, W10X15 0.810 in, W10X17 0.845 in, W12X14 0.753 in, W12X16 0.773 in,
  // W12X19 0.822 in, W10X112 2.68 in (AISC Shapes Database v15.0).
  const light = (Lc_ft: number) => [{ level: 'L2', Lc_ft, tier: 1, D_kip: 5, L_kip: 5, Lr_kip: 0, S_kip: 0 }];

  it('when a lightly loaded 14 ft column is sized, then the lightest shape within Lc/r 200 is chosen: W10X17 (168/0.845 = 198.8), not W10X12 (214)', () => {
    expect(slendernessE2(compressionConstantsFor('W10X12', 50)!, 168)).toBeCloseTo(168 / 0.785, 6); // 214.0
    expect(slendernessE2(compressionConstantsFor('W10X17', 50)!, 168)).toBeCloseTo(198.8, 1);
    const r = designColumn({ method: 'LRFD', Fy_ksi: 50, series: SERIES, lengths: light(14) });
    expect(r.tiers[0].shape).toBe('W10X17');
    expect(r.tiers[0].passes).toBe(true);
    expect(r.tiers[0].LcOverR!).toBeCloseTo(198.8, 1);
    // The lighter ones carry 1.2(5) + 1.6(5) = 14 kip easily; they are left out for Lc/r alone.
    expect(bruteForcePasses({ method: 'LRFD', Fy_ksi: 50, series: SERIES, lengths: light(14) }, 'W10X12', [0], 0)).toBe(true);
    // At 12 ft, W10X12 is within 200 (144/0.785 = 183.4) and is chosen.
    expect(designColumn({ method: 'LRFD', Fy_ksi: 50, series: SERIES, lengths: light(12) }).tiers[0].shape).toBe('W10X12');
  });

  it('when a size over Lc/r 200 is locked, then it is checked on strength and passes, and the scheme warns of its Lc/r', () => {
    const r = designColumn({ method: 'LRFD', Fy_ksi: 50, series: SERIES, lengths: light(14), locked: new Map([[1, 'W10X12']]) });
    expect(r.tiers[0].shape).toBe('W10X12');
    expect(r.tiers[0].passes).toBe(true);
    expect(r.tiers[0].LcOverR!).toBeCloseTo(214.0, 1);
    expect(r.tiers[0].LcOverR!).toBeGreaterThan(LC_OVER_R_PREFERRED_MAX);
  });

  it('when no allowed shape is within Lc/r 200 (W10 only, 45 ft: W10X112 gives 540/2.68 = 201.5), then the tier fails naming the limit and the lightest shape that carries the load', () => {
    const r = designColumn({ method: 'LRFD', Fy_ksi: 50, series: ['W10'], lengths: light(45) });
    expect(r.passes).toBe(false);
    expect(r.tiers[0].failure).toMatch(/^no W10 shape has Lc\/r ≤ 200 over 45\.0 ft \(AISC 360-16 E2 User Note, taken as a limit\); W10X\d+ carries the load at Lc\/r \d+$/);
    expect(bruteForcePasses({ method: 'LRFD', Fy_ksi: 50, series: ['W10'], lengths: light(45) }, r.tiers[0].shape!, [0], 0)).toBe(true);
  });
});

describe('column stack in the scheme', () => {
  it('when a multi-storey bay is designed, then per case the column bottoms balance the applied load and Pr adds the column self weight', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 5 }), fc.integer({ min: 20, max: 40 }), fc.integer({ min: 0, max: 90 }), fc.integer({ min: 0, max: 120 }), fc.integer({ min: 0, max: 40 }),
        (levelsCount, bay, dead, live, snow) => {
          const levels = Array.from({ length: levelsCount }, (_, i) => `L${i + 2}`);
          const plan = singleBay(bay, bay, bay / 2, levels, zone('z', { dead_psf: dead, live_psf: live, snow_psf: snow }));
          const r = designScheme(plan);
          for (const c of ['D', 'L', 'S'] as const) {
            const key = c === 'L' ? 'Lunreduced_kip' : `${c}_kip` as const;
            const bottoms = r.columns.reduce((a, col) => a + col.levels[col.levels.length - 1][key], 0);
            // Equilibrium is the first test (design-basis §2): Σ column reactions = applied load, per case
            expect(bottoms).toBeCloseTo(r.equilibrium[c].applied_kip, 6);
          }
          for (const col of r.columns) {
            let sw = 0;
            for (const l of col.levels) {
              sw += (Number(l.shape!.split('X')[1]) * l.Lc_ft) / 1000;
              expect(l.selfWeight_kip).toBeCloseTo(sw, 9);
              expect(l.Lc_ft).toBe(14);
              expect(l.Pr_kip).toBeGreaterThanOrEqual(l.stackPr_kip);
              expect(l.ratio!).toBeCloseTo(l.Pr_kip / l.Pc_kip!, 12);
            }
            expect(col.weight_lb).toBeCloseTo(col.levels.reduce((a, l) => a + Number(l.shape!.split('X')[1]) * l.Lc_ft, 0), 6);
          }
          expect(r.totals.columnWeight_lb).toBeCloseTo(r.columns.reduce((a, c) => a + c.weight_lb, 0), 6);
        },
      ),
      { numRuns: 12 },
    );
  });

  it('when a four-storey column is designed by default, then it has two tiers, the lower not lighter, and the splice at L3', () => {
    const plan = singleBay(30, 30, 10, ['L2', 'L3', 'L4', 'L5'], zone('z', { dead_psf: 80, live_psf: 100, liveReducible: true }));
    const c = designScheme(plan).columns[0];
    expect(c.levels.map((l) => l.tier)).toEqual([2, 2, 1, 1]);
    expect(c.spliceLevels).toEqual(['L3']);
    expect(c.levels.map((l) => l.spliceBelow)).toEqual([false, true, false, false]);
    expect(c.tiers[1].weight_plf).toBeGreaterThanOrEqual(c.tiers[0].weight_plf);
  });
});
