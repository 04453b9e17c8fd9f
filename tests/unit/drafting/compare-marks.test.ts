/**
 * Marks sort by prefix, then number ("2G9" before "2G10"), with one shared collator
 * (shared/drafting/schedule.drafting.ts): the same order as String.prototype.localeCompare with
 * the same locale and options (ECMA-402 §19.1.1), checked on generated marks.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { compareMarks } from '../../../shared/drafting/schedule.drafting';

describe('compareMarks', () => {
  it('when marks differ only in their number, then they sort by its value', () => {
    expect(['2G10', '2B1', '2G9', 'RB12', '2G1', 'RB2'].sort(compareMarks)).toEqual(['2B1', '2G1', '2G9', '2G10', 'RB2', 'RB12']);
  });

  it('property: the same sign as localeCompare(b, "en", { numeric: true, sensitivity: "base" }) for any two marks or strings (fast-check)', () => {
    const mark = fc.oneof(
      fc.tuple(fc.constantFrom('', '2', '3', '12', 'R', 'M'), fc.constantFrom('G', 'B', 'g', 'b', 'C'), fc.integer({ min: 0, max: 200 })).map(([l, k, n]) => `${l}${k}${n}`),
      fc.string({ maxLength: 6 }),
    );
    fc.assert(
      fc.property(mark, mark, (a, b) => {
        expect(Math.sign(compareMarks(a, b))).toBe(Math.sign(a.localeCompare(b, 'en', { numeric: true, sensitivity: 'base' })));
      }),
      { numRuns: 1000 },
    );
  });
});
