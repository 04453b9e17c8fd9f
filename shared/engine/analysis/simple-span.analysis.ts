import type { MemberLoad } from './member-load.types';

/**
 * Simple span with pinned ends, downward loads. Superposition of closed forms
 * (AISC Manual 15th ed. Part 3, Beam Diagrams and Formulas): every distributed load is a
 * linearly varying piece q(ξ) = qa + (qb − qa)(ξ − a)/(b − a) on [a, b]; uniform and partial
 * loads are pieces with qa = qb. Units: kip, ft, klf, kip-ft; EIy in kip·ft³ (downward +).
 */
export interface LinearPiece { a: number; b: number; qa: number; qb: number }
export interface PointPiece { x: number; P: number }

export interface SpanLoading {
  spanFt: number;
  pieces: LinearPiece[];
  points: PointPiece[];
}

/**
 * Positions are snapped to a 1e-9 ft grid inside [0, L] so that load ends, point loads and the
 * critical points compare exactly (a load starting at 1e-300 ft would otherwise split hairs).
 */
function snap(x: number, L: number): number {
  const v = Math.round(x * 1e9) / 1e9;
  return v < 0 ? 0 : v > L ? L : v;
}

export function toSpanLoading(spanFt: number, loads: readonly MemberLoad[]): SpanLoading {
  const pieces: LinearPiece[] = [];
  const points: PointPiece[] = [];
  const L = spanFt;
  for (const l of loads) {
    switch (l.kind) {
      case 'uniform': pieces.push({ a: 0, b: L, qa: l.w_klf, qb: l.w_klf }); break;
      case 'partial': {
        const a = snap(l.from_ft, L), b = snap(l.to_ft, L);
        if (b > a) pieces.push({ a, b, qa: l.w_klf, qb: l.w_klf });
        break;
      }
      case 'linear': {
        const a = snap(l.from_ft, L), b = snap(l.to_ft, L);
        if (b > a) pieces.push({ a, b, qa: l.w1_klf, qb: l.w2_klf });
        break;
      }
      case 'point': points.push({ x: snap(l.x_ft, L), P: l.P_kip }); break;
    }
  }
  return { spanFt, pieces, points };
}

const qAt = (p: LinearPiece, x: number): number => p.qa + ((p.qb - p.qa) * (x - p.a)) / (p.b - p.a);

/** Total load (kip). */
export function totalLoadKip(s: SpanLoading): number {
  let f = 0;
  for (const p of s.pieces) f += ((p.qa + p.qb) * (p.b - p.a)) / 2;
  for (const p of s.points) f += p.P;
  return f;
}

/** Support reactions (kip), statics: ΣM about the start gives the end reaction. */
export function reactionsKip(s: SpanLoading): { startKip: number; endKip: number } {
  const L = s.spanFt;
  let total = 0;
  let momentAboutStart = 0;
  for (const p of s.pieces) {
    const len = p.b - p.a;
    const m = (p.a + p.b) / 2;
    total += ((p.qa + p.qb) * len) / 2;
    // Simpson's rule is exact for q(ξ)·ξ (quadratic).
    momentAboutStart += (len / 6) * (p.qa * p.a + 4 * ((p.qa + p.qb) / 2) * m + p.qb * p.b);
  }
  for (const p of s.points) { total += p.P; momentAboutStart += p.P * p.x; }
  const endKip = momentAboutStart / L;
  return { startKip: total - endKip, endKip };
}

/** Load intensity just right (side = +1) or just left (side = −1) of x (klf). */
export function intensityKlf(s: SpanLoading, x: number, side: 1 | -1): number {
  let q = 0;
  for (const p of s.pieces) {
    if (side > 0 ? p.a <= x && x < p.b : p.a < x && x <= p.b) q += qAt(p, x);
  }
  return q;
}

/**
 * Shear V(x) (kip), positive up on the left face. side = +1 just right of x (point loads at x
 * included), −1 just left of x.
 */
export function shearKip(s: SpanLoading, x: number, side: 1 | -1, startReactionKip?: number): number {
  let v = startReactionKip ?? reactionsKip(s).startKip;
  for (const p of s.pieces) {
    if (x <= p.a) continue;
    const c = Math.min(x, p.b);
    v -= ((p.qa + qAt(p, c)) * (c - p.a)) / 2;
  }
  for (const p of s.points) if (side > 0 ? p.x <= x : p.x < x) v -= p.P;
  return v;
}

/** Bending moment M(x) (kip-ft), sagging positive. */
export function momentKipFt(s: SpanLoading, x: number, startReactionKip?: number): number {
  let m = (startReactionKip ?? reactionsKip(s).startKip) * x;
  for (const p of s.pieces) {
    if (x <= p.a) continue;
    const c = Math.min(x, p.b);
    const len = c - p.a;
    const mid = (p.a + c) / 2;
    // ∫ q(ξ)(x − ξ) dξ on [a, c] by Simpson's rule, exact for a quadratic integrand.
    m -= (len / 6) * (p.qa * (x - p.a) + 4 * qAt(p, mid) * (x - mid) + qAt(p, c) * (x - c));
  }
  for (const p of s.points) if (p.x < x) m -= p.P * (x - p.x);
  return m;
}

/**
 * Deflection of a simple span at x under a unit load at ξ, times EI (ft³):
 * AISC Manual Part 3, concentrated load at any point, Δx = P b x (L² − b² − x²)/(6 E I L) for x < a.
 */
export function unitLoadDeflectionEI(L: number, x: number, xi: number): number {
  if (x <= xi) {
    const b = L - xi;
    return (b * x * (L * L - b * b - x * x)) / (6 * L);
  }
  const xr = L - x;
  return (xi * xr * (L * L - xi * xi - xr * xr)) / (6 * L);
}

// 3-point Gauss–Legendre: exact for polynomials up to degree 5 (here q·g is degree 4 on each side of x).
const GAUSS_X = [-Math.sqrt(3 / 5), 0, Math.sqrt(3 / 5)];
const GAUSS_W = [5 / 9, 8 / 9, 5 / 9];

// 2-point Gauss–Legendre: exact up to degree 3 (constant q times the cubic influence).
const GAUSS2_X = 1 / Math.sqrt(3);

function integrateInfluence(L: number, x: number, p: LinearPiece, lo: number, hi: number): number {
  if (hi <= lo) return 0;
  const h = (hi - lo) / 2;
  const m = (hi + lo) / 2;
  if (p.qa === p.qb) {
    return p.qa * h * (unitLoadDeflectionEI(L, x, m - h * GAUSS2_X) + unitLoadDeflectionEI(L, x, m + h * GAUSS2_X));
  }
  let sum = 0;
  for (let i = 0; i < 3; i++) {
    const xi = m + h * GAUSS_X[i];
    sum += GAUSS_W[i] * qAt(p, xi) * unitLoadDeflectionEI(L, x, xi);
  }
  return sum * h;
}

/** Deflection × EI at x (kip·ft³, downward positive): superposition of the unit-load influence. */
export function deflectionEIKipFt3(s: SpanLoading, x: number): number {
  const L = s.spanFt;
  let y = 0;
  for (const p of s.pieces) {
    if (p.a === 0 && p.b === L && p.qa === p.qb) { y += uniformDeflectionEI(p.qa, L, x); continue; }
    // Split at x where the influence function changes form, so the quadrature is exact.
    y += integrateInfluence(L, x, p, p.a, Math.min(x, p.b)) + integrateInfluence(L, x, p, Math.max(x, p.a), p.b);
  }
  for (const p of s.points) y += p.P * unitLoadDeflectionEI(L, x, p.x);
  return y;
}

function ascending(a: number, b: number): number { return a - b; }

/** Points where the load pattern changes: 0, L, piece ends, point-load positions (sorted, unique). */
export function criticalPointsFt(s: SpanLoading): number[] {
  const xs = [0, s.spanFt];
  for (const p of s.pieces) xs.push(p.a, p.b);
  for (const p of s.points) xs.push(p.x);
  xs.sort(ascending);
  const out: number[] = [];
  for (const x of xs) if (x >= 0 && x <= s.spanFt && (out.length === 0 || x > out[out.length - 1])) out.push(x);
  return out;
}

export interface MaxMoment { mKipFt: number; xFt: number }

/**
 * Maximum moment and its location. With downward loads M is concave, so the maximum is where
 * the shear changes sign; within an interval between critical points q is linear and V is
 * quadratic, so the zero is found in closed form (exact).
 */
export function maxMomentKipFt(s: SpanLoading): MaxMoment {
  const xs = criticalPointsFt(s);
  const r = reactionsKip(s).startKip;
  for (let k = 0; k < xs.length; k++) {
    const x = xs[k];
    const vRight = shearKip(s, x, 1, r);
    if (vRight > 0) continue;
    const vLeft = k === 0 ? r : shearKip(s, x, -1, r);
    if (vLeft >= 0 || k === 0) return { mKipFt: momentKipFt(s, x, r), xFt: x };
    const x0 = xs[k - 1];
    const h = x - x0;
    const v0 = shearKip(s, x0, 1, r);
    const q0 = intensityKlf(s, x0, 1);
    const q1 = intensityKlf(s, x, -1);
    const t = zeroOfShear(v0, q0, q1, h);
    return { mKipFt: momentKipFt(s, x0 + t, r), xFt: x0 + t };
  }
  return { mKipFt: 0, xFt: 0 };
}

/**
 * Root t ∈ [0, h] of V(t) = v0 − q0 t − (q1 − q0) t²/(2h), given V(0) > 0 ≥ V(h) (rationalised
 * form of the quadratic formula, stable when q1 = q0).
 */
export function zeroOfShear(v0: number, q0: number, q1: number, h: number): number {
  const disc = Math.max(0, q0 * q0 + (2 * (q1 - q0) * v0) / h);
  const den = q0 + Math.sqrt(disc);
  const t = den > 0 ? (2 * v0) / den : h;
  return Math.min(h, Math.max(0, t));
}

/** Maximum absolute shear (kip): with downward loads V decreases along the span, so it is a reaction. */
export function maxShearKip(s: SpanLoading): number {
  const r = reactionsKip(s);
  return Math.max(Math.abs(r.startKip), Math.abs(r.endKip));
}

/** Closed forms for a full uniform load w (AISC Manual Part 3, simple beam, uniformly distributed load). */
export function uniformShearKip(w: number, L: number, x: number): number { return w * (L / 2 - x); }
export function uniformMomentKipFt(w: number, L: number, x: number): number { return (w * x * (L - x)) / 2; }
export function uniformDeflectionEI(w: number, L: number, x: number): number { return (w * x * (L * L * L - 2 * L * x * x + x * x * x)) / 24; }

export interface Station { xFt: number; vKip: number; mKipFt: number; eiDeflectionKipFt3: number }
export interface StationPosition { xFt: number; side: 1 | -1 }

/**
 * Station positions for diagrams: n equal intervals plus the critical points; where a point
 * load acts inside the span there are two stations (shear just left, then just right).
 */
export function stationPositions(s: SpanLoading, n = 100): StationPosition[] {
  const L = s.spanFt;
  const xs = new Set<number>(criticalPointsFt(s));
  for (let i = 0; i <= n; i++) xs.add((L * i) / n);
  const pointXs = new Set(s.points.filter((p) => p.P !== 0).map((p) => p.x));
  const out: StationPosition[] = [];
  for (const x of [...xs].sort((a, b) => a - b)) {
    if (x > 0 && x < L && pointXs.has(x)) out.push({ xFt: x, side: -1 });
    out.push({ xFt: x, side: x >= L ? -1 : 1 });
  }
  return out;
}

/** Shear, moment and EI·deflection at the given positions. */
export function evaluateStations(s: SpanLoading, positions: readonly StationPosition[]): Station[] {
  const r = reactionsKip(s).startKip;
  return positions.map(({ xFt, side }) => ({
    xFt, vKip: shearKip(s, xFt, side, r), mKipFt: momentKipFt(s, xFt, r), eiDeflectionKipFt3: deflectionEIKipFt3(s, xFt),
  }));
}

export const stations = (s: SpanLoading, n = 100): Station[] => evaluateStations(s, stationPositions(s, n));
