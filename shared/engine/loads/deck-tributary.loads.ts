/**
 * One-way deck tributary strips (design-basis §2): a deck spans in its span direction
 * between the members that cross that direction; each such member takes the strip from
 * halfway to its neighbour on one side to halfway to its neighbour on the other, and at a
 * slab edge up to the edge including any overhang. Members parallel to the span take no
 * deck load. Openings remove load.
 *
 * Work is done in a deck frame (u along the span, v across it). The deck is cut into
 * bands of v where nothing changes (no polygon vertex, member end, or crossing of edges
 * inside); in a band every strip width is linear in v, so each strip is an exact
 * trapezoidal (linearly varying) line load on its member.
 */
import type { Point } from '../geometry/polygon.geometry';
import { SUPPORT_TOLERANCE_FT } from '../geometry/framing-topology.geometry';

export type SpanDirection = 'x' | 'y';

/** A straight line u = a + b·v in the deck frame. */
interface Linear {
  a: number;
  b: number;
}
const valueAt = (f: Linear, v: number) => f.a + f.b * v;

/** A member that can carry this deck: it runs across the span (constant u). */
export interface DeckSupporter {
  id: string;
  /** Position along the span, ft. */
  u_ft: number;
  vMin_ft: number;
  vMax_ft: number;
}

/** Part of a deck carried by one member over [v1, v2]: width w1 at v1 varying linearly to w2 at v2. */
export interface DeckStrip {
  memberId: string;
  v1_ft: number;
  v2_ft: number;
  width1_ft: number;
  width2_ft: number;
}

export interface DeckTributaryResult {
  strips: DeckStrip[];
  /** Members whose strip reaches past them to a slab edge (a cantilever slab, ASCE 7-16 Table 4.7-1). */
  overhangMemberIds: Set<string>;
  /** Deck area with no member to span to, ft², and a point inside it (plan x, y). */
  unsupported: { area_ft2: number; at: Point }[];
  /** Net deck area (openings removed), ft². */
  netArea_ft2: number;
  /** Ranges of v (deck frame) along which the deck bears on each member (for bracing). */
  bearing_v: Map<string, [number, number][]>;
  /** Working state: each member's latest strip, to extend it across band cuts. */
  lastStrip: Map<string, DeckStrip>;
}

/** Plan (x, y) → deck frame (u, v). */
export function toDeckFrame(p: readonly [number, number], span: SpanDirection): Point {
  return span === 'x' ? [p[0], p[1]] : [p[1], p[0]];
}
export function fromDeckFrame(p: readonly [number, number], span: SpanDirection): Point {
  return span === 'x' ? [p[0], p[1]] : [p[1], p[0]];
}

/** The edges of a polygon crossing the horizontal line v = vMid, paired into (left, right) intervals. */
function intervalsAt(polygon: readonly Point[], vMid: number): { left: Linear; right: Linear }[] {
  const crossings: { u: number; f: Linear }[] = [];
  for (let i = 0; i < polygon.length; i++) {
    const [u1, v1] = polygon[i];
    const [u2, v2] = polygon[(i + 1) % polygon.length];
    if ((v1 < vMid && v2 > vMid) || (v2 < vMid && v1 > vMid)) {
      const b = (u2 - u1) / (v2 - v1);
      const f = { a: u1 - b * v1, b };
      crossings.push({ u: valueAt(f, vMid), f });
    }
  }
  crossings.sort((p, q) => p.u - q.u);
  const out: { left: Linear; right: Linear }[] = [];
  for (let i = 0; i + 1 < crossings.length; i += 2) out.push({ left: crossings[i].f, right: crossings[i + 1].f });
  return out;
}

/** Length of [lo, hi] not covered by the (possibly overlapping) holes. */
function lengthOutsideHoles(lo: number, hi: number, holes: readonly [number, number][]): number {
  if (hi <= lo) return 0;
  const clipped = holes
    .map(([a, b]) => [Math.max(a, lo), Math.min(b, hi)] as [number, number])
    .filter(([a, b]) => b > a)
    .sort((p, q) => p[0] - q[0]);
  let covered = 0;
  let reach = lo;
  for (const [a, b] of clipped) {
    if (b <= reach) continue;
    covered += b - Math.max(a, reach);
    reach = b;
  }
  return hi - lo - covered;
}

/**
 * Tributary strips of one deck. `deckPolygon` and `openings` are in plan coordinates;
 * `supporters` in the deck frame (already filtered to members that run across the span).
 */
export function computeDeckTributary(
  deckPolygon: readonly Point[],
  span: SpanDirection,
  supporters: readonly DeckSupporter[],
  openings: readonly (readonly Point[])[],
): DeckTributaryResult {
  const deck = deckPolygon.map((p) => toDeckFrame(p, span));
  const holes = openings.map((o) => o.map((p) => toDeckFrame(p, span)));
  const vMin = Math.min(...deck.map((p) => p[1]));
  const vMax = Math.max(...deck.map((p) => p[1]));
  const uMin = Math.min(...deck.map((p) => p[0]));
  const uMax = Math.max(...deck.map((p) => p[0]));
  const holesNear = holes.filter((h) => {
    const hv = h.map((p) => p[1]);
    const hu = h.map((p) => p[0]);
    return Math.max(...hv) > vMin && Math.min(...hv) < vMax && Math.max(...hu) > uMin && Math.min(...hu) < uMax;
  });
  const candidates = supporters
    .filter((s) => s.u_ft >= uMin - SUPPORT_TOLERANCE_FT && s.u_ft <= uMax + SUPPORT_TOLERANCE_FT && s.vMax_ft > vMin && s.vMin_ft < vMax)
    .sort((a, b) => a.u_ft - b.u_ft || (a.id < b.id ? -1 : 1));

  const cuts = new Set<number>([vMin, vMax]);
  for (const p of deck) cuts.add(p[1]);
  for (const h of holesNear) for (const p of h) if (p[1] > vMin && p[1] < vMax) cuts.add(p[1]);
  for (const s of candidates) {
    if (s.vMin_ft > vMin && s.vMin_ft < vMax) cuts.add(s.vMin_ft);
    if (s.vMax_ft > vMin && s.vMax_ft < vMax) cuts.add(s.vMax_ft);
  }
  const vs = [...cuts].sort((a, b) => a - b);

  const result: DeckTributaryResult = { strips: [], overhangMemberIds: new Set(), unsupported: [], netArea_ft2: 0, bearing_v: new Map(), lastStrip: new Map() };
  for (let i = 0; i + 1 < vs.length; i++) {
    if (vs[i + 1] - vs[i] > 1e-9) addBand(vs[i], vs[i + 1], deck, holesNear, candidates, span, result, 0);
  }
  return result;
}

function addBand(
  va: number,
  vb: number,
  deck: readonly Point[],
  holes: readonly (readonly Point[])[],
  candidates: readonly DeckSupporter[],
  span: SpanDirection,
  out: DeckTributaryResult,
  depth: number,
): void {
  const vm = (va + vb) / 2;
  // Supporters that run the whole band (band cuts include every supporter end).
  const active = candidates.filter((s) => s.vMin_ft <= vm && s.vMax_ft >= vm);
  for (const interval of intervalsAt(deck, vm)) {
    const uL = valueAt(interval.left, vm);
    const uR = valueAt(interval.right, vm);
    const inside = active.filter((s) => s.u_ft >= uL - SUPPORT_TOLERANCE_FT && s.u_ft <= uR + SUPPORT_TOLERANCE_FT);
    addBandInterval(va, vb, interval, holes, inside, span, out, depth);
  }
}

/** One deck interval over a band: split where a sloped edge crosses another line, so that widths stay linear. */
function addBandInterval(
  va: number,
  vb: number,
  interval: { left: Linear; right: Linear },
  holes: readonly (readonly Point[])[],
  inside: readonly DeckSupporter[],
  span: SpanDirection,
  out: DeckTributaryResult,
  depth: number,
): void {
  const vm = (va + vb) / 2;
  const holeIntervals = holes.flatMap((h) => intervalsAt(h, vm));
  const lines: Linear[] = [interval.left, interval.right, ...holeIntervals.flatMap((h) => [h.left, h.right])];
  if (lines.some((f) => f.b !== 0) && depth < 64) {
    const constants = inside.flatMap((s, k) => (k + 1 < inside.length ? [s.u_ft, (s.u_ft + inside[k + 1].u_ft) / 2] : [s.u_ft]));
    const all: Linear[] = [...lines, ...constants.map((c) => ({ a: c, b: 0 }))];
    for (const f of lines) {
      if (f.b === 0) continue;
      for (const g of all) {
        if (g === f || g.b === f.b) continue;
        const v = (g.a - f.a) / (f.b - g.b);
        if (v > va + 1e-7 && v < vb - 1e-7) {
          addBandInterval(va, v, interval, holes, inside, span, out, depth + 1);
          addBandInterval(v, vb, interval, holes, inside, span, out, depth + 1);
          return;
        }
      }
    }
  }
  addStripsInBand(va, vb, interval, holeIntervals, inside, span, out);
}

/** In a band where every line keeps its order, strip widths are linear in v: evaluate at both ends. */
function addStripsInBand(
  va: number,
  vb: number,
  interval: { left: Linear; right: Linear },
  holeIntervals: readonly { left: Linear; right: Linear }[],
  inside: readonly DeckSupporter[],
  span: SpanDirection,
  out: DeckTributaryResult,
): void {
  const holesA = holeIntervals.map((h) => [valueAt(h.left, va), valueAt(h.right, va)] as [number, number]);
  const holesB = holeIntervals.map((h) => [valueAt(h.left, vb), valueAt(h.right, vb)] as [number, number]);
  const uLA = valueAt(interval.left, va);
  const uRA = valueAt(interval.right, va);
  const uLB = valueAt(interval.left, vb);
  const uRB = valueAt(interval.right, vb);
  const netA = lengthOutsideHoles(uLA, uRA, holesA);
  const netB = lengthOutsideHoles(uLB, uRB, holesB);
  out.netArea_ft2 += ((netA + netB) / 2) * (vb - va);
  if (inside.length === 0) {
    const area = ((netA + netB) / 2) * (vb - va);
    if (area > 1e-9) {
      const vm = (va + vb) / 2;
      const um = (valueAt(interval.left, vm) + valueAt(interval.right, vm)) / 2;
      out.unsupported.push({ area_ft2: area, at: fromDeckFrame([um, vm], span) });
    }
    return;
  }
  // A plain loop with the width worked inline: one closure per supporter and band was most of
  // this file's garbage on large plans.
  const vm = (va + vb) / 2;
  const last = inside.length - 1;
  for (let k = 0; k <= last; k++) {
    const s = inside[k];
    const midLo = k === 0 ? -Infinity : (inside[k - 1].u_ft + s.u_ft) / 2;
    const midHi = k === last ? Infinity : (s.u_ft + inside[k + 1].u_ft) / 2;
    const w1 = stripWidthFt(k === 0 ? uLA : Math.max(uLA, midLo), k === last ? uRA : Math.min(uRA, midHi), holesA);
    const w2 = stripWidthFt(k === 0 ? uLB : Math.max(uLB, midLo), k === last ? uRB : Math.min(uRB, midHi), holesB);
    if ((k === 0 && s.u_ft - valueAt(interval.left, vm) > SUPPORT_TOLERANCE_FT) || (k === last && valueAt(interval.right, vm) - s.u_ft > SUPPORT_TOLERANCE_FT)) {
      out.overhangMemberIds.add(s.id);
    }
    const ranges = out.bearing_v.get(s.id);
    if (ranges) ranges.push([va, vb]);
    else out.bearing_v.set(s.id, [[va, vb]]);
    if (w1 > 1e-12 || w2 > 1e-12) {
      // Continue the member's previous strip when the width carries on unchanged (fewer, longer loads).
      const prev = out.lastStrip.get(s.id);
      if (prev && Math.abs(prev.v2_ft - va) < 1e-12 && prev.width1_ft === prev.width2_ft && w1 === w2 && Math.abs(prev.width2_ft - w1) <= 1e-12 * Math.max(1, w1)) {
        prev.v2_ft = vb;
      } else {
        const strip = { memberId: s.id, v1_ft: va, v2_ft: vb, width1_ft: w1, width2_ft: w2 };
        out.strips.push(strip);
        out.lastStrip.set(s.id, strip);
      }
    }
  }
}

/** Width of [lo, hi] outside the holes, ft (0 when hi ≤ lo). */
function stripWidthFt(lo: number, hi: number, holesHere: readonly [number, number][]): number {
  return holesHere.length === 0 ? Math.max(0, hi - lo) : lengthOutsideHoles(lo, hi, holesHere);
}
