// Small plan-geometry helpers for tools and hit tests (feet, plan axes).
import type { PlanPoint } from '../store/editor.types';

export function distance(a: PlanPoint, b: PlanPoint): number {
  return Math.hypot(a[0] - b[0], a[1] - b[1]);
}

/** Closest point on segment ab to p, and where along it (0 at a, 1 at b). */
export function closestOnSegment(p: PlanPoint, a: PlanPoint, b: PlanPoint): { point: PlanPoint; t: number; distance: number } {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const len2 = dx * dx + dy * dy;
  const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / len2));
  const point: PlanPoint = [a[0] + t * dx, a[1] + t * dy];
  return { point, t, distance: distance(p, point) };
}

export function pointInPolygon(p: PlanPoint, polygon: readonly PlanPoint[]): boolean {
  let inside = false;
  for (let i = 0, j = polygon.length - 1; i < polygon.length; j = i++) {
    const [xi, yi] = polygon[i];
    const [xj, yj] = polygon[j];
    if (yi > p[1] !== yj > p[1] && p[0] < ((xj - xi) * (p[1] - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}

export function roundTo(value: number, step: number): number {
  return Math.round(value / step) * step;
}

export function samePoint(a: PlanPoint, b: PlanPoint, tol = 0.01): boolean {
  return distance(a, b) <= tol;
}

export interface Bounds {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

export function boundsOf(points: Iterable<PlanPoint>): Bounds | null {
  let b: Bounds | null = null;
  for (const [x, y] of points) {
    if (!b) b = { minX: x, minY: y, maxX: x, maxY: y };
    else {
      if (x < b.minX) b.minX = x;
      if (y < b.minY) b.minY = y;
      if (x > b.maxX) b.maxX = x;
      if (y > b.maxY) b.maxY = y;
    }
  }
  return b;
}

export function rectanglePolygon(a: PlanPoint, b: PlanPoint): PlanPoint[] {
  const x0 = Math.min(a[0], b[0]);
  const x1 = Math.max(a[0], b[0]);
  const y0 = Math.min(a[1], b[1]);
  const y1 = Math.max(a[1], b[1]);
  return [[x0, y0], [x1, y0], [x1, y1], [x0, y1]];
}
