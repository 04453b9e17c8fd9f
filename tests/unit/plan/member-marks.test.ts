import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { assignMarks, levelMarkPrefix, sharedMarkConflicts, withIssuedMarks, type MarkInput } from '../../../shared/engine/scheme/member-marks.scheme';
import { designScheme } from '../../../shared/engine/index';
import { twoBayPlan } from '../editor/plan-fixture';

// Piece marks are Baywright's own rule (common practice in spirit: one mark per fabricated
// piece, marks once issued stay on the drawings).

const LEVELS = [{ id: 'L2', name: 'Level 2' }];
const beam = (id: string, shape: string, x: number, y: number, extra: Partial<MarkInput> = {}): MarkInput => ({
  id, level: 'L2', kind: 'beam', shape, span_ft: 30, midpoint: [x, y], lockedMark: null, ...extra,
});

/** What a design after these marks were stored would be given. */
const issue = (inputs: MarkInput[], marks: Map<string, string>) => inputs.map((m) => (m.lockedMark ? m : { ...m, issuedMark: marks.get(m.id) ?? null }));

/** Eight identical W18X35 beams (one design) and two others, numbered fresh. */
function floor(): MarkInput[] {
  const eight = Array.from({ length: 8 }, (_, i) => beam(`b${i + 1}`, 'W18X35', 5 + i * 10, 10));
  return [...eight, beam('c1', 'W16X26', 5, 40), beam('c2', 'W21X44', 5, 60)];
}

describe('marks once issued stay put', () => {
  it('when a fresh floor is marked, then designs are numbered in plan order', () => {
    const marks = assignMarks(floor(), LEVELS);
    expect(marks.get('b1')).toBe('2B1');
    expect(marks.get('b8')).toBe('2B1');
    expect(marks.get('c1')).toBe('2B2');
    expect(marks.get('c2')).toBe('2B3');
  });

  it('when one of eight 2B1 beams is given 2B1 by hand, then the other seven stay 2B1 and no later mark moves', () => {
    const issued = issue(floor(), assignMarks(floor(), LEVELS));
    issued[2] = { ...issued[2], lockedMark: '2B1', issuedMark: null };
    const marks = assignMarks(issued, LEVELS);
    expect([...issued.slice(0, 8)].map((m) => marks.get(m.id))).toEqual(Array(8).fill('2B1'));
    expect(marks.get('c1')).toBe('2B2');
    expect(marks.get('c2')).toBe('2B3');
  });

  it('when an unrelated beam is added south of everything, then existing marks stay and the new design gets the next number', () => {
    const issued = issue(floor(), assignMarks(floor(), LEVELS));
    // Plan order would put this first (y = 0): fresh numbering would shift every mark.
    const marks = assignMarks([...issued, beam('n1', 'W24X55', 5, 0)], LEVELS);
    expect(marks.get('b1')).toBe('2B1');
    expect(marks.get('c1')).toBe('2B2');
    expect(marks.get('c2')).toBe('2B3');
    expect(marks.get('n1')).toBe('2B4');
  });

  it('when one of the eight changes size, then the seven keep 2B1 and it alone gets a new mark', () => {
    const issued = issue(floor(), assignMarks(floor(), LEVELS));
    issued[4] = { ...issued[4], shape: 'W21X44' };
    const marks = assignMarks(issued, LEVELS);
    expect(issued.slice(0, 8).filter((m) => m.id !== 'b5').map((m) => marks.get(m.id))).toEqual(Array(7).fill('2B1'));
    // Same size and span as c2 (2B3): it joins that piece.
    expect(marks.get('b5')).toBe('2B3');
    issued[4] = { ...issued[4], shape: 'W24X62' };
    expect(assignMarks(issued, LEVELS).get('b5')).toBe('2B4');
  });

  it('when members are added at random, then no member already marked changes its mark unless it joins another design', () => {
    const shapes = ['W16X26', 'W18X35', 'W21X44', 'W24X55'];
    const arbMember = fc.record({ shape: fc.constantFrom(...shapes), x: fc.integer({ min: 0, max: 90 }), y: fc.integer({ min: 0, max: 90 }) });
    fc.assert(
      fc.property(fc.array(arbMember, { minLength: 1, maxLength: 12 }), fc.array(arbMember, { minLength: 1, maxLength: 4 }), (before, added) => {
        const first = before.map((m, i) => beam(`m${i}`, m.shape, m.x, m.y));
        const issued = issue(first, assignMarks(first, LEVELS));
        const more = [...issued, ...added.map((m, i) => beam(`n${i}`, m.shape, m.x, m.y))];
        const after = assignMarks(more, LEVELS);
        for (const m of issued) expect(after.get(m.id)).toBe(m.issuedMark);
        // Still one mark per design.
        expect(sharedMarkConflicts(more, after)).toEqual([]);
      }),
      { numRuns: 200 },
    );
  });

  it('property: with no locked mark, whatever marks were issued before (taken, clashing or malformed), no mark is carried by two designs on a level', () => {
    const levels = [{ id: 'L2', name: 'Level 2' }, { id: 'L3', name: 'Level 3' }, { id: 'R', name: 'Roof', roof: true }];
    const arbIssued = fc.oneof(fc.constant(null), fc.constantFrom('2B1', '2B2', '2G1', '3B1', 'RB1', '2B10', 'B1', '2b1', ''), fc.string({ maxLength: 4 }));
    const arbMember = fc.record({
      level: fc.constantFrom('L2', 'L3', 'R'),
      kind: fc.constantFrom<'beam' | 'girder'>('beam', 'girder'),
      shape: fc.constantFrom('W16X26', 'W18X35', null),
      span_ft: fc.constantFrom(20, 25, 30, 30.004),
      x: fc.integer({ min: 0, max: 90 }),
      y: fc.integer({ min: 0, max: 90 }),
      issuedMark: arbIssued,
    });
    fc.assert(
      fc.property(fc.array(arbMember, { minLength: 1, maxLength: 30 }), (list) => {
        const inputs: MarkInput[] = list.map((m, i) => ({ id: `m${i}`, level: m.level, kind: m.kind, shape: m.shape, span_ft: m.span_ft, midpoint: [m.x, m.y], lockedMark: null, issuedMark: m.issuedMark }));
        const marks = assignMarks(inputs, levels);
        expect(marks.size).toBe(inputs.length);
        expect(sharedMarkConflicts(inputs, marks)).toEqual([]);
      }),
      { numRuns: 400 },
    );
  });

  it('when marks are stored on the plan, then locked marks are left alone and an unchanged plan is returned as is', () => {
    const plan = twoBayPlan();
    plan.members[0] = { ...plan.members[0], mark: 'X-1', markLocked: true };
    const marks = new Map(plan.members.map((m) => [m.id, '2B7']));
    const stored = withIssuedMarks(plan, marks);
    expect(stored.members[0]).toMatchObject({ mark: 'X-1', markLocked: true });
    expect(stored.members.slice(1).every((m) => m.mark === '2B7' && m.markLocked === undefined)).toBe(true);
    expect(withIssuedMarks(stored, marks)).toBe(stored);
  });
});

describe('composite members: one mark is one fabricated piece', () => {
  it('when beams of one size and span carry different stud counts or camber, then each gets its own mark; equal ones share it', () => {
    // Common practice: studs and camber are shop work, so they tell pieces apart.
    const inputs = [
      beam('a1', 'W16X31', 5, 10, { studs: 14, camber_in: 0.75 }),
      beam('a2', 'W16X31', 15, 10, { studs: 14, camber_in: 0.75 }),
      beam('b1', 'W16X31', 25, 10, { studs: 18, camber_in: 0.75 }),
      beam('c1', 'W16X31', 35, 10, { studs: 14, camber_in: 1 }),
      beam('d1', 'W16X31', 45, 10),
    ];
    const marks = assignMarks(inputs, LEVELS);
    expect(marks.get('a1')).toBe(marks.get('a2'));
    expect(new Set(['a1', 'b1', 'c1', 'd1'].map((id) => marks.get(id))).size).toBe(4);
    expect(sharedMarkConflicts(inputs, marks)).toEqual([]);
  });

  it('when a locked mark is carried by beams with different stud counts, then the conflict names both stud counts', () => {
    const inputs = [beam('a1', 'W16X31', 5, 10, { studs: 14, lockedMark: '2B5' }), beam('b1', 'W16X31', 25, 10, { studs: 18, lockedMark: '2B5' })];
    const [c] = sharedMarkConflicts(inputs, assignMarks(inputs, LEVELS));
    expect(c.designs).toEqual([
      { shape: 'W16X31', span_ft: 30, studs: 14, camber_in: null },
      { shape: 'W16X31', span_ft: 30, studs: 18, camber_in: null },
    ]);
  });
});

describe('a mark shared by members of different designs is said', () => {
  it('when a locked mark is carried by members of two sizes, then the design warns naming the mark and the level', () => {
    const plan = twoBayPlan();
    const first = designScheme(plan);
    const a = first.members.find((m) => m.kind === 'beam')!;
    const b = first.members.find((m) => m.kind === 'beam' && (m.shape !== a.shape || Math.abs(m.span_ft - a.span_ft) > 0.01));
    expect(b, 'fixture has beams of two designs').toBeDefined();
    for (const id of [a.id, b!.id]) Object.assign(plan.members.find((m) => m.id === id)!, { mark: 'B-X', markLocked: true });
    const warned = designScheme(plan).problems.filter((p) => p.code === 'mark-shared-by-different-designs');
    expect(warned).toHaveLength(1);
    expect(warned[0].severity).toBe('warning');
    expect(warned[0].message).toMatch(/^Mark B-X on Level 2 is carried by 2 members of different designs/);
  });
});

describe('the level part of a mark follows the level’s name', () => {
  it('when a level named "Level 3" has the internal id "L1", then its marks start 3 (added or copied levels alike)', () => {
    expect(levelMarkPrefix({ id: 'L1', name: 'Level 3' })).toBe('3');
    expect(levelMarkPrefix({ id: 'L7', name: 'L12' })).toBe('12');
    expect(levelMarkPrefix({ id: 'R', name: 'Roof', roof: true })).toBe('R');
    expect(levelMarkPrefix({ id: 'L5', name: 'Mezzanine' })).toBe('M');
    const marks = assignMarks([{ ...beam('a', 'W16X26', 0, 0), level: 'L1' }, { ...beam('g', 'W21X44', 0, 5), level: 'L1', kind: 'girder' }], [{ id: 'L1', name: 'Level 3' }]);
    expect(Object.fromEntries(marks)).toEqual({ a: '3B1', g: '3G1' });
  });
});

describe('marks of added and copied levels', () => {
  it('when "Level 3" is added at 28 ft and Level 2 is copied to it, then its members are marked 3G…/3B… and Level 2 keeps 2G…/2B…', async () => {
    const { createEditorStore } = await import('../../../src/features/editor/store/editor.store');
    const { dispatch } = await import('../../../src/features/editor/actions/action-registry');
    const store = createEditorStore({ plan: twoBayPlan() });
    dispatch(store, 'level.add', { name: 'Level 3', elevation_ft: 28 });
    const l3 = store.getState().levelId;
    expect(l3).not.toBe('L3'); // an internal id unrelated to the name
    dispatch(store, 'level.show', { levelId: 'L2' });
    // Marks issued on Level 2 are stored before the copy, as the Plan does.
    const first = designScheme(store.getState().plan);
    store.setState({ plan: withIssuedMarks(store.getState().plan, new Map(first.members.map((m) => [m.id, m.mark]))) });
    dispatch(store, 'level.copyTo', { targets: [l3] });
    const result = designScheme(store.getState().plan);
    const onL3 = result.members.filter((m) => m.level === l3);
    expect(onL3).toHaveLength(11);
    for (const m of onL3) expect(m.mark, m.id).toMatch(m.kind === 'girder' ? /^3G\d+$/ : /^3B\d+$/);
    expect(onL3.find((m) => m.kind === 'girder')!.mark).toBe('3G1');
    for (const m of result.members.filter((x) => x.level === 'L2')) expect(m.mark).toBe(first.members.find((x) => x.id === m.id)!.mark);
  });
});
