import { describe, expect, it } from 'vitest';
import { findBay, infillBay, infillDirection } from '../../../../shared/engine/layout/bay-infill.layout';
import { emptyGridPlan, twoBayPlan } from '../../editor/plan-fixture';
import type { Plan, PlanMember } from '../../../../shared/schemas/plan.schema';

const girder = (id: string, start: [number, number], end: [number, number]): PlanMember => ({ id, level: 'L2', kind: 'girder', start, end, shape: null, maxDepth_in: null });

/** The fixture grid (30 ft × 36 ft bays) with girders along grid lines A and B only. */
function girdersAlongAB(): Plan {
  const plan = emptyGridPlan();
  return { ...plan, members: [girder('gA', [0, 0], [30, 0]), girder('gB', [0, 36], [30, 36]), girder('gA2', [30, 0], [60, 0]), girder('gB2', [30, 36], [60, 36])] };
}

describe('bays and infill', () => {
  it('when a point lies between grid lines, then the bay is the rectangle around it', () => {
    expect(findBay(emptyGridPlan(), [40, 10])).toEqual({ x0: 30, x1: 60, y0: 0, y1: 36 });
    expect(findBay(emptyGridPlan(), [70, 10])).toBeNull();
  });

  it('when girders run along A and B, then beams run north–south between them', () => {
    expect(infillDirection(girdersAlongAB().members, { x0: 0, x1: 30, y0: 0, y1: 36 })).toBe('y');
  });

  it('when no girders bound the bay, then beams run parallel to the longer side', () => {
    expect(infillDirection([], { x0: 0, x1: 30, y0: 0, y1: 36 })).toBe('y');
    expect(infillDirection([], { x0: 0, x1: 40, y0: 0, y1: 36 })).toBe('x');
  });

  it('when a 30 ft bay is infilled at 10 ft, then two beams sit at 10 and 20 ft spanning 36 ft', () => {
    const plan = girdersAlongAB();
    const r = infillBay(plan, 'L2', { x0: 0, x1: 30, y0: 0, y1: 36 }, { direction: 'auto', spacing_ft: 10 });
    if (!r.ok) throw new Error(r.error);
    expect(r.direction).toBe('y');
    expect(r.spacing_ft).toBe(10);
    expect(r.add.map((m) => [m.start, m.end])).toEqual([[[10, 0], [10, 36]], [[20, 0], [20, 36]]]);
    expect(r.add.every((m) => m.kind === 'beam' && m.level === 'L2')).toBe(true);
    expect(new Set(r.add.map((m) => m.id)).size).toBe(2);
  });

  it('when the spacing does not divide the bay, then spacing is equal and not more than asked', () => {
    // 30 ft at most 8 ft → 4 spaces of 7.5 ft → 3 beams.
    const r = infillBay(girdersAlongAB(), 'L2', { x0: 0, x1: 30, y0: 0, y1: 36 }, { direction: 'y', spacing_ft: 8 });
    if (!r.ok) throw new Error(r.error);
    expect(r.spacing_ft).toBe(7.5);
    expect(r.add.map((m) => m.start[0])).toEqual([7.5, 15, 22.5]);
  });

  it('when a count is asked, then that many beams divide the bay equally', () => {
    const r = infillBay(girdersAlongAB(), 'L2', { x0: 0, x1: 30, y0: 0, y1: 36 }, { direction: 'x', count: 3 });
    if (!r.ok) throw new Error(r.error);
    expect(r.add.map((m) => [m.start, m.end])).toEqual([[[0, 9], [30, 9]], [[0, 18], [30, 18]], [[0, 27], [30, 27]]]);
  });

  it('when a bay already has infill the same way, then re-infilling replaces those beams', () => {
    // Fixture beams b2, b3 sit in bay 1–2 at x = 10, 20; the edge beams b1 (x=0) and b4 (x=30) stay.
    const r = infillBay(twoBayPlan(), 'L2', { x0: 0, x1: 30, y0: 0, y1: 36 }, { direction: 'y', spacing_ft: 7.5 });
    if (!r.ok) throw new Error(r.error);
    expect(r.removeIds.sort()).toEqual(['b2', 'b3']);
    expect(r.add).toHaveLength(3);
  });

  it('when the spacing is wider than the bay or the count is not whole, then the error says why', () => {
    const bay = { x0: 0, x1: 30, y0: 0, y1: 36 };
    expect(infillBay(girdersAlongAB(), 'L2', bay, { direction: 'y', spacing_ft: 40 })).toEqual({ ok: false, error: 'The bay is 30 ft wide: a spacing of 40 ft leaves no room for a beam.' });
    expect(infillBay(girdersAlongAB(), 'L2', bay, { direction: 'y', count: 1.5 })).toEqual({ ok: false, error: 'Beam count: enter a whole number from 1 to 100.' });
    expect(infillBay(girdersAlongAB(), 'L2', bay, { direction: 'y', spacing_ft: 0 }).ok).toBe(false);
  });
});
