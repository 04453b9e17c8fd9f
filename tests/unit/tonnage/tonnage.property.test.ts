import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { getWShape } from '../../../shared/catalog/w-shapes.catalog';
import { designScheme } from '../../../shared/engine/index';
import { computeTonnage, LB_PER_TON } from '../../../shared/tonnage/tonnage';
import { singleBay, zone } from '../takedown/plan-builder';

// Invariants of tonnage over generated framing plans designed by the engine: the totals are
// the direct sums over the members (shape weight from the AISC Shapes Database v15.0 catalog
// × span), and the breakdowns by level and by kind add up to the totals.

const planArbitrary = fc
  .record({
    W: fc.integer({ min: 16, max: 40 }),
    H: fc.integer({ min: 16, max: 36 }),
    s: fc.constantFrom(6, 7.5, 8, 10),
    levels: fc.integer({ min: 1, max: 3 }),
    live: fc.integer({ min: 40, max: 125 }),
  })
  .map((g) => {
    const levels = Array.from({ length: g.levels }, (_, i) => `L${i + 2}`);
    return singleBay(g.W, g.H, g.s, levels, zone('z', { live_psf: g.live }));
  });

const close = (a: number, b: number) => expect(a).toBeCloseTo(b, 6);

describe('tonnage of designed plans (fast-check)', () => {
  it('when a generated plan is designed, then the totals equal the direct sums over its members and the breakdowns add up', () => {
    fc.assert(
      fc.property(planArbitrary, (plan) => {
        const design = designScheme(plan);
        const t = computeTonnage(design, plan.levels);

        // Direct sums: catalog W (lb/ft) × span for every sized member.
        let lb = 0;
        for (const m of design.members) {
          expect(m.shape).not.toBeNull();
          lb += getWShape(m.shape!).W_plf * m.span_ft;
        }
        close(t.totals.steelWeight_lb, lb);
        close(t.totals.steelWeight_tons, lb / LB_PER_TON);
        expect(t.totals.pieces).toBe(design.members.length);
        expect(t.totals.connections).toBe(2 * design.members.length);
        // Agrees with the engine's own total.
        close(t.totals.steelWeight_lb, design.totals.steelWeight_lb);
        close(t.totals.floorArea_ft2, design.totals.floorArea_ft2);
        if (t.totals.floorArea_ft2 > 0) close(t.totals.steel_psf!, lb / t.totals.floorArea_ft2);

        const sum = (xs: { steelWeight_lb: number; pieces: number; connections: number; floorArea_ft2: number }[]) =>
          xs.reduce(
            (a, x) => ({ lb: a.lb + x.steelWeight_lb, pieces: a.pieces + x.pieces, conn: a.conn + x.connections, area: a.area + x.floorArea_ft2 }),
            { lb: 0, pieces: 0, conn: 0, area: 0 },
          );
        const byLevel = sum(t.byLevel);
        close(byLevel.lb, t.totals.steelWeight_lb);
        expect(byLevel.pieces).toBe(t.totals.pieces);
        expect(byLevel.conn).toBe(t.totals.connections);
        close(byLevel.area, t.totals.floorArea_ft2);
        expect(t.byLevel.map((l) => l.level)).toEqual(plan.levels.map((l) => l.id));

        const byKind = sum(t.byKind);
        close(byKind.lb, t.totals.steelWeight_lb);
        expect(byKind.pieces).toBe(t.totals.pieces);
        expect(byKind.conn).toBe(t.totals.connections);
      }),
      { numRuns: 25 },
    );
  });

  it('when members are shuffled, then the totals do not change', () => {
    const design = designScheme(singleBay(30, 36, 10, ['L2', 'L3']));
    const base = computeTonnage(design);
    fc.assert(
      fc.property(fc.shuffledSubarray(design.members, { minLength: design.members.length }), (members) => {
        const t = computeTonnage({ ...design, members });
        close(t.totals.steelWeight_lb, base.totals.steelWeight_lb);
        expect(t.totals.pieces).toBe(base.totals.pieces);
      }),
      { numRuns: 20 },
    );
  });
});
