/**
 * Compression-flange bracing of a member (design-basis §3): continuous where a deck bears
 * on it across its span; otherwise at the points where other members frame in. A deck that
 * runs parallel to a member is not counted as bracing it (the bare-steel stage; conservative),
 * so a girder with deck parallel is braced at its beam connections only.
 */
import type { PlanMember } from '../../schemas/plan.schema';
import { SUPPORT_TOLERANCE_FT } from '../geometry/framing-topology.geometry';

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
  if (member.bracing) return member.bracing;
  if (coveredLengthFt(deckCoverage_ft) >= spanFt - 2 * SUPPORT_TOLERANCE_FT) return 'continuous';
  const points = [...new Set(framingPoints_ft.map((x) => Math.round(x * 1e6) / 1e6))]
    .filter((x) => x > SUPPORT_TOLERANCE_FT && x < spanFt - SUPPORT_TOLERANCE_FT)
    .sort((a, b) => a - b);
  return points.length > 0 ? { points_ft: points } : 'none';
}
