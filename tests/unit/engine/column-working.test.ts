import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { designColumn, type ColumnDesignInput } from '../../../shared/engine/sizing/column-design';
import { assignTiers } from '../../../shared/engine/sizing/column-tiers';
import { columnWorking, columnCombinations, type ColumnWorkingInput } from '../../../shared/engine/sizing/column-working';
import { designScheme } from '../../../shared/engine/scheme/design-scheme.scheme';
import { buildColumnSchedule } from '../../../shared/drafting/column-schedule.drafting';
import { singleBay, zone } from '../takedown/plan-builder';

/** The working's input from a designColumn result (what the column's sheet receives). */
function workingInputOf(input: ColumnDesignInput, lighterShown = 4): ColumnWorkingInput {
  const d = designColumn(input);
  return {
    method: input.method, Fy_ksi: input.Fy_ksi, series: input.series, allowHeavierAbove: input.allowHeavierAbove, lighterShown,
    lengths: input.lengths.map((l, i) => ({ ...l, bottomLevel: input.lengths[i + 1]?.level ?? null, selfWeight_kip: d.lengths[i].selfWeight_kip })),
    tiers: d.tiers.map((t) => ({ tier: t.tier, shape: t.shape, locked: t.locked })),
  };
}

describe('column working (the column sheet)', () => {
  it('when lighter shapes are left out for Lc/r over 200, then the sheet lists each with its Lc/r and the E2 User Note', () => {
    // 14 ft = 168 in; ry W10X15 0.810, W12X16 0.773, W12X14 0.753, W10X12 0.785 in (AISC Shapes Database v15.0).
    const input: ColumnDesignInput = { method: 'LRFD', Fy_ksi: 50, series: ['W14', 'W12', 'W10'], lengths: [{ level: 'L2', Lc_ft: 14, tier: 1, D_kip: 5, L_kip: 5, Lr_kip: 0, S_kip: 0 }] };
    const w = columnWorking(workingInputOf(input));
    expect(w.tiers[0].shape).toBe('W10X17');
    expect(w.tiers[0].passes).toBe(true);
    expect(w.tiers[0].lighter.map((l) => l.shape)).toEqual(['W12X16', 'W10X15', 'W12X14', 'W10X12']);
    expect(w.tiers[0].lighter.map((l) => l.reason)).toEqual([
      'Lc/r = 217 > 200 below L2 (AISC 360-16 E2 User Note, taken as a limit when sizing)', // 168/0.773 = 217.3
      'Lc/r = 207 > 200 below L2 (AISC 360-16 E2 User Note, taken as a limit when sizing)', // 168/0.810 = 207.4
      'Lc/r = 223 > 200 below L2 (AISC 360-16 E2 User Note, taken as a limit when sizing)', // 168/0.753 = 223.1
      'Lc/r = 214 > 200 below L2 (AISC 360-16 E2 User Note, taken as a limit when sizing)', // 168/0.785 = 214.0
    ]);
  });

  it('when a W14X132 is 30 ft long about both axes, then Fe, Fcr and φcPn are those of the published example', () => {
    const w = columnWorking({
      method: 'LRFD', Fy_ksi: 50, series: ['W14'],
      lengths: [{ level: 'L2', Lc_ft: 30, tier: 1, D_kip: 140, L_kip: 420, Lr_kip: 0, S_kip: 0, selfWeight_kip: 0 }],
      tiers: [{ tier: 1, shape: 'W14X132', locked: true }],
    });
    const len = w.tiers[0].lengths[0];
    // AISC Design Examples v15.0, Example E.1A (recalled from memory): Lc/ry = 95.7, Fe = 31.2 ksi, Fcr = 25.5 ksi, φcPn = 893 kip.
    expect(len.strength.y.slenderness).toBeCloseTo(95.7, 1);
    expect(len.strength.y.feKsi).toBeCloseTo(31.2, 1);
    expect(Math.abs(len.strength.y.fcrKsi - 25.5)).toBeLessThan(0.1); // the example rounds Fe to 31.2 before Eq. E3-2
    expect(len.strength.pcKip).toBeCloseTo(893, -0.5);
    expect(len.strength.y.equation).toBe('Eq. E3-2'); // 95.7 ≤ 4.71 sqrt(29000/50) = 113.4 (AISC 360-16 E3(a))
    expect(w.e3Limit).toBeCloseTo(113.4, 1); // AISC 360-16 E3: 4.71 sqrt(E/Fy), worked by hand
    expect(len.strength.governingAxis).toBe('y');
    // ASCE 7-16 §2.3.1 worked by hand: 1.4D = 196, 1.2D + 1.6L = 168 + 672 = 840 governs.
    expect(len.combinations.find((c) => c.name === '1.4D')!.Pr_kip).toBeCloseTo(196, 9);
    expect(len.Pr_kip).toBeCloseTo(840, 9);
    expect(len.governing).toBe('1.2D+1.6L');
    expect(len.ratio).toBeCloseTo(840 / len.strength.pcKip, 12);
    expect(w.tiers[0].lighter).toEqual([]); // a locked tier is checked, never replaced
  });

  it('when Lc/r exceeds 4.71 sqrt(E/Fy), then Fcr is Eq. E3-3 (0.877 Fe)', () => {
    const w = columnWorking({
      method: 'ASD', Fy_ksi: 50, series: ['W10'],
      lengths: [{ level: 'L2', Lc_ft: 25, tier: 1, D_kip: 10, L_kip: 10, Lr_kip: 0, S_kip: 0, selfWeight_kip: 0 }],
      tiers: [{ tier: 1, shape: 'W10X33', locked: true }],
    });
    const y = w.tiers[0].lengths[0].strength.y;
    // AISC Manual 15th ed. Table 1-1 (recalled from memory): W10X33 ry = 1.94 in, A = 9.71 in². Lc/ry = 300/1.94 = 154.6 > 113.4.
    expect(y.slenderness).toBeCloseTo(154.6, 1);
    expect(y.equation).toBe('Eq. E3-3');
    // AISC 360-16 Eq. E3-4 and E3-3 worked by hand: Fe = π²·29000/154.6² = 11.97 ksi, Fcr = 0.877·11.97 = 10.50 ksi.
    expect(y.feKsi).toBeCloseTo(11.97, 1);
    expect(y.fcrKsi).toBeCloseTo(10.5, 1);
    // ASD: D + L = 20 kip (ASCE 7-16 §2.4.1), Pn/Ωc = 10.50 · 9.71 / 1.67 = 61.0 kip (AISC 360-16 E1, worked by hand).
    expect(w.tiers[0].lengths[0].Pr_kip).toBeCloseTo(20, 9);
    expect(w.tiers[0].lengths[0].strength.pcKip).toBeCloseTo(61.0, 0);
  });

  it('when the web is slender at high Fy, then the working shows the E7 effective area', () => {
    // AISC 360-16 Table B4.1a case 5: λr = 1.49 sqrt(E/Fy) = 1.49 sqrt(29000/70) = 30.3 at Fy = 70 ksi (worked by hand);
    // W14X43 h/tw = 37.4 (AISC Manual 15th ed. Table 1-1, recalled from memory) exceeds it.
    const w = columnWorking({
      method: 'LRFD', Fy_ksi: 70, series: ['W14'],
      lengths: [{ level: 'L2', Lc_ft: 4, tier: 1, D_kip: 50, L_kip: 50, Lr_kip: 0, S_kip: 0, selfWeight_kip: 0 }],
      tiers: [{ tier: 1, shape: 'W14X43', locked: true }],
    });
    const s = w.tiers[0].lengths[0].strength;
    expect(s.section).toBe('E7');
    expect(s.y.web).not.toBeNull();
    expect(s.y.web!.lambdaR).toBeCloseTo(30.3, 1);
    expect(s.y.web!.equation).toBe('Eq. E7-3'); // short column: Fcr near Fy, so λ > λr sqrt(Fy/Fcr) (AISC 360-16 E7.1(b))
    expect(s.y.areaIn2).toBeLessThan(12.6); // Ae < Ag = 12.6 in² (AISC Manual 15th ed. Table 1-1, recalled from memory)
    expect(s.pnKip).toBeCloseTo(s.y.fcrKsi * s.y.areaIn2, 9); // AISC 360-16 Eq. E7-1
  });

  it('when a tier is sized, then every lighter shape tried fails with the length where it fails, and the lighter ones below the tier above are ruled out by weight', () => {
    const input: ColumnDesignInput = {
      method: 'LRFD', Fy_ksi: 50, series: ['W14'],
      lengths: [
        { level: 'L4', Lc_ft: 13, tier: 2, D_kip: 150, L_kip: 100, Lr_kip: 0, S_kip: 0 },
        { level: 'L3', Lc_ft: 13, tier: 2, D_kip: 300, L_kip: 200, Lr_kip: 0, S_kip: 0 },
        { level: 'L2', Lc_ft: 14, tier: 1, D_kip: 450, L_kip: 300, Lr_kip: 0, S_kip: 0 },
        { level: 'L1', Lc_ft: 16, tier: 1, D_kip: 600, L_kip: 400, Lr_kip: 0, S_kip: 0 },
      ],
    };
    const d = designColumn(input);
    const w = columnWorking(workingInputOf(input));
    expect(w.tiers.map((t) => t.shape)).toEqual(d.tiers.map((t) => t.shape));
    const upper = w.tiers[0];
    expect(upper.lighter.length).toBe(4);
    for (const l of upper.lighter) {
      expect(l.ratio!).toBeGreaterThan(1);
      expect(['L4', 'L3']).toContain(l.failsAt);
    }
    // The lower tier's lighter tries: those lighter than the upper tier are ruled out by weight (common practice).
    const upperPlf = Number(upper.shape!.split('X')[1]);
    for (const l of w.tiers[1].lighter) {
      if (l.weight_plf < upperPlf) expect(l.reason).toMatch(/lighter than the tier above/);
      else expect(l.ratio!).toBeGreaterThan(1);
    }
  });

  it('property: the working reproduces the design (same Pr, Pc and ratio per length) and no lighter allowed shape it tries passes', () => {
    const arb = fc
      .record({
        method: fc.constantFrom('LRFD' as const, 'ASD' as const),
        storeys: fc.array(fc.record({ h: fc.integer({ min: 9, max: 24 }), D: fc.double({ min: 1, max: 200, noNaN: true }), L: fc.double({ min: 0, max: 120, noNaN: true }) }), { minLength: 1, maxLength: 6 }),
        series: fc.constantFrom(['W14'], ['W12', 'W14'], ['W10', 'W12', 'W14']),
      })
      .map((g): ColumnDesignInput => {
        let D = 0, L = 0;
        const tiers = assignTiers(g.storeys.map((_, i) => ({ level: `L${i}`, bottomLevel: i + 1 < g.storeys.length ? `L${i + 1}` : null })), null, 2);
        return {
          method: g.method, Fy_ksi: 50, series: g.series,
          lengths: g.storeys.map((s, i) => ((D += s.D), (L += s.L), { level: `L${i}`, Lc_ft: s.h, tier: tiers[i], D_kip: D, L_kip: L, Lr_kip: 0, S_kip: 0 })),
        };
      });
    fc.assert(
      fc.property(arb, (input) => {
        const d = designColumn(input);
        const w = columnWorking(workingInputOf(input, 50));
        const byLevel = new Map(w.tiers.flatMap((t) => t.lengths.map((l) => [l.level, l] as const)));
        for (const r of d.lengths) {
          const l = byLevel.get(r.level)!;
          expect(l.Pr_kip).toBeCloseTo(r.Pr_kip, 9);
          expect(l.strength.pcKip).toBeCloseTo(r.Pc_kip!, 9);
          expect(l.ratio).toBeCloseTo(r.ratio!, 9);
        }
        for (const t of w.tiers) {
          if (!t.passes) continue;
          for (const l of t.lighter) if (l.ratio !== null) expect(l.ratio).toBeGreaterThan(1);
        }
      }),
      { numRuns: 60, seed: 1212 },
    );
  });

  it('when combinations are listed, then each is ASCE 7-16 with its factors and the largest governs', () => {
    // ASCE 7-16 §2.3.1 worked by hand: D = 100, L = 50, Lr = 10: 1.4D = 140; 1.2D+1.6L+0.5Lr = 205; 1.2D+1.6Lr+L = 186 → 205 governs.
    const c = columnCombinations('LRFD', 100, 50, 10, 0);
    expect(c.list.find((x) => x.name === '1.4D')!.Pr_kip).toBeCloseTo(140, 9);
    expect(c.Pr_kip).toBeCloseTo(205, 9);
    expect(c.governing).toBe('1.2D+1.6L+0.5Lr');
  });

  it('when the schedule is built from a scheme design, then each column carries its tiers and the inputs of its sheet', () => {
    const plan = singleBay(30, 30, 12, ['L2', 'L3', 'L4', 'L5'], zone('z', { dead_psf: 80, live_psf: 100 }));
    const design = designScheme(plan);
    const s = buildColumnSchedule(design, plan);
    const c = s.columns[0];
    expect(c.tiers.map((t) => t.tier)).toEqual([2, 1]);
    expect(c.tiers[0].shape).toBe(design.columns[0].tiers[0].shape);
    expect(c.spliceLevels).toEqual(['L3']); // two storeys per tier from the bottom (common practice)
    expect(s.settings).toMatchObject({ method: plan.designBasis.method, series: ['W14', 'W12', 'W10'], storeysPerTier: 2, spliceLevels: null });
    const bottom = c.cells[c.cells.length - 1]!;
    expect(bottom.bottomLevel).toBeNull(); // the lowest length runs down to elevation 0 ft (calc-interface "Additions")
    expect(c.cells[0]!.bottomLevel).toBe('L4');
    expect(c.cells[1]!.selfWeight_kip).toBeGreaterThan(c.cells[0]!.selfWeight_kip);
  });
});
