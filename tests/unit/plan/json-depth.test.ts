/**
 * The nesting check run before any plan file or API body is parsed (shared/schemas/json-depth.ts):
 * containers deeper than the limit are found with their path; a number or string at any depth is not
 * a container and never counts.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { formatJsonPath, jsonTooDeepAt, MAX_JSON_DEPTH } from '../../../shared/schemas/json-depth';

/** `{ a: [ { a: [ ... leaf ] } ] }`: `containers` containers around the leaf. */
const nest = (containers: number, leaf: unknown): unknown => {
  let v: unknown = leaf;
  for (let i = containers - 1; i >= 0; i--) v = i % 2 === 0 ? { a: v } : [v];
  return v;
};

describe('jsonTooDeepAt', () => {
  it('when containers reach the limit, then it passes; one container more is refused with the path to it', () => {
    expect(jsonTooDeepAt(nest(MAX_JSON_DEPTH, 1))).toBeNull();
    expect(jsonTooDeepAt(nest(MAX_JSON_DEPTH, {}))).toEqual(['a', 0, 'a', 0, 'a', 0, 'a', 0]);
    expect(jsonTooDeepAt(nest(3, {}), 3)).toEqual(['a', 0, 'a']);
    expect(formatJsonPath(jsonTooDeepAt(nest(3, {}), 3)!)).toBe('a[0].a');
  });

  it('when a document is nested 100,000 deep, then it is refused without recursion', () => {
    expect(jsonTooDeepAt(nest(100_000, 'x'))).not.toBeNull();
  });

  it('when many values sit at the last level, then only a container there counts, wherever it is', () => {
    const wide = { members: Array.from({ length: 500 }, (_, i) => ({ id: `m${i}`, start: [i, 0], end: [i, 30], shape: null })) };
    // The document is depth 0, members 1, a member 2, its start list 3 and the numbers in it 4.
    expect(jsonTooDeepAt(wide, 4)).toBeNull();
    expect(jsonTooDeepAt(wide, 3)).toEqual(['members', 0, 'start']);
    (wide.members[499] as Record<string, unknown>).shape = { deeper: [] };
    expect(jsonTooDeepAt(wide, 4)).toEqual(['members', 499, 'shape', 'deeper']);
  });

  it('property: refused exactly when a container lies at or beyond the limit (fast-check)', () => {
    // Deepest container's depth, by recursion (the values here are small); -1 when there is none.
    const depthOf = (v: unknown, d: number): number => (v !== null && typeof v === 'object' ? Math.max(d, ...Object.values(v as object).map((c) => depthOf(c, d + 1))) : -1);
    fc.assert(
      fc.property(fc.jsonValue({ maxDepth: 8 }), fc.integer({ min: 0, max: 10 }), (value, limit) => {
        expect(jsonTooDeepAt(value, limit) !== null).toBe(depthOf(value, 0) >= limit);
      }),
      { numRuns: 300 },
    );
  });
});
