import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { findWShape } from '../../../shared/catalog/w-shapes.catalog';
import { buildingModel, NOT_SIZED, PLACEHOLDER_COLUMN_SHAPE, PLACEHOLDER_MEMBER_SHAPE, type BuildingPlanInput } from '../../../shared/drafting/building-model.drafting';

const member = (id: string, level: string, start: [number, number], end: [number, number], shape: string | null = null) => ({
  id, level, kind: 'beam' as const, start, end, shape, maxDepth_in: null,
});

const plan = (over: Partial<BuildingPlanInput> = {}): BuildingPlanInput => ({
  levels: [
    { id: 'R', name: 'Roof', elevation_ft: 40 },
    { id: 'L2', name: 'Level 2', elevation_ft: 14 },
    { id: 'L3', name: 'Level 3', elevation_ft: 27 },
  ],
  members: [member('a', 'L2', [0, 0], [30, 40]), member('b', 'L3', [0, 0], [0, 20], 'W16X26')],
  columns: [{ id: 'C1', x_ft: 0, y_ft: 0, levels: ['L3', 'L2', 'R'] }],
  ...over,
});

describe('buildingModel', () => {
  it('when levels are listed out of order, then storeys run bottom to top', () => {
    expect(buildingModel(plan()).storeys.map((s) => s.id)).toEqual(['L2', 'L3', 'R']);
  });

  it('when a member has a design, then it takes the designed shape, mark, ratio and reactions; its length is node to node', () => {
    const m = buildingModel(plan(), {
      members: [{ id: 'a', mark: '2B1', shape: 'W18X35', ratio: 0.81, passes: true, governing: 'flexure', reactions: { start: { D_kip: 5, L_kip: 6 }, end: { D_kip: 5.5, L_kip: 6 } } }],
    }).members.find((x) => x.id === 'a')!;
    expect(m.length_ft).toBeCloseTo(50, 12); // 30-40-50 right triangle
    expect(m).toMatchObject({ mark: '2B1', size: 'W18X35', sized: true, ratio: 0.81, topElevation_ft: 14, camber_in: null, studs: null });
    // AISC Shapes Database v15.0, W18X35: d = 17.7 in, bf = 6.00 in, tw = 0.300 in, tf = 0.425 in
    expect(m.profile).toEqual({ label: 'W18X35', d_in: 17.7, bf_in: 6, tw_in: 0.3, tf_in: 0.425 });
    expect(m.reactions?.end).toEqual({ D_kip: 5.5, L_kip: 6, Lr_kip: 0, S_kip: 0, supportedBy: null });
  });

  it('when the design carries camber and studs (composite), then they are read', () => {
    const m = buildingModel(plan(), { members: [{ id: 'a', shape: 'W18X35', camber_in: 0.75, studs: 24 }] }).members[0];
    expect([m.camber_in, m.studs]).toEqual([0.75, 24]);
  });

  it('when neither design nor plan gives a shape, then the placeholder profile is drawn and the size says not sized', () => {
    const m = buildingModel(plan()).members.find((x) => x.id === 'a')!;
    expect(m).toMatchObject({ size: NOT_SIZED, sized: false, ratio: null });
    expect(m.profile.label).toBe(PLACEHOLDER_MEMBER_SHAPE);
    expect(buildingModel(plan()).members.find((x) => x.id === 'b')!.size).toBe('W16X26'); // locked on the plan
  });

  it('when a column supports L2, L3 and the roof, then it has three lengths: 0→14, 14→27, 27→40 ft, not sized', () => {
    const cols = buildingModel(plan()).columns;
    expect(cols.map((c) => [c.id, c.baseElevation_ft, c.topElevation_ft, c.length_ft])).toEqual([
      ['C1@L2', 0, 14, 14],
      ['C1@L3', 14, 27, 13],
      ['C1@R', 27, 40, 13],
    ]);
    expect(cols.every((c) => c.size === NOT_SIZED && c.profile.label === PLACEHOLDER_COLUMN_SHAPE)).toBe(true);
  });

  it('when a column starts at L3 with L2 below it on the plan, then its lowest length runs down to L2 (14 ft), not to 0', () => {
    const c = buildingModel(plan({ columns: [{ id: 'C2', x_ft: 5, y_ft: 5, levels: ['L3'] }] })).columns;
    expect(c.map((x) => [x.baseElevation_ft, x.length_ft])).toEqual([[14, 13]]);
  });

  it('when the column design gives a shape at one length only, then that length is sized and the others draw it but stay not sized', () => {
    const cols = buildingModel(plan(), { members: [], columns: [{ id: 'C1', levels: [{ level: 'L2', shape: 'W12X65', ratio: 0.7, Pr_kip: 300 }] }] }).columns;
    const l2 = cols.find((c) => c.level === 'L2')!;
    const r = cols.find((c) => c.level === 'R')!;
    expect(l2).toMatchObject({ size: 'W12X65', sized: true, ratio: 0.7, Pr_kip: 300 });
    expect(r).toMatchObject({ size: NOT_SIZED, sized: false, ratio: null });
    expect(r.profile).toEqual({ label: 'W12X65', d_in: findWShape('W12X65')!.d_in, bf_in: findWShape('W12X65')!.bf_in, tw_in: findWShape('W12X65')!.tw_in, tf_in: findWShape('W12X65')!.tf_in });
  });

  it('property: column lengths of a stack add up to its top level elevation minus the lowest base, and none is negative', () => {
    fc.assert(
      fc.property(fc.uniqueArray(fc.integer({ min: 1, max: 400 }), { minLength: 1, maxLength: 8 }), fc.integer({ min: 0, max: 7 }), (elevations, skip) => {
        const levels = elevations.map((e, i) => ({ id: `L${i}`, name: `L${i}`, elevation_ft: e }));
        const used = levels.filter((_, i) => i !== skip || levels.length === 1).map((l) => l.id);
        const cols = buildingModel({ levels, members: [], columns: [{ id: 'C', x_ft: 0, y_ft: 0, levels: used }] }).columns;
        const top = Math.max(...used.map((id) => levels.find((l) => l.id === id)!.elevation_ft));
        const base = Math.min(...cols.map((c) => c.baseElevation_ft));
        const total = cols.reduce((s, c) => s + c.length_ft, 0);
        return cols.length === used.length && cols.every((c) => c.length_ft > 0) && Math.abs(total - (top - base)) < 1e-9;
      }),
    );
  });
});
