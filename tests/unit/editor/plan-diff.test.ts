import { describe, expect, it } from 'vitest';
import { describeDiff, diffPlans } from '../../../src/features/editor/sync/plan-diff';
import { addMember, deleteElements, moveMemberEnd } from '../../../src/features/editor/actions/plan-edits';
import { twoBayPlan } from './plan-fixture';

describe('save-conflict summary', () => {
  it('when the same plan is compared with itself, then there are no differences', () => {
    const plan = twoBayPlan();
    expect(diffPlans(plan, structuredClone(plan))).toEqual({ kinds: [], settingsChanged: false, total: 0 });
    expect(describeDiff(diffPlans(plan, plan))).toBe('no differences');
  });

  it('when members are added, removed and moved, then each is counted once per kind', () => {
    const theirs = twoBayPlan();
    let mine = addMember(theirs, 'L2', 'beam', [5, 0], [5, 36]).plan;
    mine = addMember(mine, 'L2', 'beam', [15, 0], [15, 36]).plan;
    mine = deleteElements(mine, ['b7', 'p1']);
    mine = moveMemberEnd(mine, 'b2', 'end', [10, 30]);
    const diff = diffPlans(theirs, mine);
    expect(diff.kinds).toEqual([
      { kind: 'members', added: 2, removed: 1, changed: 1 },
      { kind: 'pointLoads', added: 0, removed: 1, changed: 0 },
    ]);
    expect(diff.total).toBe(5);
    expect(describeDiff(diff)).toBe('2 members added, 1 member removed, 1 member changed, 1 point load removed');
  });

  it('when only the design basis changed, then that is said', () => {
    const theirs = twoBayPlan();
    const mine = { ...theirs, designBasis: { ...theirs.designBasis, method: 'ASD' as const } };
    expect(describeDiff(diffPlans(theirs, mine))).toBe('name or design basis changed');
  });

  it('when only issued marks differ, then nothing is counted; a locked mark counts as a change', () => {
    const theirs = twoBayPlan();
    const issued = { ...theirs, members: theirs.members.map((m) => ({ ...m, mark: '2B1' })) };
    expect(diffPlans(theirs, issued).total).toBe(0);
    const locked = { ...theirs, members: theirs.members.map((m, i) => (i === 0 ? { ...m, mark: 'X1', markLocked: true } : m)) };
    expect(describeDiff(diffPlans(theirs, locked))).toBe('1 member changed');
  });
});
