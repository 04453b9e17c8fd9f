import { describe, expect, it } from 'vitest';
import { designScheme } from '../../../shared/engine/index';
import { describeProblem, planNamer } from '../../../shared/drafting/element-names.drafting';
import { describeLoadSource } from '../../../shared/drafting/load-source.drafting';
import { memberStatus } from '../../../src/features/editor/members/member-status';
import { twoBayPlan } from '../editor/plan-fixture';

describe('user text speaks in marks, grid locations and level names', () => {
  const plan = twoBayPlan();
  const result = designScheme(plan);
  const names = planNamer(plan, new Map(result.members.map((m) => [m.id, m.mark])));
  const b4 = result.members.find((m) => m.id === 'b4')!;

  it('when a member is named, then it reads as kind, mark and grid location, never its id', () => {
    // b4 runs on grid line 2 (x = 30 ft) from A to B.
    expect(names.member('b4')).toBe(`beam ${b4.mark} at A–B / 2`);
    expect(names.level('L2')).toBe('Level 2');
  });

  it('when an engine problem names a member and a level by id, then the sentence names them as a person does', () => {
    const text = describeProblem('Member b4: end (5, 20) lands on no column, member or wall at level L2', names);
    expect(text).toBe(`Beam ${b4.mark} at A–B / 2: end (5, 20) lands on no column, member or wall at Level 2`);
    expect(text).not.toMatch(/\bb4\b|\bL2\b/);
  });

  it('when a load source names a deck zone and a member end, then zone names and marks are used', () => {
    const zone = plan.zones[0];
    const src = describeLoadSource(`deck ${plan.decks[0].id} zone ${zone.id}, tributary 5.0 ft: live 50 psf`, null, names);
    expect(src).toBe(`deck of ${zone.name}, tributary 5.0 ft: live 50 psf`);
    expect(describeLoadSource('beam b4 reaction (reducible live)', null, names)).toBe(`beam ${b4.mark} at A–B / 2 reaction (reducible live)`);
  });

  it('when a member has a problem, then its status words use the level name', () => {
    const p = twoBayPlan();
    p.members = [...p.members, { id: 'bx', level: 'L2', kind: 'beam', start: [5, 0], end: [5, 20], shape: null, maxDepth_in: null }];
    const r = designScheme(p);
    const s = memberStatus('bx', r.members.find((m) => m.id === 'bx'), r, false, planNamer(p));
    expect(s.words).toBe('Problem — end (5, 20) lands on no column, member or wall at Level 2');
  });
});
