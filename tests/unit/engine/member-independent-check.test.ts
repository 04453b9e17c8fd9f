import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  deflectionEIKipFt3, designMember, loadCombinations, maxMomentKipFt, momentKipFt, nominalFlexure, reactionsKip,
  shapeConstantsByWeight, toSpanLoading, type LoadCase, type MemberDesignInput, type MemberLoad,
} from '../../../shared/engine/index';
import { eqF1_1 } from '../../../shared/engine/design/aisc360/chapter-f/f1';

/**
 * Recomputes a locked-shape check from the analysis closed forms alone (no per-member
 * precomputation, no superposition of cases, no shortcuts): each combination is one load set
 * including the factored self weight; every segment's Mmax comes from a fine scan plus the exact
 * span maximum, Cb from AISC 360-16 Eq. F1-1, Mn from F2/F3; deflection by golden-section search.
 */
function independentCheck(input: MemberDesignInput, shape: string) {
  const k = shapeConstantsByWeight(input.Fy_ksi).find((s) => s.label === shape)!;
  const L = input.span_ft;
  const sw: MemberLoad[] = input.includeSelfWeight ? [{ case: 'D', kind: 'uniform', w_klf: k.weightPlf / 1000 }] : [];
  const all = [...input.loads, ...sw];
  const present = (['D', 'L', 'Lr', 'S'] as LoadCase[]).filter((c) => all.some((l) => l.case === c));
  const scale = (l: MemberLoad, f: number): MemberLoad =>
    l.kind === 'point' ? { ...l, P_kip: l.P_kip * f } : l.kind === 'linear' ? { ...l, w1_klf: l.w1_klf * f, w2_klf: l.w2_klf * f } : { ...l, w_klf: l.w_klf * f };
  const pts = input.bracing === 'continuous' || input.bracing === 'none' ? [] : input.bracing.points_ft;
  const edges = [0, ...pts, L];
  let flex = 0, shear = 0;
  for (const combo of loadCombinations(input.method, present)) {
    const s = toSpanLoading(L, all.map((l) => scale(l, combo.factors[l.case])));
    const mx = maxMomentKipFt(s);
    for (let i = 0; i + 1 < edges.length; i++) {
      const a = edges[i], b = edges[i + 1];
      let mMax = Math.max(momentKipFt(s, a), momentKipFt(s, b));
      if (mx.xFt >= a && mx.xFt <= b) mMax = Math.max(mMax, mx.mKipFt);
      const cb = input.bracing === 'continuous' ? 1 : eqF1_1(mMax, momentKipFt(s, a + (b - a) / 4), momentKipFt(s, (a + b) / 2), momentKipFt(s, a + (3 * (b - a)) / 4));
      const lb = input.bracing === 'continuous' ? 0 : b - a;
      const mn = nominalFlexure(k, lb, cb).mnKipFt;
      flex = Math.max(flex, mMax / (input.method === 'LRFD' ? 0.9 * mn : mn / 1.67));
    }
    const r = reactionsKip(s);
    const vc = input.method === 'LRFD' ? k.shear.phiV * k.shear.vnKip : k.shear.vnKip / k.shear.omegaV;
    shear = Math.max(shear, Math.max(r.startKip, r.endKip) / vc);
  }
  const tot = toSpanLoading(L, all);
  let a = 0, b = L;
  const g = (Math.sqrt(5) - 1) / 2;
  for (let i = 0; i < 120; i++) {
    const c = b - g * (b - a), d = a + g * (b - a);
    if (deflectionEIKipFt3(tot, c) > deflectionEIKipFt3(tot, d)) b = d; else a = c;
  }
  const deflTotalIn = (deflectionEIKipFt3(tot, (a + b) / 2) * 1728) / (29000 * k.ixIn4);
  return { flex, shear, deflTotalIn };
}

const arb = fc.record({
  span: fc.double({ min: 10, max: 45, noNaN: true }),
  wd: fc.double({ min: 0.2, max: 3, noNaN: true }),
  wl: fc.double({ min: 0, max: 3, noNaN: true }),
  p: fc.double({ min: 0, max: 25, noNaN: true }),
  px: fc.double({ min: 0, max: 1, noNaN: true }),
  a: fc.double({ min: 0, max: 0.5, noNaN: true }),
  len: fc.double({ min: 0.05, max: 0.5, noNaN: true }),
  ws: fc.double({ min: 0, max: 1.5, noNaN: true }),
  bracing: fc.constantFrom('continuous', 'none', 'thirds', 'odd'),
  method: fc.constantFrom<'LRFD' | 'ASD'>('LRFD', 'ASD'),
  sw: fc.boolean(),
  shape: fc.constantFrom(...shapeConstantsByWeight(50).map((k) => k.label)),
});

describe('member checks against an independent recomputation (fast-check)', () => {
  it('when any shape is checked under mixed loads and bracing, then flexure, shear and total deflection ratios agree', () => {
    fc.assert(fc.property(arb, (m) => {
      const L = m.span;
      const input: MemberDesignInput = {
        span_ft: L,
        loads: [
          { case: 'D', kind: 'uniform', w_klf: m.wd },
          { case: 'L', kind: 'partial', w_klf: m.wl, from_ft: m.a * L, to_ft: (m.a + m.len) * L },
          { case: 'L', kind: 'point', P_kip: m.p, x_ft: m.px * L },
          { case: 'S', kind: 'linear', w1_klf: m.ws, w2_klf: 0, from_ft: 0, to_ft: 0.7 * L },
        ],
        bracing: m.bracing === 'thirds' ? { points_ft: [L / 3, (2 * L) / 3] } : m.bracing === 'odd' ? { points_ft: [0.2 * L, 0.55 * L] } : (m.bracing as 'continuous' | 'none'),
        method: m.method, Fy_ksi: 50, deflectionLimits: { live: 360, total: 240 }, includeSelfWeight: m.sw, shape: m.shape,
      };
      const r = designMember(input);
      const ind = independentCheck(input, m.shape);
      expect(r.ratios.flexure).toBeCloseTo(ind.flex, 9);
      expect(r.ratios.shear).toBeCloseTo(ind.shear, 9);
      expect(Math.abs(r.deflectionTotal_in - ind.deflTotalIn) / ind.deflTotalIn).toBeLessThan(1e-4); // 0.01 %
    }), { numRuns: 300 });
  });
});
