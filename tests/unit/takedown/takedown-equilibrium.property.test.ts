import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { runTakedown } from '../../../shared/engine/takedown/gravity-takedown.takedown';
import type { Plan } from '../../../shared/schemas/plan.schema';
import { emptyPlan, member, zone } from './plan-builder';

/** A random regular framing plan; returns it with its applied load worked out independently. */
const planArbitrary = fc
  .record({
    levels: fc.integer({ min: 1, max: 3 }),
    bayX: fc.array(fc.integer({ min: 16, max: 80 }).map((v) => v / 2), { minLength: 1, maxLength: 3 }),
    bayY: fc.array(fc.integer({ min: 16, max: 80 }).map((v) => v / 2), { minLength: 1, maxLength: 3 }),
    span: fc.constantFrom('x' as const, 'y' as const),
    subdivisions: fc.integer({ min: 1, max: 4 }),
    zones: fc.array(fc.record({ dead: fc.integer({ min: 0, max: 90 }), live: fc.integer({ min: 0, max: 150 }), partition: fc.integer({ min: 0, max: 20 }), reducible: fc.boolean(), snow: fc.integer({ min: 0, max: 30 }) }), { minLength: 1, maxLength: 3 }),
    zonePick: fc.array(fc.nat(), { minLength: 9, maxLength: 9 }),
    overhangLow: fc.integer({ min: 0, max: 8 }).map((v) => v / 2),
    overhangHigh: fc.integer({ min: 0, max: 8 }).map((v) => v / 2),
    openings: fc.array(fc.record({ bay: fc.nat(), fx: fc.double({ min: 0.1, max: 0.5, noNaN: true }), fy: fc.double({ min: 0.1, max: 0.5, noNaN: true }), w: fc.double({ min: 0.1, max: 0.4, noNaN: true }), h: fc.double({ min: 0.1, max: 0.4, noNaN: true }) }), { maxLength: 3 }),
    points: fc.array(fc.record({ fx: fc.double({ min: 0, max: 1, noNaN: true }), fy: fc.double({ min: 0, max: 1, noNaN: true }), D: fc.double({ min: 0, max: 10, noNaN: true }), L: fc.double({ min: 0, max: 10, noNaN: true }) }), { maxLength: 4 }),
    lines: fc.array(fc.record({ a: fc.tuple(fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true })), b: fc.tuple(fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true })), D: fc.double({ min: 0, max: 1, noNaN: true }), L: fc.double({ min: 0, max: 1, noNaN: true }) }), { maxLength: 3 }),
    selfWeight: fc.integer({ min: 0, max: 80 }),
  })
  .map((g) => {
    const levels = Array.from({ length: g.levels }, (_, i) => `L${i + 2}`);
    const plan: Plan = emptyPlan(levels);
    const xs = [0];
    g.bayX.forEach((w) => xs.push(xs[xs.length - 1] + w));
    const ys = [0];
    g.bayY.forEach((w) => ys.push(ys[ys.length - 1] + w));
    // Work in (u along span, v across); map to plan (x, y).
    const [us, vs] = g.span === 'x' ? [xs, ys] : [ys, xs];
    const P = (u: number, v: number): [number, number] => (g.span === 'x' ? [u, v] : [v, u]);
    g.zones.forEach((z, i) => plan.zones.push(zone(`z${i}`, { dead_psf: z.dead, live_psf: z.live, partition_psf: z.partition, liveReducible: z.reducible, snow_psf: z.snow })));
    us.forEach((u, i) => vs.forEach((v, j) => plan.columns.push({ id: `C${i}-${j}`, ...(([x, y]) => ({ x_ft: x, y_ft: y }))(P(u, v)), levels: [...levels] })));
    const expected = { D: 0, L: 0 };
    const holes: [number, number, number, number][] = []; // plan boxes x0, y0, x1, y1
    for (const level of levels) {
      let n = 0;
      // Girders run along the span (u), on every v grid line; beams run across (constant u).
      for (let j = 0; j < vs.length; j++) for (let i = 0; i + 1 < us.length; i++) plan.members.push(member(`${level}g${n++}`, 'girder', P(us[i], vs[j]), P(us[i + 1], vs[j]), level));
      for (let i = 0; i + 1 < us.length; i++) {
        for (let k = i === 0 ? 0 : 1; k <= g.subdivisions; k++) {
          const u = us[i] + ((us[i + 1] - us[i]) * k) / g.subdivisions;
          for (let j = 0; j + 1 < vs.length; j++) plan.members.push(member(`${level}b${n++}`, 'beam', P(u, vs[j]), P(u, vs[j + 1]), level));
        }
      }
      let bay = 0;
      for (let i = 0; i + 1 < us.length; i++) {
        for (let j = 0; j + 1 < vs.length; j++, bay++) {
          const z = g.zones[g.zonePick[bay % 9] % g.zones.length];
          const u0 = us[i] - (i === 0 ? g.overhangLow : 0);
          const u1 = us[i + 1] + (i + 2 === us.length ? g.overhangHigh : 0);
          const poly = [P(u0, vs[j]), P(u1, vs[j]), P(u1, vs[j + 1]), P(u0, vs[j + 1])];
          plan.decks.push({ id: `${level}d${bay}`, level, polygon: g.span === 'x' ? poly : [...poly].reverse(), spanDirection: g.span, zone: `z${g.zonePick[bay % 9] % g.zones.length}` });
          let area = (u1 - u0) * (vs[j + 1] - vs[j]);
          for (const o of g.openings.filter((o) => o.bay % 9 === bay)) {
            const ou0 = us[i] + (us[i + 1] - us[i]) * o.fx;
            const ov0 = vs[j] + (vs[j + 1] - vs[j]) * o.fy;
            const ou1 = ou0 + (us[i + 1] - us[i]) * o.w;
            const ov1 = ov0 + (vs[j + 1] - vs[j]) * o.h;
            if (level === levels[0] && !holes.some(([a, b, c, d]) => overlaps([a, b, c, d], box(P(ou0, ov0), P(ou1, ov1))))) holes.push(box(P(ou0, ov0), P(ou1, ov1)));
          }
          for (const h of holes.filter((h) => inside(h, box(P(us[i], vs[j]), P(us[i + 1], vs[j + 1]))))) area -= (h[2] - h[0]) * (h[3] - h[1]);
          expected.D += (area * z.dead) / 1000;
          expected.L += (area * (z.live + z.partition)) / 1000;
        }
      }
      holes.forEach((h, k) => plan.openings.push({ id: `${level}o${k}`, level, polygon: [[h[0], h[1]], [h[2], h[1]], [h[2], h[3]], [h[0], h[3]]] }));
      const X = xs[xs.length - 1];
      const Y = ys[ys.length - 1];
      g.points.forEach((p, k) => {
        const at: [number, number] = [p.fx * X, p.fy * Y];
        if (holes.some((h) => at[0] > h[0] - 0.02 && at[0] < h[2] + 0.02 && at[1] > h[1] - 0.02 && at[1] < h[3] + 0.02)) return;
        plan.pointLoads.push({ id: `${level}p${k}`, level, x_ft: at[0], y_ft: at[1], D_kip: p.D, L_kip: p.L });
        expected.D += p.D;
        expected.L += p.L;
      });
      g.lines.forEach((l, k) => {
        const a: [number, number] = [l.a[0] * X, l.a[1] * Y];
        const b: [number, number] = [l.b[0] * X, l.b[1] * Y];
        const length = Math.hypot(b[0] - a[0], b[1] - a[1]);
        if (length < 0.1 || holes.some((h) => segmentTouchesBox(a, b, [h[0] - 0.02, h[1] - 0.02, h[2] + 0.02, h[3] + 0.02]))) return;
        plan.lineLoads.push({ id: `${level}w${k}`, level, start: a, end: b, D_klf: l.D, L_klf: l.L });
        expected.D += l.D * length;
        expected.L += l.L * length;
      });
    }
    const steel = plan.members.reduce((s, m) => s + (Math.hypot(m.end[0] - m.start[0], m.end[1] - m.start[1]) * g.selfWeight) / 1000, 0);
    expected.D += steel;
    return { plan, expected, selfWeight: g.selfWeight };
  });

function box(a: [number, number], b: [number, number]): [number, number, number, number] {
  return [Math.min(a[0], b[0]), Math.min(a[1], b[1]), Math.max(a[0], b[0]), Math.max(a[1], b[1])];
}
function overlaps(a: number[], b: number[]) {
  return a[0] < b[2] + 0.1 && b[0] < a[2] + 0.1 && a[1] < b[3] + 0.1 && b[1] < a[3] + 0.1;
}
function inside(h: number[], bay: number[]) {
  return h[0] >= bay[0] - 1e-9 && h[2] <= bay[2] + 1e-9 && h[1] >= bay[1] - 1e-9 && h[3] <= bay[3] + 1e-9;
}
/** Liang–Barsky clip: does segment ab touch the box? */
function segmentTouchesBox(a: [number, number], b: [number, number], bx: number[]): boolean {
  let t0 = 0;
  let t1 = 1;
  const d = [b[0] - a[0], b[1] - a[1]];
  const checks: [number, number][] = [[-d[0], a[0] - bx[0]], [d[0], bx[2] - a[0]], [-d[1], a[1] - bx[1]], [d[1], bx[3] - a[1]]];
  for (const [p, q] of checks) {
    if (p === 0) {
      if (q < 0) return false;
    } else {
      const r = q / p;
      if (p < 0) t0 = Math.max(t0, r);
      else t1 = Math.min(t1, r);
      if (t0 > t1) return false;
    }
  }
  return true;
}

const relClose = (a: number, b: number) => Math.abs(a - b) <= 1e-6 * Math.max(1, Math.abs(b));

describe('equilibrium of the takedown (design-basis §2: the first test of everything)', () => {
  it('when any regular plan is taken down, then column reactions equal the applied D and L (before reduction) to 1e-6', () => {
    fc.assert(
      fc.property(planArbitrary, ({ plan, expected, selfWeight }) => {
        const r = runTakedown(plan, { selfWeight: () => selfWeight });
        expect(r.problems.filter((p) => p.severity === 'error')).toEqual([]);
        expect(relClose(r.equilibrium.D.applied_kip, expected.D)).toBe(true);
        expect(relClose(r.equilibrium.D.reactions_kip, expected.D)).toBe(true);
        expect(relClose(r.equilibrium.L.applied_kip, expected.L)).toBe(true);
        expect(relClose(r.equilibrium.L.reactions_kip, expected.L)).toBe(true);
        // Column stacks: the bottom level of every column holds everything above it.
        const bottom = r.columns.reduce((s, c) => s + (c.levels[c.levels.length - 1]?.D_kip ?? 0), 0);
        expect(relClose(bottom, expected.D)).toBe(true);
      }),
      { numRuns: 150 },
    );
  }, 60_000);
});
