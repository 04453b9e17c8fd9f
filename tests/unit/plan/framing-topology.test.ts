import { describe, expect, it } from 'vitest';
import { buildFramingTopology } from '../../../shared/engine/geometry/framing-topology.geometry';
import { runTakedown } from '../../../shared/engine/takedown/gravity-takedown.takedown';
import { member, singleBay } from '../takedown/plan-builder';

const codes = (problems: { code: string; elementId?: string }[]) => problems.map((p) => `${p.code}:${p.elementId}`);

describe('framing topology', () => {
  it('when beams frame into girders on columns, then supports are found and beams come before girders', () => {
    const t = buildFramingTopology(singleBay());
    expect(t.problems).toEqual([]);
    expect(t.members.get('B1')!.supports).toEqual({ start: { kind: 'member', id: 'G1', position_ft: 10 }, end: { kind: 'member', id: 'G2', position_ft: 10 } });
    expect(t.members.get('G1')!.supports.start).toEqual({ kind: 'column', id: 'C1' });
    expect(t.order.indexOf('B1')).toBeLessThan(t.order.indexOf('G1'));
    expect(t.order).toHaveLength(6);
  });

  it('when an end is 0.005 ft off the girder, then it still bears on it (tolerance 0.01 ft)', () => {
    const plan = singleBay();
    plan.members.find((m) => m.id === 'B1')!.start = [10, 0.005];
    expect(buildFramingTopology(plan).members.get('B1')!.supports.start).toMatchObject({ kind: 'member', id: 'G1' });
  });

  it('when a member end lands on nothing, then the problem names the member and the end', () => {
    const plan = singleBay();
    plan.members.push(member('Bx', 'beam', [15, 0], [15, 50]));
    const t = buildFramingTopology(plan);
    expect(codes(t.problems)).toEqual(['member-end-unsupported:Bx']);
    expect(t.problems[0].message).toBe('Member Bx: end (15, 50) lands on no column, member or wall at level L2');
    expect(t.problems[0].path).toBe('members[6].end');
  });

  it('when a member has zero length, then it is reported and left out', () => {
    const plan = singleBay();
    plan.members.push(member('Bz', 'beam', [15, 5], [15, 5]));
    const t = buildFramingTopology(plan);
    expect(codes(t.problems)).toEqual(['member-zero-length:Bz']);
    expect(t.excluded.has('Bz')).toBe(true);
  });

  it('when a member duplicates or overlaps another, then the later one is reported and left out', () => {
    const plan = singleBay();
    plan.members.push(member('Bdup', 'beam', [10, 36], [10, 0]), member('Bover', 'beam', [20, 10], [20, 30]));
    const t = buildFramingTopology(plan);
    expect(codes(t.problems)).toEqual(['member-duplicate:Bdup', 'member-overlap:Bover']);
    expect(t.problems[0].message).toContain('duplicates member B1');
    expect(t.problems[1].message).toContain('overlaps member B2 over 20.00 ft');
  });

  it('when two members carry each other, then the support cycle names them and neither is ordered', () => {
    const plan = singleBay();
    // A ends on B's end and B ends on A's end, with no column there.
    plan.members.push(member('A', 'beam', [40, 0], [50, 0]), member('B', 'beam', [50, 0], [50, 10]));
    plan.columns.push({ id: 'C9', x_ft: 40, y_ft: 0, levels: ['L2'] }, { id: 'C10', x_ft: 50, y_ft: 10, levels: ['L2'] });
    const t = buildFramingTopology(plan);
    expect(codes(t.problems)).toEqual(['support-cycle:A']);
    expect(t.problems[0].message).toBe('Member A: support cycle A → B → A (members carry each other)');
    expect(t.order).not.toContain('A');
  });

  it('when a deck has no member across its span, then the problem names the deck and the lost area', () => {
    const plan = singleBay();
    plan.decks.push({ id: 'd2', level: 'L2', polygon: [[40, 0], [50, 0], [50, 10], [40, 10]], spanDirection: 'x', zone: 'office' });
    const r = runTakedown(plan);
    expect(codes(r.problems)).toEqual(['deck-unsupported:d2']);
    expect(r.problems[0].message).toContain('100.0 ft²');
    // the lost area shows as an equilibrium mismatch: 100 ft² × 50 psf
    expect(r.equilibrium.D.applied_kip - r.equilibrium.D.reactions_kip).toBeCloseTo(5, 9);
  });

  it('when loads are off the floor, then each is named and counted as applied but in no reaction, so equilibrium does not balance', () => {
    const plan = singleBay();
    plan.pointLoads.push({ id: 'p9', level: 'L2', x_ft: 45, y_ft: 5, D_kip: 2, L_kip: 0 });
    plan.lineLoads.push({ id: 'w9', level: 'L2', start: [25, 5], end: [35, 5], D_klf: 1, L_klf: 0 });
    const r = runTakedown(plan);
    expect(codes(r.problems)).toEqual(['load-off-floor:p9', 'load-off-floor:w9']);
    expect(r.problems[1].message).toContain('5.00 ft of its length');
    // 54 kip of deck + 5 ft × 1 klf carried; 2 kip point and the other 5 ft × 1 klf carried by nothing
    expect(r.equilibrium.D.applied_kip).toBeCloseTo(54 + 5 + 2 + 5, 9);
    expect(r.equilibrium.D.reactions_kip).toBeCloseTo(54 + 5, 9);
    expect(r.problems[0].message).toBe('Point load p9: at (45, 5) on level L2 is on no deck, member or column; nothing carries it, so it is in the applied load but in no reaction');
  });

  it('when a member is at an angle to the deck span, then a warning names it', () => {
    const plan = singleBay();
    plan.members.push(member('K', 'beam', [0, 0], [10, 36]));
    const r = runTakedown(plan);
    expect(codes(r.problems)).toContain('member-skew-to-deck:K');
  });
});
