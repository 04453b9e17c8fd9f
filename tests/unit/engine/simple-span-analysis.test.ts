import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  deflectionEIKipFt3, maxMomentKipFt, maxShearKip, momentKipFt, reactionsKip, shearKip, stations, toSpanLoading, totalLoadKip,
} from '../../../shared/engine/analysis/simple-span.analysis';
import type { MemberLoad } from '../../../shared/engine/analysis/member-load.types';

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);
const TOL = 1e-3; // design-basis §4: closed forms reproduced to 0.1 %

describe('simple-span analysis against AISC Manual Part 3 closed forms', () => {
  it('when a full uniform load acts, then M = wL²/8 at midspan, R = wL/2 and EIΔ = 5wL⁴/384', () => {
    const w = 1.2, L = 30;
    const s = toSpanLoading(L, [{ case: 'D', kind: 'uniform', w_klf: w }]);
    const mx = maxMomentKipFt(s);
    expect(rel(mx.mKipFt, (w * L * L) / 8)).toBeLessThan(1e-12); // AISC Manual Part 3, simple beam, uniform load: wL²/8
    expect(mx.xFt).toBeCloseTo(15, 10);
    expect(reactionsKip(s).startKip).toBeCloseTo((w * L) / 2, 12); // wL/2
    expect(rel(deflectionEIKipFt3(s, L / 2), (5 * w * L ** 4) / 384)).toBeLessThan(1e-12); // 5wL⁴/384EI
    expect(maxShearKip(s)).toBeCloseTo(18, 12);
  });

  it('when a point load P acts at a, then Mmax = Pab/L under the load and Δ at midspan follows the Part 3 formula', () => {
    const P = 10, L = 24, a = 8, b = 16;
    const s = toSpanLoading(L, [{ case: 'L', kind: 'point', P_kip: P, x_ft: a }]);
    const mx = maxMomentKipFt(s);
    expect(rel(mx.mKipFt, (P * a * b) / L)).toBeLessThan(1e-12); // AISC Manual Part 3, concentrated load at any point: Pab/L
    expect(mx.xFt).toBe(a);
    expect(reactionsKip(s).startKip).toBeCloseTo((P * b) / L, 12); // R1 = Pb/L
    const x = 12; // x > a: Δx = P a (L − x)(2Lx − x² − a²)/(6EIL)
    expect(rel(deflectionEIKipFt3(s, x), (P * a * (L - x) * (2 * L * x - x * x - a * a)) / (6 * L))).toBeLessThan(1e-12);
    // Δmax = P a b (a + 2b) sqrt(3a(a + 2b)) / (27 E I L) at x = sqrt(a(a + 2b)/3) measured from the end nearer... (a < b)
    const xm = L - Math.sqrt((b * (b + 2 * a)) / 3);
    const dmax = (P * a * b * (b + 2 * a) * Math.sqrt(3 * b * (b + 2 * a))) / (27 * L);
    expect(rel(deflectionEIKipFt3(s, xm), dmax)).toBeLessThan(1e-10);
  });

  it('when a point load acts at midspan, then Δ = PL³/48EI and M = PL/4', () => {
    const s = toSpanLoading(20, [{ case: 'L', kind: 'point', P_kip: 6, x_ft: 10 }]);
    expect(rel(deflectionEIKipFt3(s, 10), (6 * 20 ** 3) / 48)).toBeLessThan(1e-12); // AISC Manual Part 3: PL³/48EI
    expect(maxMomentKipFt(s).mKipFt).toBeCloseTo(30, 10); // PL/4
    expect(shearKip(s, 10, -1)).toBeCloseTo(3, 12);
    expect(shearKip(s, 10, 1)).toBeCloseTo(-3, 12);
  });

  it('when a partial uniform load acts from a to a+b, then reactions and Mmax follow the Part 3 formulas', () => {
    // AISC Manual Part 3, uniform load partially distributed: R1 = wb(2c + b)/(2L), Mmax = R1(a + R1/(2w))
    const w = 2, L = 30, a = 6, b = 12, c = L - a - b;
    const s = toSpanLoading(L, [{ case: 'D', kind: 'partial', w_klf: w, from_ft: a, to_ft: a + b }]);
    const r1 = (w * b * (2 * c + b)) / (2 * L);
    expect(reactionsKip(s).startKip).toBeCloseTo(r1, 12);
    expect(reactionsKip(s).endKip).toBeCloseTo((w * b * (2 * a + b)) / (2 * L), 12);
    const mx = maxMomentKipFt(s);
    expect(rel(mx.mKipFt, r1 * (a + r1 / (2 * w)))).toBeLessThan(1e-12);
    expect(mx.xFt).toBeCloseTo(a + r1 / w, 10);
  });

  it('when a triangular load increases to one end, then R = W/3 and 2W/3, Mmax = 0.1283 W L, Δmax = 0.01304 W L³/EI', () => {
    // AISC Manual Part 3, load increasing uniformly to one end, total load W
    const L = 20, wMax = 3, W = (wMax * L) / 2;
    const s = toSpanLoading(L, [{ case: 'L', kind: 'linear', w1_klf: 0, w2_klf: wMax, from_ft: 0, to_ft: L }]);
    expect(reactionsKip(s).startKip).toBeCloseTo(W / 3, 12);
    expect(reactionsKip(s).endKip).toBeCloseTo((2 * W) / 3, 12);
    const mx = maxMomentKipFt(s);
    expect(rel(mx.mKipFt, (2 * W * L) / (9 * Math.sqrt(3)))).toBeLessThan(1e-12); // 2WL/(9√3) = 0.1283 WL
    expect(mx.xFt).toBeCloseTo(L / Math.sqrt(3), 10); // at x = L/√3
    const xd = L * Math.sqrt(1 - Math.sqrt(8 / 15));
    expect(rel(deflectionEIKipFt3(s, xd), 0.01304 * W * L ** 3)).toBeLessThan(TOL); // 0.01304 W L³/EI (printed to 4 digits)
  });

  it('when stations are generated, then a point load produces a shear step with both sides reported', () => {
    const st = stations(toSpanLoading(10, [{ case: 'L', kind: 'point', P_kip: 4, x_ft: 5 }]), 10);
    const at5 = st.filter((p) => p.xFt === 5);
    expect(at5.map((p) => p.vKip)).toEqual([2, -2]); // closed form: R = P/2 each side
    expect(st[0].vKip).toBe(2);
    expect(st[st.length - 1].vKip).toBe(-2);
  });
});

const spanArb = fc.double({ min: 5, max: 60, noNaN: true });
const loadsArb = (L: number) =>
  fc.array(
    fc.oneof(
      fc.record({ case: fc.constant('D' as const), kind: fc.constant('uniform' as const), w_klf: fc.double({ min: 0, max: 5, noNaN: true }) }),
      fc.tuple(fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 5, noNaN: true }))
        .filter(([a, b]) => Math.abs(a - b) > 1e-3)
        .map(([a, b, w]) => ({ case: 'L' as const, kind: 'partial' as const, w_klf: w, from_ft: Math.min(a, b) * L, to_ft: Math.max(a, b) * L })),
      fc.tuple(fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 5, noNaN: true }), fc.double({ min: 0, max: 5, noNaN: true }))
        .filter(([a, b]) => Math.abs(a - b) > 1e-3)
        .map(([a, b, w1, w2]) => ({ case: 'S' as const, kind: 'linear' as const, w1_klf: w1, w2_klf: w2, from_ft: Math.min(a, b) * L, to_ft: Math.max(a, b) * L })),
      fc.tuple(fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 50, noNaN: true }))
        .map(([a, P]) => ({ case: 'L' as const, kind: 'point' as const, P_kip: P, x_ft: a * L })),
    ) as fc.Arbitrary<MemberLoad>,
    { minLength: 1, maxLength: 5 },
  );

describe('simple-span analysis properties (fast-check)', () => {
  it('when any downward loads act, then the reactions balance the total load and the moments at the supports are zero', () => {
    fc.assert(fc.property(spanArb.chain((L) => fc.tuple(fc.constant(L), loadsArb(L))), ([L, loads]) => {
      const s = toSpanLoading(L, loads);
      const r = reactionsKip(s);
      const total = totalLoadKip(s);
      expect(r.startKip + r.endKip).toBeCloseTo(total, 8);
      expect(Math.abs(momentKipFt(s, L))).toBeLessThan(1e-8 * Math.max(1, total * L));
      expect(shearKip(s, L, 1)).toBeCloseTo(-r.endKip, 8);
    }));
  });

  it('when any downward loads act, then the maximum moment is not exceeded at any station (exact maximum)', () => {
    fc.assert(fc.property(spanArb.chain((L) => fc.tuple(fc.constant(L), loadsArb(L))), ([L, loads]) => {
      const s = toSpanLoading(L, loads);
      const mx = maxMomentKipFt(s);
      for (const st of stations(s, 200)) expect(st.mKipFt).toBeLessThanOrEqual(mx.mKipFt * (1 + 1e-10) + 1e-10);
      expect(momentKipFt(s, mx.xFt)).toBeCloseTo(mx.mKipFt, 8);
    }));
  });

  it('when M is integrated numerically twice, then EIΔ at midspan agrees with the closed-form superposition to 0.1 %', () => {
    fc.assert(fc.property(spanArb.chain((L) => fc.tuple(fc.constant(L), loadsArb(L))), ([L, loads]) => {
      const s = toSpanLoading(L, loads);
      // Unit-load method: EIΔ(L/2) = ∫ M(x) m(x) dx with m = x/2 (x ≤ L/2), Simpson with 2000 intervals.
      const n = 2000, h = L / n;
      let sum = 0;
      for (let i = 0; i <= n; i++) {
        const x = i * h;
        const m = x <= L / 2 ? x / 2 : (L - x) / 2;
        sum += (i === 0 || i === n ? 1 : i % 2 ? 4 : 2) * momentKipFt(s, x) * m;
      }
      const numeric = (sum * h) / 3;
      const closed = deflectionEIKipFt3(s, L / 2);
      expect(Math.abs(numeric - closed)).toBeLessThanOrEqual(TOL * Math.abs(closed) + 1e-9);
    }), { numRuns: 60 });
  });
});
