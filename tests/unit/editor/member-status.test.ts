import { describe, expect, it } from 'vitest';
import { designScheme } from '../../../shared/engine/index';
import { memberStatus } from '../../../src/features/editor/members/member-status';
import { twoBayPlan } from './plan-fixture';

describe('member status words', () => {
  it('when a member passes, then its size, printed ratio and governing check are given in words', () => {
    const plan = twoBayPlan();
    const result = designScheme(plan);
    const b2 = result.members.find((m) => m.id === 'b2')!;
    const s = memberStatus('b2', b2, result, false);
    expect(s.state).toBe('passes');
    expect(s.size).toBe(b2.shape);
    // The ratio prints rounded up to two decimals (src/lib/utilisation.ts), never understated.
    expect(Number(s.util.printed)).toBeGreaterThanOrEqual(b2.ratio!);
    expect(s.words).toMatch(/^Passes — (flexure|shear|live-load deflection|total-load deflection) governs$/);
  });

  it('when a locked size is too light, then the member is over and the reason is in words', () => {
    const plan = twoBayPlan();
    // A W8X10 cannot carry a 36 ft office beam (locked by the engineer).
    plan.members = plan.members.map((m) => (m.id === 'b2' ? { ...m, shape: 'W8X10' } : m));
    const result = designScheme(plan);
    const s = memberStatus('b2', result.members.find((m) => m.id === 'b2'), result, false);
    expect(s.state).toBe('fails');
    expect(s.size).toBe('W8X10');
    expect(s.util.band).toBe('over');
    expect(s.words.startsWith('Over — ')).toBe(true);
    expect(s.shortReason).not.toBeNull();
  });

  it('when a member has no support at an end, then it is not shown as passing: the problem is in words', () => {
    const plan = twoBayPlan();
    // A beam running from girder A into open floor (nothing at y = 20).
    plan.members = [...plan.members, { id: 'bx', level: 'L2', kind: 'beam', start: [5, 0], end: [5, 20], shape: null, maxDepth_in: null }];
    const result = designScheme(plan);
    const s = memberStatus('bx', result.members.find((m) => m.id === 'bx'), result, false);
    expect(s.state).toBe('problem');
    expect(s.words).toBe('Problem — end (5, 20) lands on no column, member or wall at level L2');
  });

  it('when the engine could not design a member, then it is "not designed" with the engine’s reason', () => {
    const plan = twoBayPlan();
    const result = designScheme(plan);
    // As the engine reports it (design-scheme.scheme.ts, code member-not-designed).
    result.problems.push({ severity: 'error', code: 'member-not-designed', message: 'Member b2: could not be designed — no shape within maxDepth_in 6', elementId: 'b2' } as (typeof result.problems)[number]);
    const s = memberStatus('b2', { ...result.members.find((m) => m.id === 'b2')!, design: null }, result, false);
    expect(s).toMatchObject({ state: 'not-designed', ratio: null, words: 'Not designed — no shape within maxDepth_in 6' });
  });

  it('when no result has come back yet, then it says it is designing', () => {
    expect(memberStatus('b2', undefined, null, true)).toMatchObject({ state: 'designing', words: 'Designing…', size: '…' });
  });
});
