import { describe, expect, it } from 'vitest';
import { gridLabel, offsetsFromSpacings, parseGridSpacings } from '../../../src/features/editor/tools/grid-spacings.parser';

describe('grid from spacings', () => {
  it('when given "3@30, 2@28", then it expands to five bays in order', () => {
    expect(parseGridSpacings('3@30, 2@28')).toEqual({ ok: true, spacings_ft: [30, 30, 30, 28, 28] });
  });

  it('when plain spacings, spaces around @, decimals and ft marks are mixed, then they all read', () => {
    expect(parseGridSpacings(' 2 @ 25.5 ft, 30\' 12 ')).toEqual({ ok: true, spacings_ft: [25.5, 25.5, 30, 12] });
  });

  it('when a part is not a spacing, then the error names that part', () => {
    const r = parseGridSpacings('3@30, thirty');
    expect(r).toEqual({ ok: false, error: expect.stringContaining('“thirty”') });
  });

  it('when a spacing is zero or a count is zero, then it is refused with the reason', () => {
    expect(parseGridSpacings('0')).toEqual({ ok: false, error: '“0”: a spacing must be more than 0 ft.' });
    expect(parseGridSpacings('0@30')).toEqual({ ok: false, error: '“0@30”: the count must be at least 1.' });
  });

  it('when empty or absurdly many bays, then the error says so', () => {
    expect(parseGridSpacings('   ').ok).toBe(false);
    expect(parseGridSpacings('300@30')).toEqual({ ok: false, error: 'More than 60 bays in one direction; check the counts.' });
  });

  it('when spacings are turned into offsets, then n spacings give n + 1 lines from the origin', () => {
    expect(offsetsFromSpacings([30, 30, 28.5], 0)).toEqual([0, 30, 60, 88.5]);
    expect(offsetsFromSpacings([0.1, 0.2], 0)).toEqual([0, 0.1, 0.3]);
  });

  it('when labelling, then x lines are numbered and y lines lettered past Z', () => {
    expect([0, 1, 8].map((i) => gridLabel('x', i))).toEqual(['1', '2', '9']);
    expect([0, 1, 25, 26, 27].map((i) => gridLabel('y', i))).toEqual(['A', 'B', 'Z', 'AA', 'AB']);
  });
});
