import { describe, expect, it } from 'vitest';
import { runTakedown } from '../../../shared/engine/takedown/gravity-takedown.takedown';
import { eq4_7_1Factor, liveLoadReductionFactor } from '../../../shared/engine/loads/live-load-reduction.loads';
import { emptyPlan, singleBay, zone } from './plan-builder';

const close = (a: number, b: number, tol = 1e-9) => expect(Math.abs(a - b)).toBeLessThanOrEqual(tol * Math.max(1, Math.abs(b)));

describe('ASCE 7-16 Eq. 4.7-1 live load reduction', () => {
  it('when AT = 360 ft² and KLL = 2, then L/L0 = 0.25 + 15/sqrt(720) = 0.809', () => {
    // ASCE 7-16 Eq. 4.7-1 worked by hand: 15/26.833 = 0.5590, + 0.25 = 0.8090
    close(eq4_7_1Factor(2, 360), 0.809017, 1e-6);
    close(liveLoadReductionFactor(2, 360, 1), 0.809017, 1e-6);
  });
  it('when KLL·AT < 400 ft², then there is no reduction', () => {
    // ASCE 7-16 §4.7.2: applies only where KLL·AT ≥ 400 (2 × 180 = 360)
    expect(liveLoadReductionFactor(2, 180, 1)).toBe(1);
  });
  it('when the area is very large, then the 0.50 (one floor) and 0.40 (two or more floors) limits hold', () => {
    // ASCE 7-16 §4.7.2 limits; Eq. 4.7-1 at KLL = 4, AT = 10,000: 0.25 + 15/200 = 0.325
    close(eq4_7_1Factor(4, 10000), 0.325);
    expect(liveLoadReductionFactor(4, 10000, 1)).toBe(0.5);
    expect(liveLoadReductionFactor(4, 10000, 2)).toBe(0.4);
  });
});

describe('takedown of a 30 × 36 ft bay with beams at 10 ft (hand-calculated)', () => {
  const r = runTakedown(singleBay());
  it('when the deck spans x, then an interior beam takes a 10 ft strip: w = 10 ft × 50 psf = 0.50 klf D and L', () => {
    const b1 = r.members.get('B1')!;
    // design-basis §2: halfway to each neighbour, (10 − 0)/2 + (20 − 10)/2 = 10 ft
    close(b1.tributaryWidth_ft, 10);
    expect(b1.loads.filter((l) => l.case === 'D')).toEqual([expect.objectContaining({ kind: 'uniform', w_klf: 0.5 })]);
    // closed form wL/2 = 0.5 × 36 / 2 = 9 kip (AISC Manual Part 3)
    close(b1.reactions.start.D_kip, 9);
    close(b1.reactions.end.L_kip, 9);
    close(b1.tributaryArea_ft2, 360);
    expect(b1.KLL).toBe(2);
    close(b1.liveReductionFactor, 0.25 + 15 / Math.sqrt(720)); // ASCE 7-16 Eq. 4.7-1 by hand: 0.809
    expect(b1.bracing).toBe('continuous');
  });
  it('when a beam is at the slab edge, then it takes 5 ft and KLL·AT = 360 < 400 gives no reduction', () => {
    const b0 = r.members.get('B0')!;
    close(b0.tributaryWidth_ft, 5);
    close(b0.reactions.start.D_kip, 4.5); // 0.25 klf × 36 / 2
    expect(b0.liveReductionFactor).toBe(1); // ASCE 7-16 §4.7.2
    expect(b0.supports.start).toEqual({ kind: 'column', id: 'C1' });
  });
  it('when beams frame into the girder, then it gets their reactions as point loads and passes half each way', () => {
    const g1 = r.members.get('G1')!;
    expect(g1.loads.filter((l) => l.case === 'D').map((l) => (l.kind === 'point' ? [l.P_kip, l.x_ft] : null))).toEqual([[9, 10], [9, 20]]);
    close(g1.reactions.start.D_kip, 9); // statics: 9 × 20/30 + 9 × 10/30
    expect(g1.tributaryWidth_ft).toBe(0); // deck parallel: no deck load directly
    close(g1.tributaryArea_ft2, 360); // traced: 180 + 180 from the two beams
    expect(g1.bracing).toEqual({ points_ft: [10, 20] }); // braced at the beam connections only
  });
  it('when columns collect the reactions, then each corner takes 13.5 kip D and L is reduced with KLL = 4 on AT = 270', () => {
    const c1 = r.columns.find((c) => c.id === 'C1')!.levels[0];
    close(c1.D_kip, 13.5); // girder 9 + edge beam 4.5
    close(c1.reducibleArea_ft2, 270); // girder 180 + edge beam 90
    // ASCE 7-16 Eq. 4.7-1 by hand: 0.25 + 15/sqrt(4 × 270) = 0.7064
    close(c1.liveReductionFactor, 0.25 + 15 / Math.sqrt(1080));
    close(c1.L_kip, 13.5 * (0.25 + 15 / Math.sqrt(1080)));
    // 1.2D + 1.6L, ASCE 7-16 §2.3.1 (2)
    close(c1.Pr_kip, 1.2 * 13.5 + 1.6 * c1.L_kip);
  });
  it('when everything is summed, then the column reactions equal the applied load: 30 × 36 × 50 psf = 54 kip per case', () => {
    close(r.equilibrium.D.applied_kip, 54);
    close(r.equilibrium.D.reactions_kip, 54);
    close(r.equilibrium.L.reactions_kip, 54);
    expect(r.problems).toEqual([]);
  });
});

describe('zones, openings, overhangs and placed loads', () => {
  it('when a beam runs under two zones, then it gets a stepped load and statics gives the reactions', () => {
    const plan = singleBay();
    plan.zones.push(zone('corridor', { live_psf: 80 }));
    plan.decks = [
      { id: 'd1', level: 'L2', polygon: [[0, 0], [30, 0], [30, 20], [0, 20]], spanDirection: 'x', zone: 'office' },
      { id: 'd2', level: 'L2', polygon: [[0, 20], [30, 20], [30, 36], [0, 36]], spanDirection: 'x', zone: 'corridor' },
    ];
    const b1 = runTakedown(plan).members.get('B1')!;
    const live = b1.loads.filter((l) => l.case === 'L');
    expect(live).toEqual([
      expect.objectContaining({ kind: 'partial', w_klf: 0.5, from_ft: 0, to_ft: 20 }),
      expect.objectContaining({ kind: 'partial', w_klf: 0.8, from_ft: 20, to_ft: 36 }),
    ]);
    // statics: ΣM about start = 0.5·20·10 + 0.8·16·28 = 458.4 kip-ft; R_end = 458.4/36
    close(b1.reactions.end.L_kip, 458.4 / 36);
    close(b1.reactions.start.L_kip, 22.8 - 458.4 / 36);
  });

  it('when an opening lies in a strip, then the load there is removed (7 ft strip over 6 ft)', () => {
    const plan = singleBay();
    plan.openings.push({ id: 'o1', level: 'L2', polygon: [[12, 4], [18, 4], [18, 10], [12, 10]] });
    const r = runTakedown(plan);
    const b1 = r.members.get('B1')!;
    const d = b1.loads.filter((l) => l.case === 'D');
    expect(d).toEqual([
      expect.objectContaining({ kind: 'partial', w_klf: 0.5, from_ft: 0, to_ft: 4 }),
      expect.objectContaining({ kind: 'partial', w_klf: 0.35, from_ft: 4, to_ft: 10 }),
      expect.objectContaining({ kind: 'partial', w_klf: 0.5, from_ft: 10, to_ft: 36 }),
    ]);
    close(r.equilibrium.D.applied_kip, (30 * 36 - 36) * 0.05); // 1044 ft² × 50 psf
    close(r.equilibrium.D.reactions_kip, r.equilibrium.D.applied_kip);
  });

  it('when the slab overhangs the edge beam, then it takes the overhang and KLL = 1 (cantilever slab)', () => {
    const plan = singleBay();
    plan.decks[0].polygon = [[-3, 0], [30, 0], [30, 36], [-3, 36]];
    const b0 = runTakedown(plan).members.get('B0')!;
    close(b0.tributaryWidth_ft, 8); // 3 ft overhang + 5 ft
    expect(b0.KLL).toBe(1); // ASCE 7-16 Table 4.7-1: edge beams with cantilever slabs
    close(b0.liveReductionFactor, 1); // 1 × 288 < 400
  });

  it('when a point load sits on the deck, then the lever rule shares it between the beams either side', () => {
    const plan = singleBay();
    plan.pointLoads.push({ id: 'p1', level: 'L2', x_ft: 13, y_ft: 20, D_kip: 3, L_kip: 0 });
    const r = runTakedown(plan);
    const on = (id: string) => r.members.get(id)!.loads.filter((l) => l.kind === 'point');
    expect(on('B1')).toEqual([expect.objectContaining({ case: 'D', P_kip: expect.closeTo(2.1, 9), x_ft: 20 })]); // 3 × 7/10
    expect(on('B2')).toEqual([expect.objectContaining({ case: 'D', P_kip: expect.closeTo(0.9, 9), x_ft: 20 })]); // 3 × 3/10
    close(r.equilibrium.D.reactions_kip, 54 + 3);
  });

  it('when a point load sits on a member, then that member takes all of it', () => {
    const plan = singleBay();
    plan.pointLoads.push({ id: 'p1', level: 'L2', x_ft: 10, y_ft: 12, D_kip: 2, L_kip: 1 });
    const b1 = runTakedown(plan).members.get('B1')!;
    expect(b1.loads.filter((l) => l.kind === 'point')).toEqual([
      expect.objectContaining({ case: 'D', P_kip: 2, x_ft: 12 }),
      expect.objectContaining({ case: 'L', P_kip: 1, x_ft: 12 }),
    ]);
  });

  it('when a line load crosses the deck square to the beams, then each beam gets a point load by the lever rule', () => {
    const plan = singleBay();
    plan.lineLoads.push({ id: 'w1', level: 'L2', start: [0, 18], end: [30, 18], D_klf: 0.3, L_klf: 0 });
    const r = runTakedown(plan);
    const pointD = (id: string) => r.members.get(id)!.loads.filter((l) => l.kind === 'point' && l.case === 'D').reduce((s, l) => s + (l.kind === 'point' ? l.P_kip : 0), 0);
    close(pointD('B1'), 3); // 0.3 × 10 × ½ from each side
    close(pointD('B0'), 1.5);
    close(r.equilibrium.D.reactions_kip, 54 + 9);
  });

  it('when a line load runs along the beams between two of them, then each takes half as a partial load', () => {
    const plan = singleBay();
    plan.lineLoads.push({ id: 'w1', level: 'L2', start: [15, 6], end: [15, 30], D_klf: 0.4, L_klf: 0 });
    const b1 = runTakedown(plan).members.get('B1')!;
    expect(b1.loads.filter((l) => l.source.startsWith('line load'))).toEqual([expect.objectContaining({ kind: 'partial', w_klf: expect.closeTo(0.2, 12), from_ft: 6, to_ft: 30 })]);
  });

  it('when a line load lies on a member, then that member takes it over its length', () => {
    const plan = singleBay();
    plan.lineLoads.push({ id: 'w1', level: 'L2', start: [0, 0], end: [30, 0], D_klf: 0.4, L_klf: 0 });
    const g1 = runTakedown(plan).members.get('G1')!;
    expect(g1.loads.filter((l) => l.source === 'line load w1')).toEqual([expect.objectContaining({ kind: 'partial', w_klf: 0.4, from_ft: 0, to_ft: 30 })]);
  });

  it('when two floors stack, then the column uses the cumulative area with KLL = 4 and counts two floors', () => {
    const r = runTakedown(singleBay(30, 36, 10, ['L2', 'L3']));
    const levels = r.columns.find((c) => c.id === 'C1')!.levels;
    expect(levels.map((l) => l.level)).toEqual(['L3', 'L2']); // top down
    close(levels[1].D_kip, 27);
    close(levels[1].reducibleArea_ft2, 540);
    expect(levels[1].floors).toBe(2);
    // ASCE 7-16 Eq. 4.7-1 by hand: 0.25 + 15/sqrt(2160) = 0.5727 (above the 0.40 limit)
    close(levels[1].liveReductionFactor, 0.25 + 15 / Math.sqrt(2160));
  });

  it('when live load exceeds 100 psf, then it is not reduced (ASCE 7-16 §4.7.3)', () => {
    const b1 = runTakedown(singleBay(30, 36, 10, ['L2'], zone('storage', { live_psf: 125 }))).members.get('B1')!;
    expect(b1.reducibleArea_ft2).toBe(0);
    expect(b1.liveReductionFactor).toBe(1);
  });

  it('when the deck spans y, then the girders take the strips and the beams none', () => {
    const plan = singleBay();
    plan.decks[0].spanDirection = 'y';
    const r = runTakedown(plan);
    close(r.members.get('G1')!.tributaryWidth_ft, 18);
    expect(r.members.get('B1')!.tributaryWidth_ft).toBe(0);
    close(r.equilibrium.D.reactions_kip, 54);
  });

  it('when self weight is supplied, then it is in the applied load and the reactions', () => {
    const r = runTakedown(singleBay(), { selfWeight: () => 40 });
    const steel = (2 * 30 + 4 * 36) * 0.04; // 40 plf on every member
    close(r.equilibrium.D.applied_kip, 54 + steel);
    close(r.equilibrium.D.reactions_kip, 54 + steel);
  });
});

describe('an empty plan', () => {
  it('when there is nothing, then the takedown is empty and balanced', () => {
    const r = runTakedown(emptyPlan());
    expect(r.members.size).toBe(0);
    expect(r.equilibrium.D).toEqual({ applied_kip: 0, reactions_kip: 0 });
  });
});
