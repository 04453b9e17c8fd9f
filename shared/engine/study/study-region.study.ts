/**
 * The bays of a study region: the rectangles between consecutive grid lines (or, on a plan
 * without grid lines, between the columns of the level) that the region covers.
 */
import type { Plan } from '../../schemas/plan.schema';
import type { StudyRegion } from '../../schemas/study.schema';
import type { Bay } from '../layout/bay-infill.layout';
import { pointInPolygon } from '../geometry/polygon.geometry';

const TOL = 0.01;

function distinctSorted(values: number[]): number[] {
  const s = [...values].sort((a, b) => a - b);
  const out: number[] = [];
  for (const v of s) if (out.length === 0 || v - out[out.length - 1] > TOL) out.push(v);
  return out;
}

/** Grid bays of the level: grid lines when the plan has both directions, else column lines. */
export function levelBays(plan: Plan, levelId: string): Bay[] {
  const grids = plan.grids ?? [];
  let xs = distinctSorted(grids.filter((g) => g.axis === 'x').map((g) => g.offset_ft));
  let ys = distinctSorted(grids.filter((g) => g.axis === 'y').map((g) => g.offset_ft));
  if (xs.length < 2 || ys.length < 2) {
    const cols = plan.columns.filter((c) => c.levels.includes(levelId));
    xs = distinctSorted(cols.map((c) => c.x_ft));
    ys = distinctSorted(cols.map((c) => c.y_ft));
  }
  const bays: Bay[] = [];
  for (let j = 0; j + 1 < ys.length; j++) for (let i = 0; i + 1 < xs.length; i++) bays.push({ x0: xs[i], x1: xs[i + 1], y0: ys[j], y1: ys[j + 1] });
  return bays;
}

function rectOf(poly: readonly (readonly [number, number])[]): Bay {
  const xs = poly.map((p) => p[0]);
  const ys = poly.map((p) => p[1]);
  return { x0: Math.min(...xs), x1: Math.max(...xs), y0: Math.min(...ys), y1: Math.max(...ys) };
}

const within = (b: Bay, r: Bay) => b.x0 >= r.x0 - TOL && b.x1 <= r.x1 + TOL && b.y0 >= r.y0 - TOL && b.y1 <= r.y1 + TOL;
const sameBay = (a: Bay, b: Bay) => Math.abs(a.x0 - b.x0) <= TOL && Math.abs(a.x1 - b.x1) <= TOL && Math.abs(a.y0 - b.y0) <= TOL && Math.abs(a.y1 - b.y1) <= TOL;
const overlaps = (a: Bay, b: Bay) => a.x0 < b.x1 - TOL && b.x0 < a.x1 - TOL && a.y0 < b.y1 - TOL && b.y0 < a.y1 - TOL;

/** The region's bays in a fixed order (south to north, then west to east), or the problems. */
export function regionBays(plan: Plan, region: StudyRegion): { bays: Bay[]; problems: string[] } {
  if (!plan.levels.some((l) => l.id === region.level)) return { bays: [], problems: [`region.level: the plan has no level "${region.level}"`] };
  const grid = levelBays(plan, region.level);
  let bays: Bay[] = [];
  if (region.wholeLevel) {
    const decks = plan.decks.filter((d) => d.level === region.level);
    bays = grid.filter((b) => decks.some((d) => pointInPolygon([(b.x0 + b.x1) / 2, (b.y0 + b.y1) / 2], d.polygon)));
    if (bays.length === 0) return { bays, problems: [`region.wholeLevel: level "${region.level}" has no bay between grid lines (or columns) with deck over it`] };
  } else {
    const rects = region.polygon ? [region.polygon] : region.polygons ?? [];
    for (const poly of rects) {
      const r = rectOf(poly);
      if (r.x1 - r.x0 <= TOL || r.y1 - r.y0 <= TOL) return { bays: [], problems: ['region.polygon: the rectangle has no area'] };
      const inside = grid.filter((b) => within(b, r));
      for (const b of inside.length > 0 ? inside : [r]) if (!bays.some((x) => sameBay(x, b))) bays.push(b);
    }
    for (let i = 0; i < bays.length; i++) {
      for (let j = i + 1; j < bays.length; j++) {
        if (overlaps(bays[i], bays[j])) return { bays: [], problems: ['region.polygons: the bays overlap; give each bay once'] };
      }
    }
  }
  bays.sort((a, b) => a.y0 - b.y0 || a.x0 - b.x0);
  return { bays, problems: [] };
}

/** Total plan area of the bays, ft² (gross: openings are not taken off). */
export function baysAreaFt2(bays: readonly Bay[]): number {
  return bays.reduce((s, b) => s + (b.x1 - b.x0) * (b.y1 - b.y0), 0);
}

/** True when the member's midpoint lies in (or on the edge of) one of the bays. */
export function memberInBays(m: { start: readonly [number, number]; end: readonly [number, number] }, bays: readonly Bay[]): boolean {
  const x = (m.start[0] + m.end[0]) / 2;
  const y = (m.start[1] + m.end[1]) / 2;
  return bays.some((b) => x >= b.x0 - TOL && x <= b.x1 + TOL && y >= b.y0 - TOL && y <= b.y1 + TOL);
}
