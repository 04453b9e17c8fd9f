// What is under the pointer, and what a selection box holds. Plain geometry, no canvas hit graph,
// so it stays fast with thousands of members and can be tested in node.
import type { Plan } from '../../../../shared/schemas/plan.schema';
import type { PlanPoint } from '../store/editor.types';
import { closestOnSegment, distance, pointInPolygon, type Bounds } from './plan-geometry';

export type ElementType = 'column' | 'member' | 'pointLoad' | 'lineLoad' | 'opening' | 'deck' | 'grid';

export interface Hit {
  id: string;
  type: ElementType;
}

/** The element at p within tol (ft): points before lines before areas; grid lines last. */
export function pickAt(plan: Plan, levelId: string, p: PlanPoint, tol: number, types?: readonly ElementType[]): Hit | null {
  const allowed = (t: ElementType) => !types || types.includes(t);
  let best: Hit | null = null;
  let bestD = Infinity;
  const take = (id: string, type: ElementType, d: number) => {
    if (d <= tol && d < bestD) {
      best = { id, type };
      bestD = d;
    }
  };
  if (allowed('column')) for (const c of plan.columns) if (c.levels.includes(levelId)) take(c.id, 'column', distance(p, [c.x_ft, c.y_ft]));
  if (allowed('pointLoad')) for (const l of plan.pointLoads) if (l.level === levelId) take(l.id, 'pointLoad', distance(p, [l.x_ft, l.y_ft]));
  if (best) return best;
  if (allowed('member')) for (const m of plan.members) if (m.level === levelId) take(m.id, 'member', closestOnSegment(p, m.start, m.end).distance);
  if (allowed('lineLoad')) for (const w of plan.lineLoads) if (w.level === levelId) take(w.id, 'lineLoad', closestOnSegment(p, w.start, w.end).distance);
  if (best) return best;
  if (allowed('opening')) for (const o of plan.openings) if (o.level === levelId && pointInPolygon(p, o.polygon)) return { id: o.id, type: 'opening' };
  if (allowed('deck')) for (const d of plan.decks) if (d.level === levelId && pointInPolygon(p, d.polygon)) return { id: d.id, type: 'deck' };
  if (allowed('grid')) for (const g of plan.grids ?? []) take(g.id, 'grid', Math.abs((g.axis === 'x' ? p[0] : p[1]) - g.offset_ft));
  return best;
}

const inside = (b: Bounds, p: PlanPoint) => p[0] >= b.minX && p[0] <= b.maxX && p[1] >= b.minY && p[1] <= b.maxY;

/** Elements wholly inside the box (decks and openings by every corner). */
export function pickInBox(plan: Plan, levelId: string, box: Bounds): string[] {
  const ids: string[] = [];
  for (const c of plan.columns) if (c.levels.includes(levelId) && inside(box, [c.x_ft, c.y_ft])) ids.push(c.id);
  for (const m of plan.members) if (m.level === levelId && inside(box, m.start) && inside(box, m.end)) ids.push(m.id);
  for (const l of plan.pointLoads) if (l.level === levelId && inside(box, [l.x_ft, l.y_ft])) ids.push(l.id);
  for (const w of plan.lineLoads) if (w.level === levelId && inside(box, w.start) && inside(box, w.end)) ids.push(w.id);
  for (const o of plan.openings) if (o.level === levelId && o.polygon.every((q) => inside(box, q))) ids.push(o.id);
  for (const d of plan.decks) if (d.level === levelId && d.polygon.every((q) => inside(box, q))) ids.push(d.id);
  return ids;
}
