import { describe, expect, it } from 'vitest';
import { mergePlans } from '../../../shared/schemas/plan-merge';
import { twoBayPlan } from '../editor/plan-fixture';

describe('three-way merge of plans on element ids', () => {
  it('when two engineers edit different members, then both edits are kept with no conflict', () => {
    const base = twoBayPlan();
    const mine = { ...base, members: base.members.map((m) => (m.id === 'b2' ? { ...m, shape: 'W21X44' } : m)) };
    const theirs = { ...base, members: [...base.members.filter((m) => m.id !== 'b7'), { id: 'bN', level: 'L2', kind: 'beam' as const, start: [15, 0] as [number, number], end: [15, 36] as [number, number], shape: null, maxDepth_in: null }] };
    const { plan, conflicts } = mergePlans(base, mine, theirs);
    expect(conflicts).toEqual([]);
    expect(plan.members.find((m) => m.id === 'b2')!.shape).toBe('W21X44');
    expect(plan.members.some((m) => m.id === 'b7')).toBe(false);
    expect(plan.members.some((m) => m.id === 'bN')).toBe(true);
  });

  it('when both changed the same member differently, then only that member is a conflict', () => {
    const base = twoBayPlan();
    const mine = { ...base, members: base.members.map((m) => (m.id === 'b2' ? { ...m, shape: 'W21X44' } : m.id === 'b3' ? { ...m, shape: 'W18X35' } : m)) };
    const theirs = { ...base, members: base.members.map((m) => (m.id === 'b2' ? { ...m, shape: 'W24X55' } : m)) };
    const { plan, conflicts } = mergePlans(base, mine, theirs);
    expect(conflicts).toEqual([{ kind: 'members', id: 'b2' }]);
    expect(plan.members.find((m) => m.id === 'b3')!.shape).toBe('W18X35');
  });

  it('when only issued marks differ on one side, then nothing is a conflict', () => {
    const base = twoBayPlan();
    const mine = { ...base, members: base.members.map((m) => ({ ...m, mark: '2B9' })) };
    const theirs = { ...base, members: base.members.map((m) => (m.id === 'b2' ? { ...m, shape: 'W24X55' } : m)) };
    expect(mergePlans(base, mine, theirs).conflicts).toEqual([]);
  });

  it('when the engineer chooses mine for a conflict, then that element is mine and the rest still merges', () => {
    const base = twoBayPlan();
    const mine = { ...base, members: base.members.map((m) => (m.id === 'b2' ? { ...m, shape: 'W21X44' } : m)) };
    const theirs = { ...base, members: base.members.filter((m) => m.id !== 'b7').map((m) => (m.id === 'b2' ? { ...m, shape: 'W24X55' } : m)) };
    const { plan, conflicts } = mergePlans(base, mine, theirs, (c) => (c.id === 'b2' ? 'mine' : undefined));
    expect(conflicts).toEqual([{ kind: 'members', id: 'b2' }]);
    expect(plan.members.find((m) => m.id === 'b2')!.shape).toBe('W21X44');
    expect(plan.members.some((m) => m.id === 'b7')).toBe(false);
    expect(mergePlans(base, mine, theirs).plan.members.find((m) => m.id === 'b2')!.shape).toBe('W24X55');
  });
});
