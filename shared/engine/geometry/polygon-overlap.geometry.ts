/**
 * Area shared by two plan polygons, and the decks that overlap on a level. Two decks over the
 * same floor area would each put their load on the members below, so the floor would carry it
 * twice with no word; the takedown reports every such pair, naming both decks.
 */
import type { Plan } from '../../schemas/plan.schema';
import { planProblem, type PlanProblem } from '../../schemas/plan-problem.schema';
import { polygonAreaFt2, polygonBox, type Point } from './polygon.geometry';

/** Overlaps smaller than this (ft²) are rounding at a shared edge, not a second deck. */
export const DECK_OVERLAP_TOLERANCE_FT2 = 0.01;

/** x-intervals where the horizontal line at y is inside the polygon (even-odd), ascending. */
function intervalsAtY(polygon: readonly Point[], y: number): [number, number][] {
  const xs: number[] = [];
  for (let i = 0; i < polygon.length; i++) {
    const [x1, y1] = polygon[i];
    const [x2, y2] = polygon[(i + 1) % polygon.length];
    if ((y1 < y && y2 > y) || (y2 < y && y1 > y)) xs.push(x1 + ((y - y1) * (x2 - x1)) / (y2 - y1));
  }
  xs.sort((a, b) => a - b);
  const out: [number, number][] = [];
  for (let i = 0; i + 1 < xs.length; i += 2) out.push([xs[i], xs[i + 1]]);
  return out;
}

function intersectionLength(a: [number, number][], b: [number, number][]): number {
  let total = 0;
  let i = 0;
  let j = 0;
  while (i < a.length && j < b.length) {
    const lo = Math.max(a[i][0], b[j][0]);
    const hi = Math.min(a[i][1], b[j][1]);
    if (hi > lo) total += hi - lo;
    if (a[i][1] < b[j][1]) i++;
    else j++;
  }
  return total;
}

/** y where edge p1p2 of one polygon crosses edge q1q2 of the other (strictly inside both), or null. */
function crossingY(p1: Point, p2: Point, q1: Point, q2: Point): number | null {
  const rx = p2[0] - p1[0], ry = p2[1] - p1[1];
  const sx = q2[0] - q1[0], sy = q2[1] - q1[1];
  const denom = rx * sy - ry * sx;
  if (Math.abs(denom) < 1e-12) return null;
  const t = ((q1[0] - p1[0]) * sy - (q1[1] - p1[1]) * sx) / denom;
  const u = ((q1[0] - p1[0]) * ry - (q1[1] - p1[1]) * rx) / denom;
  return t > 0 && t < 1 && u > 0 && u < 1 ? p1[1] + t * ry : null;
}

/**
 * Area common to two simple polygons, ft². Exact: cut into horizontal bands at every vertex and
 * every crossing of their edges; within a band the common width is linear in y, so the width at
 * the band's middle times its height is the band's area.
 */
export function polygonOverlapAreaFt2(a: readonly Point[], b: readonly Point[]): number {
  if (a.length < 3 || b.length < 3) return 0;
  const ys = new Set<number>();
  for (const p of a) ys.add(p[1]);
  for (const p of b) ys.add(p[1]);
  for (let i = 0; i < a.length; i++) {
    for (let j = 0; j < b.length; j++) {
      const y = crossingY(a[i], a[(i + 1) % a.length], b[j], b[(j + 1) % b.length]);
      if (y !== null) ys.add(y);
    }
  }
  const sorted = [...ys].sort((p, q) => p - q);
  let area = 0;
  for (let k = 0; k + 1 < sorted.length; k++) {
    const h = sorted[k + 1] - sorted[k];
    if (h <= 0) continue;
    const mid = (sorted[k] + sorted[k + 1]) / 2;
    area += intersectionLength(intervalsAtY(a, mid), intervalsAtY(b, mid)) * h;
  }
  return area;
}


/**
 * Every pair of decks on one level whose areas overlap, as an error naming both (the later deck
 * in file order is the one the problem is filed against). Both decks stay loaded, so the design
 * errs heavy, never light, until the engineer removes or trims one.
 */
export function deckOverlapProblems(plan: Pick<Plan, 'decks'>): PlanProblem[] {
  const problems: PlanProblem[] = [];
  const entries = plan.decks
    .map((deck, index) => ({ deck, index, box: polygonBox(deck.polygon) }))
    .filter((e) => e.deck.polygon.length >= 3)
    .sort((p, q) => p.box[0] - q.box[0] || p.index - q.index);
  // Sweep in x: only decks whose boxes meet are compared.
  const active: typeof entries = [];
  for (const e of entries) {
    for (let k = active.length - 1; k >= 0; k--) if (active[k].box[2] <= e.box[0]) active.splice(k, 1);
    for (const o of active) {
      if (o.deck.level !== e.deck.level || o.box[1] >= e.box[3] || o.box[3] <= e.box[1]) continue;
      const overlap = polygonOverlapAreaFt2(o.deck.polygon, e.deck.polygon);
      if (overlap <= DECK_OVERLAP_TOLERANCE_FT2) continue;
      const [first, second] = o.index < e.index ? [o, e] : [e, o];
      const same =
        Math.abs(overlap - polygonAreaFt2(first.deck.polygon)) <= DECK_OVERLAP_TOLERANCE_FT2 &&
        Math.abs(overlap - polygonAreaFt2(second.deck.polygon)) <= DECK_OVERLAP_TOLERANCE_FT2;
      problems.push(
        planProblem(
          'error',
          'deck-overlap',
          `Deck ${second.deck.id}: ${same ? 'covers the same area as' : 'overlaps'} deck ${first.deck.id} over ${overlap.toFixed(1)} ft² on level ${second.deck.level}; both load the members there, so that area is loaded twice — remove or trim one of the decks`,
          { elementId: second.deck.id, path: `decks[${second.index}]` },
        ),
      );
    }
    active.push(e);
  }
  return problems.sort((p, q) => (p.path! < q.path! ? -1 : p.path! > q.path! ? 1 : 0));
}
