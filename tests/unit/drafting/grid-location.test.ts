import { describe, expect, it } from 'vitest';
import { formatFeetInches, gridIntersectionLabel, gridLocation } from '../../../shared/drafting/grid-location.drafting';
import type { PlanGrid } from '../../../shared/schemas/plan.schema';

// Lines 1–3 at x = 0, 30, 60 ft; lines A–C at y = 0, 36, 72 ft (plan.schema.ts convention).
const grids: PlanGrid[] = [
  { id: 'g1', axis: 'x', label: '1', offset_ft: 0 },
  { id: 'g3', axis: 'x', label: '3', offset_ft: 60 },
  { id: 'g2', axis: 'x', label: '2', offset_ft: 30 },
  { id: 'gA', axis: 'y', label: 'A', offset_ft: 0 },
  { id: 'gB', axis: 'y', label: 'B', offset_ft: 36 },
  { id: 'gC', axis: 'y', label: 'C', offset_ft: 72 },
];

describe('gridLocation', () => {
  it('when a member lies on line 2 between lines B and C, then it reads "B–C / 2"', () => {
    expect(gridLocation([30, 36], [30, 72], grids)).toBe('B–C / 2');
  });

  it('when it is drawn end to start, then the range still reads low to high', () => {
    expect(gridLocation([30, 72], [30, 36], grids)).toBe('B–C / 2');
  });

  it('when a girder runs along line A from 1 to 2, then it reads "1–2 / A"', () => {
    expect(gridLocation([0, 0], [30, 0], grids)).toBe('1–2 / A');
  });

  it('when an infill beam is 10 ft past line 1, then the line gets a feet-inch offset', () => {
    expect(gridLocation([10, 0], [10, 36], grids)).toBe('A–B / 1+10\'-0"');
  });

  it('when a beam stops short of the next line, then the range widens to the enclosing lines', () => {
    expect(gridLocation([10, 4], [10, 30], grids)).toBe('A–B / 1+10\'-0"');
  });

  it('when a member runs past two bays, then the range names its end lines', () => {
    expect(gridLocation([0, 36], [60, 36], grids)).toBe('1–3 / B');
  });

  it('when a cantilever runs beyond the last line, then the end gets an offset', () => {
    expect(gridLocation([60, 10], [66, 10], grids)).toBe('3–3+6\'-0" / A+10\'-0"');
  });

  it('when the plan has no grids, then there is no location', () => {
    expect(gridLocation([0, 0], [30, 0], undefined)).toBeNull();
  });

  it('when a member is sloped, then both ranges are given', () => {
    expect(gridLocation([0, 0], [30, 36], grids)).toBe('A–B / 1–2');
  });
});

describe('formatFeetInches', () => {
  it('when given feet, then it writes feet-inches to the nearest 1/4 in', () => {
    expect(formatFeetInches(30)).toBe('30\'-0"');
    expect(formatFeetInches(10.5)).toBe('10\'-6"');
    expect(formatFeetInches(7 + 3.25 / 12)).toBe('7\'-3 1/4"');
    expect(formatFeetInches(1 / 24)).toBe('0\'-0 1/2"');
  });
});

describe('gridIntersectionLabel', () => {
  it('when a column stands on B and 2, then its mark is "B2"; off the grid, none', () => {
    expect(gridIntersectionLabel(30, 36, grids)).toBe('B2');
    expect(gridIntersectionLabel(31, 36, grids)).toBeNull();
  });
});
