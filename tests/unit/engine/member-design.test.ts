import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  designMember, memberAlternatives, memberDiagrams, MemberInputError, shapeConstantsByWeight,
  type MemberDesignInput, type MemberLoad,
} from '../../../shared/engine/index';
import { buildMemberContext } from '../../../shared/engine/sizing/member-context';
import { candidateShapes } from '../../../shared/engine/sizing/member-design';
import { evaluateShape } from '../../../shared/engine/sizing/shape-evaluation';

const base = (over: Partial<MemberDesignInput> = {}): MemberDesignInput => ({
  span_ft: 35,
  loads: [{ case: 'D', kind: 'uniform', w_klf: 0.45 }, { case: 'L', kind: 'uniform', w_klf: 0.75 }],
  bracing: 'continuous', method: 'LRFD', Fy_ksi: 50, deflectionLimits: { live: null, total: null },
  includeSelfWeight: false, ...over,
});

describe('member design against AISC Design Examples (companion to the 15th ed. Manual)', () => {
  it('when W18X50 spans 35 ft with wD = 0.45, wL = 0.75 klf, continuously braced, then Mu = 266 and φbMn = 379 kip-ft (Example F.1-1A)', () => {
    const r = designMember(base({ shape: 'W18X50' }));
    // AISC Design Examples F.1-1A (recalled from memory; design-basis §7)
    expect(+r.Mr_kipft.toFixed(0)).toBe(266);
    expect(+r.Mc_kipft.toFixed(0)).toBe(379);
    expect(r.Lb_ft).toBe(0);
    expect(r.Cb).toBe(1);
    expect(r.governingCombination).toBe('1.2D+1.6L');
    expect(r.checks[0].equation).toBe('Eq. F2-1');
    expect(r.passes).toBe(true);
    expect(r.locked).toBe(true);
  });

  it('when the same beam is braced at third points, then the middle segment governs with Lb = 11.67 ft, Cb = 1.01, φbMn ≈ 306 kip-ft (Example F.1-2A)', () => {
    const r = designMember(base({ shape: 'W18X50', bracing: { points_ft: [35 / 3, 70 / 3] } }));
    // AISC Design Examples F.1-2A (recalled from memory; design-basis §7)
    expect(r.Lb_ft).toBeCloseTo(11.67, 2);
    expect(+r.Cb.toFixed(2)).toBe(1.01);
    expect(Math.abs(r.Mc_kipft - 306) / 306).toBeLessThan(0.005);
    expect(r.segments).toHaveLength(3);
    expect(r.segments[1].ratio).toBe(r.ratios.flexure);
    // End segments: moment from 0 to 0.89 Mmax, Eq. F1-1 by hand gives 1.46 (closed form of wx(L−x)/2)
    expect(r.segments[0].Cb).toBeCloseTo(1.46, 2);
    expect(r.checks[0].equation).toBe('Eq. F2-2');
  });

  it('when the beam has no intermediate bracing (Lb = 35 ft > Lr), then Eq. F2-3 governs with Cb = 1.14 for a uniform load', () => {
    const r = designMember(base({ shape: 'W18X50', bracing: 'none' }));
    expect(r.Lb_ft).toBe(35);
    expect(r.Cb).toBeCloseTo(1.136, 3); // Eq. F1-1 for a parabola: 12.5/(2.5 + 3·0.75 + 4 + 3·0.75) = 1.136
    expect(r.checks[0].equation).toBe('Eq. F2-3');
    expect(r.checks[0].Fcr_ksi).toBeGreaterThan(0);
    expect(r.passes).toBe(false);
    expect(r.failure).toMatch(/Locked shape W18X50 does not pass/);
  });

  it('when the method is ASD, then Mc = Mn/1.67 and Vc = Vn/1.50 under D+L', () => {
    const r = designMember(base({ shape: 'W18X50', method: 'ASD' }));
    expect(r.governingCombination).toBe('D+L');
    expect(r.Mr_kipft).toBeCloseTo((1.2 * 35 * 35) / 8, 10); // (wD + wL) L²/8
    expect(r.Mc_kipft).toBeCloseTo(420.8333 / 1.67, 3); // AISC Manual Table 3-2 Mpx/Ωb = 252 (recalled from memory)
    expect(r.Vc_kip).toBeCloseTo(191.7 / 1.5, 8);
  });

  it('when self weight is included, then D reactions include W·L/2 and Mu includes 1.2·w_sw·L²/8', () => {
    const r = designMember(base({ shape: 'W18X50', includeSelfWeight: true }));
    expect(r.reactions.start.D_kip).toBeCloseTo(0.45 * 17.5 + 0.05 * 17.5, 10);
    expect(r.reactions.end.L_kip).toBeCloseTo(0.75 * 17.5, 10);
    expect(r.Mr_kipft).toBeCloseTo(((1.2 * 0.5 + 1.6 * 0.75) * 35 * 35) / 8, 8);
  });

  it('when live and total deflection limits apply, then Δ = 5wL⁴/384EI for L and for all cases together', () => {
    const r = designMember(base({ shape: 'W18X50', deflectionLimits: { live: 360, total: 240 } }));
    const eiToIn = 1728 / (29000 * 800); // Ix = 800 in⁴ (AISC Shapes Database v15.0, W18X50)
    expect(r.deflectionLive_in).toBeCloseTo(((5 * 0.75 * 35 ** 4) / 384) * eiToIn, 5); // closed form 5wL⁴/384EI
    expect(r.deflectionTotal_in).toBeCloseTo(((5 * 1.2 * 35 ** 4) / 384) * eiToIn, 5);
    expect(r.ratios.deflectionLive).toBeCloseTo(r.deflectionLive_in / (35 * 12 / 360), 10);
    expect(r.checks.map((c) => c.name)).toEqual(['flexure', 'shear', 'deflectionLive', 'deflectionTotal']);
  });

  it('when a point, a partial and a linear load act, then reactions by case and Mu match statics by hand', () => {
    const loads: MemberLoad[] = [
      { case: 'D', kind: 'partial', w_klf: 1, from_ft: 0, to_ft: 10 },
      { case: 'L', kind: 'point', P_kip: 12, x_ft: 15 },
      { case: 'S', kind: 'linear', w1_klf: 0, w2_klf: 0.6, from_ft: 0, to_ft: 30 },
    ];
    const r = designMember(base({ span_ft: 30, loads, shape: 'W16X31' }));
    // Statics by hand: partial D: R1 = 10·(30 − 5)/30; point L at midspan: 6 each; triangle S (W = 9): W/3 and 2W/3
    expect(r.reactions.start.D_kip).toBeCloseTo(250 / 30, 10);
    expect(r.reactions.start.L_kip).toBeCloseTo(6, 10);
    expect(r.reactions.start.S_kip).toBeCloseTo(3, 10);
    expect(r.reactions.end.S_kip).toBeCloseTo(6, 10);
    expect(r.combinations.map((c) => c.name)).toEqual(['1.4D', '1.2D+1.6L+0.5S', '1.2D+1.6S+1.0L']);
  });

  it('when a locked shape fails, then it is reported as is and never replaced', () => {
    const r = designMember(base({ shape: 'w12x14' }));
    expect(r.shape).toBe('W12X14');
    expect(r.locked).toBe(true);
    expect(r.passes).toBe(false);
    expect(r.failure).toContain('W12X14');
  });

  it('when nothing within the depth limit passes, then passes = false with the best ratio and the governing check named', () => {
    const r = designMember(base({ span_ft: 45, loads: [{ case: 'L', kind: 'uniform', w_klf: 3 }], maxDepth_in: 8.5 }));
    expect(r.passes).toBe(false);
    expect(r.shape.startsWith('W8')).toBe(true);
    const ratios = candidateShapes(base({ maxDepth_in: 8.5 })).map((k) => evaluateShape(buildMemberContext(base({ span_ft: 45, loads: [{ case: 'L', kind: 'uniform', w_klf: 3 }], maxDepth_in: 8.5 })), k, false).ratio);
    expect(r.ratio).toBe(Math.min(...ratios));
    expect(r.failure).toMatch(/No W-shape within the constraints \(d ≤ 8.5 in\) passes\. Best ratio reached: \d+\.\d{3} with W8X/);
  });

  it('when the constraints leave no shape, then a MemberInputError names maxDepth_in', () => {
    expect(() => designMember(base({ maxDepth_in: 3 }))).toThrow(MemberInputError);
    try { designMember(base({ maxDepth_in: 3 })); } catch (e) { expect((e as MemberInputError).problems[0]).toMatch(/^maxDepth_in: /); }
  });

  it('when a load lies outside the span, then the error names the load and field', () => {
    try {
      designMember(base({ span_ft: 32, loads: [{ case: 'D', kind: 'uniform', w_klf: 1 }, { case: 'L', kind: 'uniform', w_klf: 1 }, { case: 'L', kind: 'point', P_kip: 1, x_ft: 40 }] }));
      expect.unreachable();
    } catch (e) {
      expect((e as MemberInputError).problems).toEqual(['loads[2].x_ft: must be within the span 0–32 ft']);
    }
  });

  it('when shapes weigh the same, then the shallower comes first in the selection order (design-basis §5)', () => {
    const order = candidateShapes(base()).map((k) => k.label);
    // W10X22, W12X22 and W14X22 all weigh 22 lb/ft (AISC Shapes Database v15.0); d = 10.2, 12.3, 13.7 in
    expect(order.indexOf('W10X22')).toBeLessThan(order.indexOf('W12X22'));
    expect(order.indexOf('W12X22')).toBeLessThan(order.indexOf('W14X22'));
    expect(order.indexOf('W14X22') + 1).toBeLessThan(order.length);
  });

  it('when allowed nominal depths are given, then only those series are chosen', () => {
    const r = designMember(base({ allowedNominalDepths: [16] }));
    expect(r.shape.startsWith('W16X')).toBe(true);
    expect(r.passes).toBe(true);
  });

  it('when asked for alternatives, then the next lighter fails and the next shallower passes with a smaller nominal depth', () => {
    const input = base({ includeSelfWeight: true, deflectionLimits: { live: 360, total: 240 } });
    const r = designMember(input);
    const alt = memberAlternatives(input, r.shape);
    expect(alt.nextLighter).not.toBeNull();
    expect(alt.nextLighter!.weight_plf).toBeLessThanOrEqual(r.weight_plf);
    expect(alt.nextLighter!.passes).toBe(false);
    if (alt.nextShallower) {
      expect(alt.nextShallower.passes).toBe(true);
      expect(alt.nextShallower.weight_plf).toBeGreaterThanOrEqual(r.weight_plf);
    }
  });

  it('when diagrams are requested, then stations carry V, M and Δ with M = wL²/8 at midspan for the governing combination', () => {
    const d = memberDiagrams(base(), 'W18X50', 10);
    const mid = d.x_ft.indexOf(17.5);
    expect(d.governing.label).toBe('1.2D+1.6L');
    expect(d.governing.M_kipft[mid]).toBeCloseTo((1.74 * 35 * 35) / 8, 8);
    expect(d.D.V_kip[0]).toBeCloseTo(0.45 * 17.5, 10);
    expect(d.L.deflection_in[mid]).toBeCloseTo((5 * 0.75 * 35 ** 4 / 384) * 1728 / (29000 * 800), 8);
    expect(d.x_ft).toHaveLength(d.governing.V_kip.length);
  });
});

// ---- selection properties -------------------------------------------------------------------

function bruteForce(input: MemberDesignInput): string | null {
  const ctx = buildMemberContext(input);
  for (const k of candidateShapes(input)) {
    const ev = evaluateShape(ctx, k, false);
    if (ev.passes) return k.label;
  }
  return null;
}

const memberArb: fc.Arbitrary<MemberDesignInput> = fc
  .record({
    span: fc.double({ min: 10, max: 45, noNaN: true }),
    wd: fc.double({ min: 0.2, max: 3, noNaN: true }),
    wl: fc.double({ min: 0.2, max: 3, noNaN: true }),
    p: fc.double({ min: 0, max: 20, noNaN: true }),
    px: fc.double({ min: 0, max: 1, noNaN: true }),
    bracing: fc.constantFrom<'continuous' | 'none' | 'thirds'>('continuous', 'none', 'thirds'),
    method: fc.constantFrom<'LRFD' | 'ASD'>('LRFD', 'ASD'),
    maxDepth: fc.option(fc.constantFrom(12, 16.5, 21.5, 24.5), { nil: null }),
    sw: fc.boolean(),
  })
  .map((m) => ({
    span_ft: m.span,
    loads: [
      { case: 'D', kind: 'uniform', w_klf: m.wd },
      { case: 'L', kind: 'uniform', w_klf: m.wl },
      { case: 'L', kind: 'point', P_kip: m.p, x_ft: m.px * m.span },
    ] as MemberLoad[],
    bracing: m.bracing === 'thirds' ? { points_ft: [m.span / 3, (2 * m.span) / 3] } : m.bracing,
    method: m.method, Fy_ksi: 50, deflectionLimits: { live: 360, total: 240 },
    includeSelfWeight: m.sw, maxDepth_in: m.maxDepth,
  }));

describe('selection properties (fast-check, brute force over the whole catalog)', () => {
  it('when a member is sized, then the result equals brute force: it passes and no lighter (or equal, shallower) candidate passes', () => {
    fc.assert(fc.property(memberArb, (input) => {
      const r = designMember(input);
      const brute = bruteForce(input);
      if (brute === null) expect(r.passes).toBe(false);
      else {
        expect(r.shape).toBe(brute);
        expect(r.passes).toBe(true);
        expect(r.ratio).toBeLessThanOrEqual(1);
        if (input.maxDepth_in != null) expect(shapeConstantsByWeight(50).find((k) => k.label === r.shape)!.dIn).toBeLessThanOrEqual(input.maxDepth_in);
      }
    }), { numRuns: 150 });
  });

  it('when every load grows, then the selected shape is never lighter', () => {
    fc.assert(fc.property(memberArb, fc.double({ min: 1, max: 2, noNaN: true }), (input, f) => {
      const more: MemberDesignInput = {
        ...input,
        loads: input.loads.map((l) => (l.kind === 'point' ? { ...l, P_kip: l.P_kip * f } : l.kind === 'uniform' ? { ...l, w_klf: l.w_klf * f } : l)),
      };
      const a = designMember(input), b = designMember(more);
      if (a.passes && b.passes) expect(b.weight_plf).toBeGreaterThanOrEqual(a.weight_plf);
      if (!a.passes) expect(b.passes).toBe(false);
    }), { numRuns: 100 });
  });

  it('when a shape is locked, then it is reported, never silently replaced, whatever the loads', () => {
    const labels = shapeConstantsByWeight(50).map((k) => k.label);
    fc.assert(fc.property(memberArb, fc.constantFrom(...labels), (input, shape) => {
      const r = designMember({ ...input, shape, maxDepth_in: null });
      expect(r.shape).toBe(shape);
      expect(r.locked).toBe(true);
      expect(r.passes).toBe(r.ratio <= 1);
      if (!r.passes) expect(r.failure).toContain(shape);
    }), { numRuns: 100 });
  });

  it('when Lb grows, then the available moment never rises (any shape, Cb = 1)', () => {
    const shapes = shapeConstantsByWeight(50);
    fc.assert(fc.property(fc.integer({ min: 0, max: shapes.length - 1 }), fc.double({ min: 0, max: 60, noNaN: true }), fc.double({ min: 0, max: 10, noNaN: true }), (i, lb, d) => {
      const r1 = designMember(base({ shape: shapes[i].label, span_ft: 60, Lb_override_ft: lb }));
      const r2 = designMember(base({ shape: shapes[i].label, span_ft: 60, Lb_override_ft: Math.min(60, lb + d) }));
      expect(r2.Mc_kipft).toBeLessThanOrEqual(r1.Mc_kipft + 1e-9);
    }), { numRuns: 200 });
  });

  it('when the moment is uniform over a segment (equal end moments), then Cb = 1.0', () => {
    // Two equal point loads at the brace points: the middle segment has uniform moment P·a.
    fc.assert(fc.property(fc.double({ min: 12, max: 40, noNaN: true }), fc.double({ min: 1, max: 30, noNaN: true }), (L, P) => {
      const a = L / 3;
      const r = designMember(base({
        span_ft: L, shape: 'W24X55', bracing: { points_ft: [a, 2 * a] },
        loads: [{ case: 'L', kind: 'point', P_kip: P, x_ft: a }, { case: 'L', kind: 'point', P_kip: P, x_ft: 2 * a }],
      }));
      expect(r.segments[1].Cb).toBeCloseTo(1.0, 10); // AISC 360-16 Eq. F1-1 with Mmax = MA = MB = MC
    }), { numRuns: 50 });
  });
});

describe('next lighter is strictly lighter', () => {
  // AISC Manual 15th ed. Table 1-1 (AISC Shapes Database v15.0): W18X40 and W16X40 both weigh 40 plf; W16X26 and W14X26 both 26 plf.
  it('when the shape is W18X40 or W16X26, then next lighter weighs less and the equal-weight shape is named as the same weight', () => {
    for (const [shape, twin] of [['W18X40', 'W16X40'], ['W16X26', 'W14X26']] as const) {
      const alt = memberAlternatives(base(), shape);
      const w = Number(shape.split('X')[1]);
      expect(alt.nextLighter!.weight_plf, shape).toBeLessThan(w);
      expect(alt.nextLighter!.shape).not.toBe(twin);
      expect(alt.sameWeight?.weight_plf).toBe(w);
      expect(alt.sameWeight?.shape).not.toBe(shape);
    }
  });

  it('when any compact catalog shape is the design, then next lighter is the heaviest candidate strictly lighter (brute force)', () => {
    const candidates = candidateShapes({ ...base(), shape: null }).filter((c) => c.webCompact);
    fc.assert(
      fc.property(fc.constantFrom(...candidates), (k) => {
        const alt = memberAlternatives(base(), k.label);
        const lighter = candidates.filter((c) => c.weightPlf < k.weightPlf);
        if (lighter.length === 0) {
          expect(alt.nextLighter).toBeNull();
        } else {
          expect(alt.nextLighter!.weight_plf).toBe(Math.max(...lighter.map((c) => c.weightPlf)));
          expect(alt.nextLighter!.weight_plf).toBeLessThan(k.weightPlf);
        }
      }),
      { numRuns: 60 },
    );
  });
});
