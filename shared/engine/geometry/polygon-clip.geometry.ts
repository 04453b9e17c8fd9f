/**
 * Clipping a plan polygon by axis-aligned half-planes (Sutherland–Hodgman against one
 * clipping line at a time). Used to split a deck at a bay's edges so one bay's deck can
 * span another way. Rectangles clip to rectangles; other polygons keep their area exactly.
 */
import { polygonAreaFt2, type Point } from './polygon.geometry';

/** The part of `poly` with coordinate `axis` (0 = x, 1 = y) ≤ value (side 'below') or ≥ value ('above'). */
export function clipHalfPlane(poly: readonly Point[], axis: 0 | 1, value: number, side: 'below' | 'above'): [number, number][] {
  const inside = (p: Point) => (side === 'below' ? p[axis] <= value : p[axis] >= value);
  const out: [number, number][] = [];
  for (let i = 0; i < poly.length; i++) {
    const a = poly[i];
    const b = poly[(i + 1) % poly.length];
    const ia = inside(a);
    const ib = inside(b);
    if (ia) out.push([a[0], a[1]]);
    if (ia !== ib) {
      const t = (value - a[axis]) / (b[axis] - a[axis]);
      const p: [number, number] = [a[0] + t * (b[0] - a[0]), a[1] + t * (b[1] - a[1])];
      p[axis] = value;
      out.push(p);
    }
  }
  return dropRepeats(out);
}

function dropRepeats(poly: [number, number][]): [number, number][] {
  const out: [number, number][] = [];
  for (const p of poly) {
    const q = out[out.length - 1];
    if (!q || Math.abs(q[0] - p[0]) > 1e-9 || Math.abs(q[1] - p[1]) > 1e-9) out.push(p);
  }
  while (out.length > 1 && Math.abs(out[0][0] - out[out.length - 1][0]) <= 1e-9 && Math.abs(out[0][1] - out[out.length - 1][1]) <= 1e-9) out.pop();
  return out;
}

export interface AxisRect {
  x0: number;
  x1: number;
  y0: number;
  y1: number;
}

/**
 * `poly` cut by the rectangle: the part inside it and the parts outside (left, right, below,
 * above, each convex-bounded so their union is the polygon less the rectangle). Pieces
 * smaller than `minAreaFt2` are dropped.
 */
export function splitByRect(poly: readonly Point[], r: AxisRect, minAreaFt2 = 1e-6): { inside: [number, number][] | null; outside: [number, number][][] } {
  const keep = (p: [number, number][]) => (p.length >= 3 && polygonAreaFt2(p) > minAreaFt2 ? p : null);
  const midX = (p: readonly Point[]) => clipHalfPlane(clipHalfPlane(p, 0, r.x0, 'above'), 0, r.x1, 'below');
  const inside = keep(clipHalfPlane(clipHalfPlane(midX(poly), 1, r.y0, 'above'), 1, r.y1, 'below'));
  const outside = [
    clipHalfPlane(poly, 0, r.x0, 'below'),
    clipHalfPlane(poly, 0, r.x1, 'above'),
    clipHalfPlane(midX(poly), 1, r.y0, 'below'),
    clipHalfPlane(midX(poly), 1, r.y1, 'above'),
  ]
    .map(keep)
    .filter((p): p is [number, number][] => p !== null);
  return { inside, outside };
}
