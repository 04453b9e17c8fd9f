/** Plane polygon helpers in plan feet. Polygons are open rings (last point ≠ first). */
export type Point = readonly [number, number];

/** Shoelace formula: positive for counter-clockwise rings. */
export function signedAreaFt2(polygon: readonly Point[]): number {
  let twiceArea = 0;
  for (let i = 0; i < polygon.length; i++) {
    const [x1, y1] = polygon[i];
    const [x2, y2] = polygon[(i + 1) % polygon.length];
    twiceArea += x1 * y2 - x2 * y1;
  }
  return twiceArea / 2;
}

export function polygonAreaFt2(polygon: readonly Point[]): number {
  return Math.abs(signedAreaFt2(polygon));
}

/** The polygon's bounding box: [x0, y0, x1, y1]. */
export function polygonBox(polygon: readonly Point[]): [number, number, number, number] {
  let x0 = Infinity, y0 = Infinity, x1 = -Infinity, y1 = -Infinity;
  for (const [x, y] of polygon) {
    if (x < x0) x0 = x;
    if (x > x1) x1 = x;
    if (y < y0) y0 = y;
    if (y > y1) y1 = y;
  }
  return [x0, y0, x1, y1];
}

/** Even-odd point-in-polygon; points on an edge count as inside (within tolFt). */
export function pointInPolygon(p: Point, polygon: readonly Point[], tolFt = 1e-9): boolean {
  if (pointOnPolygonBoundary(p, polygon, tolFt)) return true;
  let inside = false;
  const [x, y] = p;
  for (let i = 0, j = polygon.length - 1; i < polygon.length; j = i++) {
    const [xi, yi] = polygon[i];
    const [xj, yj] = polygon[j];
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}

export function pointOnPolygonBoundary(p: Point, polygon: readonly Point[], tolFt: number): boolean {
  for (let i = 0; i < polygon.length; i++) {
    if (distancePointToSegmentFt(p, polygon[i], polygon[(i + 1) % polygon.length]) <= tolFt) return true;
  }
  return false;
}

export function distanceFt(a: Point, b: Point): number {
  return Math.hypot(b[0] - a[0], b[1] - a[1]);
}

/** Distance from p to segment ab, and the parameter t ∈ [0,1] of the nearest point. */
export function projectPointOnSegment(p: Point, a: Point, b: Point): { distanceFt: number; t: number } {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const lengthSq = dx * dx + dy * dy;
  let t = lengthSq === 0 ? 0 : ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / lengthSq;
  t = Math.max(0, Math.min(1, t));
  const nearest: Point = [a[0] + t * dx, a[1] + t * dy];
  return { distanceFt: distanceFt(p, nearest), t };
}

export function distancePointToSegmentFt(p: Point, a: Point, b: Point): number {
  return projectPointOnSegment(p, a, b).distanceFt;
}
