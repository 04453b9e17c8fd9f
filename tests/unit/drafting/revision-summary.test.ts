import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { summarizeRevision } from '../../../shared/drafting/revision-summary.drafting';

// The two-bay fixture plan file (an invented scheme of our own), as the revision table stores it.
const fixture = (): Record<string, any> => JSON.parse(readFileSync(resolve(__dirname, '../../fixtures/plans/two-bay.plan.json'), 'utf8'));

describe('revision summary', () => {
  it('when two beams are added, one size locked and the deck changed, then the summary says so in marks, with no ids', () => {
    const before = fixture();
    before.members.find((m: any) => m.id === 'b2').mark = '2B1';
    const after = structuredClone(before);
    after.members.push({ ...after.members[5], id: 'b8', start: [45, 0], end: [45, 36], mark: null }, { ...after.members[5], id: 'b9', start: [55, 0], end: [55, 36], mark: null });
    after.members.find((m: any) => m.id === 'b2').shape = 'W16X26';
    after.decks[0].spanDirection = after.decks[0].spanDirection === 'x' ? 'y' : 'x';
    const text = summarizeRevision(before, after);
    expect(text).toBe('2 beams added, 1 size locked (2B1), 1 deck changed');
    for (const id of ['b2', 'b8', 'b9', after.decks[0].id]) expect(text).not.toContain(id);
  });

  it('when grid lines are moved and a girder removed, then the grid lines are named by their labels', () => {
    const before = fixture();
    const after = structuredClone(before);
    const g = after.grids.find((x: any) => x.label === '3');
    g.offset_ft += 2;
    after.members = after.members.filter((m: any) => m.id !== 'gA23');
    expect(summarizeRevision(before, after)).toBe('Grid line 3 moved or renamed, 1 girder removed');
  });

  it('when it is the first revision or nothing changed, then it says so', () => {
    const plan = fixture();
    expect(summarizeRevision(null, plan)).toBe(`First revision: ${plan.members.length} members, ${plan.columns.length} columns, 1 level`);
    expect(summarizeRevision(plan, structuredClone(plan))).toBe('No change to the plan');
  });
});
