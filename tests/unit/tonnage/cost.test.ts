import { describe, expect, it } from 'vitest';
import { describeDifference, estimateCost, formatEstimateUsd, tonnageDifference } from '../../../shared/tonnage/cost';
import { columnTonnageRows, computeTonnage, type TonnageMemberInput } from '../../../shared/tonnage/tonnage';

// Hand-worked arithmetic of tonnage and cost (invented members; shape weights are the
// nominal lb/ft in the designations, AISC Shapes Database v15.0).
const members: TonnageMemberInput[] = [
  ...[1, 2, 3, 4].map((i): TonnageMemberInput => ({ id: `b${i}`, level: 'L2', kind: 'beam', shape: 'W16X26', span_ft: 30, weight_plf: 26 })),
  ...[1, 2].map((i): TonnageMemberInput => ({ id: `g${i}`, level: 'L3', kind: 'girder', shape: 'W21X44', span_ft: 36, weight_plf: 44 })),
];
const levels = [
  { id: 'L3', name: 'Level 3' },
  { id: 'L2', name: 'Level 2' },
];
const design = { members, totals: { floorArea_ft2: 2160, byLevel: [{ level: 'L2', floorArea_ft2: 1080 }, { level: 'L3', floorArea_ft2: 1080 }] } };
const prices = { steel_usd_per_ton: 4800, connection_usd_each: 210 };

describe('tonnage and cost worked by hand', () => {
  it('when six members are summed, then weight, tons, psf, pieces and connections match the hand sums', () => {
    const t = computeTonnage(design, levels);
    // 4 × 26 × 30 = 3,120 lb; 2 × 44 × 36 = 3,168 lb; total 6,288 lb (hand sum).
    expect(t.totals.steelWeight_lb).toBe(6288);
    expect(t.totals.steelWeight_tons).toBeCloseTo(3.144, 10); // 6,288 / 2,000
    expect(t.totals.steel_psf).toBeCloseTo(6288 / 2160, 10); // 2.911 psf
    expect(t.totals.pieces).toBe(6);
    expect(t.totals.connections).toBe(12); // 2 per member
    expect(t.byLevel.map((l) => [l.levelName, l.steelWeight_lb, l.pieces])).toEqual([
      ['Level 3', 3168, 2],
      ['Level 2', 3120, 4],
    ]);
    expect(t.byLevel[1].steel_psf).toBeCloseTo(3120 / 1080, 10);
    expect(t.byKind.map((k) => [k.kind, k.steelWeight_lb, k.connections])).toEqual([
      ['girder', 3168, 4],
      ['beam', 3120, 8],
      ['column', 0, 0], // no columns among the six members
    ]);
  });

  it('when priced at $4,800 per ton and $210 per connection, then the cost is $17,611.20', () => {
    const c = estimateCost(computeTonnage(design, levels).totals, prices);
    expect(c.steel_usd).toBeCloseTo(15091.2, 6); // 3.144 t × $4,800
    expect(c.connections_usd).toBe(2520); // 12 × $210
    expect(c.cost_usd).toBeCloseTo(17611.2, 6);
    expect(formatEstimateUsd(c.cost_usd)).toBe('$17,600');
  });

  it('when a member has no floor area or bad numbers, then figures stay finite (psf null, weight 0)', () => {
    const t = computeTonnage({ members: [{ id: 'x', level: 'L9', kind: 'beam', shape: null, span_ft: Number.NaN, weight_plf: 30 }] });
    expect(t.totals.steelWeight_lb).toBe(0);
    expect(t.totals.steel_psf).toBeNull();
    expect(t.totals.unsizedPieces).toBe(1);
    expect(t.byLevel.map((l) => l.levelName)).toEqual(['L9']);
  });

  it('when one scheme is 8,400 lb and $13,900 under another, then the sentence says 4.2 tons (7 %) lighter and $13,900 cheaper', () => {
    const base = { steelWeight_lb: 120000, steel_psf: 8, pieces: 400, connections: 800, cost_usd: 300000 };
    const other = { steelWeight_lb: 111600, steel_psf: 7.44, pieces: 440, connections: 880, cost_usd: 286100 };
    const d = tonnageDifference(base, other);
    expect(d.steelWeight_lb).toBe(-8400);
    expect(d.steelWeight_tons).toBeCloseTo(-4.2, 10);
    expect(d.steelWeight_pct).toBeCloseTo(-7, 10);
    expect(d.steel_psf).toBeCloseTo(-0.56, 10);
    expect(d.cost_usd).toBe(-13900);
    expect(describeDifference('Scheme B', 'Scheme A', d)).toBe('Scheme B is 4.2 tons (7 %) lighter and $13,900 cheaper than Scheme A.');
    expect(describeDifference('Scheme A', 'Scheme B', tonnageDifference(other, base))).toBe(
      'Scheme A is 4.2 tons (8 %) heavier and $13,900 more expensive than Scheme B.',
    );
  });

  it('when prices are missing or costs round to the same $100, then the sentence says so', () => {
    const d = tonnageDifference(
      { steelWeight_lb: 10000, steel_psf: null, pieces: 1, connections: 2, cost_usd: null },
      { steelWeight_lb: 10000, steel_psf: null, pieces: 1, connections: 2, cost_usd: null },
    );
    expect(describeDifference('B', 'A', d)).toBe('B weighs about the same as A (within 0.1 ton).');
    const lighter = tonnageDifference(
      { steelWeight_lb: 10000, steel_psf: null, pieces: 1, connections: 2, cost_usd: 50000 },
      { steelWeight_lb: 9000, steel_psf: null, pieces: 1, connections: 2, cost_usd: 50020 },
    );
    // 1,000 lb = 0.5 ton, 10 %; $20 rounds to $0 at the nearest $100.
    expect(describeDifference('B', 'A', lighter)).toBe('B is 0.5 tons (10 %) lighter than A at about the same cost.');
  });
});

describe('tonnage with gravity columns', () => {
  it('when a designed column has two tiers over three lengths, then its weight is counted by level and kind, with one piece per tier and no end connections', () => {
    const design = {
      members: [{ id: 'g1', level: 'L2', kind: 'girder', shape: 'W18X35', span_ft: 30, weight_plf: 35 }],
      columns: [{ id: 'C1', levels: [
        { level: 'L4', shape: 'W12X40', tier: 2, Lc_ft: 13 },
        { level: 'L3', shape: 'W12X53', tier: 1, Lc_ft: 13 },
        { level: 'L2', shape: 'W12X53', tier: 1, Lc_ft: 15 },
      ] }],
      totals: { floorArea_ft2: 900 },
    };
    const t = computeTonnage({ members: [...(design.members as TonnageMemberInput[]), ...columnTonnageRows(design)], totals: design.totals }, [{ id: 'L4', name: 'Level 4' }, { id: 'L3', name: 'Level 3' }, { id: 'L2', name: 'Level 2' }]);
    // Worked by hand: 40 × 13 = 520 lb; 53 × 13 = 689 lb; 53 × 15 + 35 × 30 = 795 + 1050 lb
    expect(t.byLevel.map((l) => [l.level, l.steelWeight_lb, l.pieces])).toEqual([['L4', 520, 1], ['L3', 689, 0], ['L2', 1845, 2]]);
    const column = t.byKind.find((k) => k.kind === 'column')!;
    expect([column.steelWeight_lb, column.pieces, column.connections]).toEqual([520 + 689 + 795, 2, 0]);
    expect(t.totals.steelWeight_lb).toBe(1050 + 2004);
    expect(t.totals.connections).toBe(2); // the girder's two ends only
  });
});
