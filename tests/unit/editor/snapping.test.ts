import { describe, expect, it } from 'vitest';
import { snapPoint } from '../../../src/features/editor/tools/snapping.tool';
import { emptyGridPlan, twoBayPlan } from './plan-fixture';

// Two-bay fixture: x grid lines at 0, 30, 60 ft; y grid lines at 0 and 36 ft; columns on
// every intersection; girders along A and B; beams at x = 0, 10, 20 … 60.
describe('snapping', () => {
  it('when the pointer is near a column, then it snaps onto the column', () => {
    expect(snapPoint(twoBayPlan(), 'L2', [29.6, 0.3], { tolerance_ft: 1 })).toEqual({ point: [30, 0], kind: 'column', targetId: 'C-A2' });
  });

  it('when only the grid is drawn, then it snaps to the grid intersection', () => {
    expect(snapPoint(emptyGridPlan(), 'L2', [60.4, 35.5], { tolerance_ft: 1 })).toEqual({ point: [60, 36], kind: 'intersection', targetId: null });
  });

  it('when near the middle of a member, then it snaps to the midpoint', () => {
    // Beam b2 runs (10,0)→(10,36): its midpoint is (10,18).
    expect(snapPoint(twoBayPlan(), 'L2', [10.3, 18.2], { tolerance_ft: 1 })).toEqual({ point: [10, 18], kind: 'midpoint', targetId: 'b2' });
  });

  it('when along a member away from points, then it snaps onto the member at a round distance', () => {
    // Beam b2 at x = 10: 23.3 ft along rounds to 23.5 ft with the default 0.5 ft step.
    const s = snapPoint(twoBayPlan(), 'L2', [10.4, 23.3], { tolerance_ft: 1 });
    expect(s.kind).toBe('along');
    expect(s.targetId).toBe('b2');
    expect(s.point[0]).toBeCloseTo(10, 9);
    expect(s.point[1]).toBeCloseTo(23.5, 9);
  });

  it('when near a grid line only, then it snaps onto the line', () => {
    expect(snapPoint(emptyGridPlan(), 'L2', [30.6, 12.2], { tolerance_ft: 1 })).toEqual({ point: [30, 12], kind: 'grid', targetId: 'g2' });
  });

  it('when far from everything, then the point is rounded to the step', () => {
    expect(snapPoint(emptyGridPlan(), 'L2', [14.26, 20.74], { tolerance_ft: 1 })).toEqual({ point: [14.5, 20.5], kind: 'free', targetId: null });
  });

  it('when the member being dragged is ignored, then its own end does not capture the pointer', () => {
    const s = snapPoint(twoBayPlan(), 'L2', [10.2, 36.3], { tolerance_ft: 0.5, ignoreId: 'b2' });
    // The girder gB12 passes through (10,36): the point lies along it.
    expect(s).toMatchObject({ kind: 'along', targetId: 'gB12' });
  });

  it('when another level is drawn on, then this level’s members do not capture it', () => {
    expect(snapPoint(twoBayPlan(), 'L3', [10.3, 18.2], { tolerance_ft: 1 }).kind).toBe('free');
  });
});
