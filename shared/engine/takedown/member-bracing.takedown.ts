/**
 * Compression-flange bracing of a member (design-basis §3): continuous where a deck bears
 * on it across its span; otherwise at the points where other members frame in. A deck that
 * runs parallel to a member is not counted as bracing it (the bare-steel stage; conservative),
 * so a girder with deck parallel is braced at its beam connections only.
 */
import type { PlanMember } from '../../schemas/plan.schema';
import { SUPPORT_TOLERANCE_FT } from '../geometry/framing-topology.geometry';
import { copyValue } from '../plain-value';

/** Same shape as the sizing engine's Bracing (shared/engine/index.ts). */
export type Bracing = 'continuous' | 'none' | { points_ft: number[] };

const byLowEnd = (p: readonly [number, number], q: readonly [number, number]) => Math.min(p[0], p[1]) - Math.min(q[0], q[1]);

/** Length covered by the union of intervals, ft. */
export function coveredLengthFt(intervals: readonly [number, number][]): number {
  // Sorted by low end without a new pair per interval (thousands per plan): same order, same sums.
  const sorted = intervals.slice().sort(byLowEnd);
  let total = 0;
  let reach = -Infinity;
  for (let i = 0; i < sorted.length; i++) {
    const p = sorted[i];
    const a = Math.min(p[0], p[1]);
    const b = Math.max(p[0], p[1]);
    if (b <= reach) continue;
    total += b - Math.max(a, reach);
    reach = b;
  }
  return total;
}

/**
 * @param deckCoverage_ft intervals along the member (ft from its start) where a deck spanning across it bears on it
 * @param framingPoints_ft positions where other members frame in
 */
export function deriveMemberBracing(member: PlanMember, spanFt: number, deckCoverage_ft: readonly [number, number][], framingPoints_ft: readonly number[]): Bracing {
  // A copy: a takedown (which a re-design may reuse) never holds the plan's own objects.
  if (member.bracing) return copyValue(member.bracing);
  if (coveredLengthFt(deckCoverage_ft) >= spanFt - 2 * SUPPORT_TOLERANCE_FT) return 'continuous';
  return bracePoints(framingPoints_ft, spanFt);
}

const ascending = (a: number, b: number) => a - b;

/**
 * Distinct framing positions (to 1e-6 ft) strictly inside the span, ascending; 'none' without any.
 * Sorted, then equal neighbours dropped: the same list as de-duplicating first, without a Set
 * and three arrays per member.
 */
function bracePoints(framingPoints_ft: readonly number[], spanFt: number): Bracing {
  const inside: number[] = [];
  for (let i = 0; i < framingPoints_ft.length; i++) {
    const x = Math.round(framingPoints_ft[i] * 1e6) / 1e6;
    if (x > SUPPORT_TOLERANCE_FT && x < spanFt - SUPPORT_TOLERANCE_FT) inside.push(x);
  }
  if (inside.length === 0) return 'none';
  if (inside.length > 1) inside.sort(ascending);
  let n = 1;
  for (let i = 1; i < inside.length; i++) if (inside[i] !== inside[n - 1]) inside[n++] = inside[i];
  inside.length = n;
  return { points_ft: inside };
}
