/**
 * Snapping for drawing tools: the pointer (plan feet) goes to the nearest meaningful point
 * within the tolerance: a column, a member end or midpoint, a grid intersection; then a
 * point along a member or on a grid line (at a round distance); else a round free point.
 */
import type { Plan } from '../../../../shared/schemas/plan.schema';
import type { PlanPoint } from '../store/editor.types';
import { closestOnSegment, distance, roundTo } from './plan-geometry';

export type SnapKind = 'column' | 'end' | 'midpoint' | 'intersection' | 'along' | 'grid' | 'free';

export interface Snap {
  point: PlanPoint;
  kind: SnapKind;
  /** The element snapped to, when there is one. */
  targetId: string | null;
}

export interface SnapOptions {
  /** Capture distance in plan feet (the caller converts from screen pixels). */
  tolerance_ft: number;
  /** Free points and distances along members round to this step, ft. */
  step_ft?: number;
  /** Member to ignore (the one whose end is being dragged). */
  ignoreId?: string;
}

/** Point snaps win over line snaps; among point snaps the nearest wins, ties in this order. */
const POINT_PRIORITY: Record<SnapKind, number> = { column: 0, end: 1, intersection: 2, midpoint: 3, along: 4, grid: 5, free: 6 };

export function gridIntersections(plan: Plan): PlanPoint[] {
  const grids = plan.grids ?? [];
  const xs = grids.filter((g) => g.axis === 'x').map((g) => g.offset_ft);
  const ys = grids.filter((g) => g.axis === 'y').map((g) => g.offset_ft);
  const out: PlanPoint[] = [];
  for (const x of xs) for (const y of ys) out.push([x, y]);
  return out;
}

export function snapPoint(plan: Plan, levelId: string, pointer: PlanPoint, options: SnapOptions): Snap {
  const tol = options.tolerance_ft;
  const step = options.step_ft ?? 0.5;
  let best: Snap | null = null;
  let bestDistance = Infinity;
  const consider = (point: PlanPoint, kind: SnapKind, targetId: string | null, d = distance(pointer, point)) => {
    if (d > tol) return;
    if (best && (d > bestDistance + 1e-9 || (Math.abs(d - bestDistance) <= 1e-9 && POINT_PRIORITY[kind] >= POINT_PRIORITY[best.kind]))) return;
    best = { point: [point[0], point[1]], kind, targetId };
    bestDistance = d;
  };

  for (const c of plan.columns) if (c.levels.includes(levelId)) consider([c.x_ft, c.y_ft], 'column', c.id);
  const levelMembers = plan.members.filter((m) => m.level === levelId && m.id !== options.ignoreId);
  for (const m of levelMembers) {
    consider(m.start, 'end', m.id);
    consider(m.end, 'end', m.id);
    consider([(m.start[0] + m.end[0]) / 2, (m.start[1] + m.end[1]) / 2], 'midpoint', m.id);
  }
  for (const p of gridIntersections(plan)) consider(p, 'intersection', null);
  if (best) return best;

  // Line snaps: along a member at a round distance from its start, or onto a grid line.
  for (const m of levelMembers) {
    const c = closestOnSegment(pointer, m.start, m.end);
    if (c.distance > tol) continue;
    const length = distance(m.start, m.end);
    const along = Math.max(0, Math.min(length, roundTo(c.t * length, step)));
    const t = length === 0 ? 0 : along / length;
    consider([m.start[0] + t * (m.end[0] - m.start[0]), m.start[1] + t * (m.end[1] - m.start[1])], 'along', m.id, c.distance);
  }
  if (best) return best;
  for (const g of plan.grids ?? []) {
    const point: PlanPoint = g.axis === 'x' ? [g.offset_ft, roundTo(pointer[1], step)] : [roundTo(pointer[0], step), g.offset_ft];
    const d = Math.abs((g.axis === 'x' ? pointer[0] : pointer[1]) - g.offset_ft);
    consider(point, 'grid', g.id, d);
  }
  if (best) return best;
  return { point: [roundTo(pointer[0], step), roundTo(pointer[1], step)], kind: 'free', targetId: null };
}
