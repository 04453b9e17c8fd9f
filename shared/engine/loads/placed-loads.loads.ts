/**
 * Point and line loads placed on the plan (design-basis §2):
 * - on a column → straight to the column; on a member → to that member;
 * - on the deck → lever rule to the two members either side along the span direction,
 *   at its position along them; beyond the last member (slab overhang) → all to that member,
 *   matching how area load on an overhang is treated;
 * - a line load along a member → that member; across the deck → cut into pieces between
 *   members and shared out by the lever rule along its length (exact: linear pieces).
 * Loads that land on no deck and no member are reported as errors and still counted in the
 * applied total (never in the reactions), so `equilibrium` shows them unbalanced instead of
 * looking balanced with the load silently gone.
 */
import type { Plan, PlanLineLoadRepaired, PlanPointLoadRepaired } from '../../schemas/plan.schema';
import { planProblem, type PlanProblem } from '../../schemas/plan-problem.schema';
import { SUPPORT_TOLERANCE_FT, memberAtPoint, type FramingTopology } from '../geometry/framing-topology.geometry';
import { distanceFt, pointInPolygon, pointOnPolygonBoundary, projectPointOnSegment, type Point } from '../geometry/polygon.geometry';
import { toDeckFrame, type DeckSupporter } from './deck-tributary.loads';
import type { DeckContext } from './deck-loads.loads';
import type { LoadCase, TakedownLoad } from '../takedown/member-load.takedown';

export interface PlacedLoadSinks {
  member(memberId: string, load: TakedownLoad): void;
  /** `loadIndex`: the point load's index in plan.pointLoads. */
  column(columnId: string, level: string, loadCase: LoadCase, kip: number, source: string, loadIndex: number): void;
  /**
   * Optional: told of every addition to the applied totals, in order, with the load's index in
   * plan.pointLoads / plan.lineLoads (the typical-level reuse replays them in file order).
   */
  applied?(loadIndex: number, loadCase: LoadCase, kip: number): void;
}

export type CaseTotals = Record<LoadCase, number>;
export const zeroCaseTotals = (): CaseTotals => ({ D: 0, L: 0, Lr: 0, S: 0 });

function pointLoadCases(p: PlanPointLoadRepaired): [LoadCase, number][] {
  return ([['D', p.D_kip], ['L', p.L_kip], ['Lr', p.Lr_kip ?? 0], ['S', p.S_kip ?? 0]] as [LoadCase, number][]).filter(([, v]) => v !== 0);
}
function lineLoadCases(l: PlanLineLoadRepaired): [LoadCase, number][] {
  return ([['D', l.D_klf], ['L', l.L_klf], ['Lr', l.Lr_klf ?? 0], ['S', l.S_klf ?? 0]] as [LoadCase, number][]).filter(([, v]) => v !== 0);
}

/** Strictly inside an opening (its edge still counts as floor). */
function inOpening(p: Point, openings: readonly (readonly Point[])[]): boolean {
  return openings.some((o) => pointInPolygon(p, o, 1e-9) && !pointOnPolygonBoundary(p, o, 1e-9));
}

/** The deck under a point at a level (first in file order), openings excluded. */
export function deckAtPoint(p: Point, decks: readonly DeckContext[], openings: readonly (readonly Point[])[]): DeckContext | null {
  if (inOpening(p, openings)) return null;
  return decks.find((d) => pointInPolygon(p, d.deck.polygon, 1e-9)) ?? null;
}

/** The members either side of u (deck frame) among those spanning across v, with lever-rule fractions. */
export function leverRuleSupporters(ctx: DeckContext, u: number, v: number): { left: DeckSupporter | null; right: DeckSupporter | null } {
  let left: DeckSupporter | null = null;
  let right: DeckSupporter | null = null;
  for (const s of ctx.supporters) {
    if (s.vMin_ft - SUPPORT_TOLERANCE_FT > v || s.vMax_ft + SUPPORT_TOLERANCE_FT < v) continue;
    if (s.u_ft <= u && (!left || s.u_ft > left.u_ft)) left = s;
    if (s.u_ft >= u && (!right || s.u_ft < right.u_ft)) right = s;
  }
  return { left, right };
}

/** Fractions of a load at u going to left and right (lever rule); a lone side takes it all. */
export function leverFractions(left: DeckSupporter | null, right: DeckSupporter | null, u: number): { id: string; fraction: number }[] {
  if (left && right && right.u_ft - left.u_ft > 1e-9) {
    // Clamped: a piece end that rounds a hair outside the pair would otherwise give a -1e-16 share.
    const fLeft = Math.min(1, Math.max(0, (right.u_ft - u) / (right.u_ft - left.u_ft)));
    return [
      { id: left.id, fraction: fLeft },
      { id: right.id, fraction: 1 - fLeft },
    ];
  }
  const only = left ?? right;
  return only ? [{ id: only.id, fraction: 1 }] : [];
}

function positionAlong(ctx: DeckContext, memberId: string, v: number): number {
  const axis = ctx.axes.get(memberId)!;
  return Math.min(axis.span_ft, Math.max(0, axis.sign * (v - axis.vStart_ft)));
}

function openingsByLevel(plan: Plan): Map<string, Point[][]> {
  const map = new Map<string, Point[][]>();
  for (const o of plan.openings) {
    if (o.polygon.length < 3) continue;
    let list = map.get(o.level);
    if (!list) map.set(o.level, (list = []));
    list.push(o.polygon as Point[]);
  }
  return map;
}

function decksByLevel(decks: readonly DeckContext[]): Map<string, DeckContext[]> {
  const map = new Map<string, DeckContext[]>();
  for (const d of decks) {
    let list = map.get(d.deck.level);
    if (!list) map.set(d.deck.level, (list = []));
    list.push(d);
  }
  return map;
}

/** Place every point load; returns the applied totals (loads off the floor included, see above). */
export function placePointLoads(plan: Plan, topology: FramingTopology, decks: readonly DeckContext[], sinks: PlacedLoadSinks): { applied: CaseTotals; problems: PlanProblem[] } {
  const applied = zeroCaseTotals();
  const log = sinks.applied;
  const add = (i: number, c: LoadCase, kip: number) => {
    applied[c] += kip;
    if (log) log(i, c, kip);
  };
  const problems: PlanProblem[] = [];
  const openings = openingsByLevel(plan);
  const levelDecks = decksByLevel(decks);
  plan.pointLoads.forEach((pl, i) => {
    const p: Point = [pl.x_ft, pl.y_ft];
    const cases = pointLoadCases(pl);
    const column = (topology.columnIndex.get(pl.level)?.near(p) ?? []).find((c) => distanceFt(c.at, p) <= SUPPORT_TOLERANCE_FT);
    if (column) {
      for (const [c, kip] of cases) {
        sinks.column(column.id, pl.level, c, kip, `point load ${pl.id}`, i);
        add(i, c, kip);
      }
      return;
    }
    const onMember = memberAtPoint(p, topology.memberIndex.get(pl.level)?.near(p) ?? []);
    if (onMember) {
      for (const [c, kip] of cases) {
        sinks.member(onMember.member.id, { case: c, kind: 'point', P_kip: kip, x_ft: onMember.position_ft, source: `point load ${pl.id}` });
        add(i, c, kip);
      }
      return;
    }
    const ctx = deckAtPoint(p, levelDecks.get(pl.level) ?? [], openings.get(pl.level) ?? []);
    const [u, v] = ctx ? toDeckFrame(p, ctx.deck.spanDirection) : [0, 0];
    const shares = ctx ? (() => { const s = leverRuleSupporters(ctx, u, v); return leverFractions(s.left, s.right, u); })() : [];
    if (!ctx || shares.length === 0) {
      problems.push(
        planProblem('error', 'load-off-floor', `Point load ${pl.id}: at (${pl.x_ft}, ${pl.y_ft}) on level ${pl.level} is on no deck, member or column; nothing carries it, so it is in the applied load but in no reaction`, {
          elementId: pl.id,
          path: `pointLoads[${i}]`,
        }),
      );
      for (const [c, kip] of cases) add(i, c, kip);
      return;
    }
    for (const share of shares) {
      if (share.fraction <= 0) continue;
      const x_ft = positionAlong(ctx, share.id, v);
      for (const [c, kip] of cases) {
        sinks.member(share.id, { case: c, kind: 'point', P_kip: kip * share.fraction, x_ft, source: `point load ${pl.id} (deck ${ctx.deck.id}, lever rule ${(share.fraction * 100).toFixed(0)} %)` });
      }
    }
    for (const [c, kip] of cases) add(i, c, kip);
  });
  return { applied, problems };
}

/** Parameters t ∈ (0,1) where segment p0→p1 crosses the polygon's edges. */
function crossingsWithPolygon(p0: Point, p1: Point, polygon: readonly Point[]): number[] {
  const out: number[] = [];
  const dx = p1[0] - p0[0];
  const dy = p1[1] - p0[1];
  for (let i = 0; i < polygon.length; i++) {
    const a = polygon[i];
    const b = polygon[(i + 1) % polygon.length];
    const ex = b[0] - a[0];
    const ey = b[1] - a[1];
    const denom = dx * ey - dy * ex;
    if (Math.abs(denom) < 1e-12) continue;
    const t = ((a[0] - p0[0]) * ey - (a[1] - p0[1]) * ex) / denom;
    const s = ((a[0] - p0[0]) * dy - (a[1] - p0[1]) * dx) / denom;
    if (t > 0 && t < 1 && s >= -1e-9 && s <= 1 + 1e-9) out.push(t);
  }
  return out;
}

/** Place every line load; returns the applied totals (parts off the floor included, see above). */
export function placeLineLoads(plan: Plan, topology: FramingTopology, decks: readonly DeckContext[], sinks: PlacedLoadSinks): { applied: CaseTotals; problems: PlanProblem[] } {
  const applied = zeroCaseTotals();
  const log = sinks.applied;
  const add = (i: number, c: LoadCase, klf: number, ft: number) => {
    const kip = klf * ft;
    applied[c] += kip;
    if (log) log(i, c, kip);
  };
  const problems: PlanProblem[] = [];
  const openings = openingsByLevel(plan);
  const levelDecks = decksByLevel(decks);
  plan.lineLoads.forEach((ll, i) => {
    const p0 = ll.start as Point;
    const p1 = ll.end as Point;
    const length = distanceFt(p0, p1);
    const cases = lineLoadCases(ll);
    if (length <= SUPPORT_TOLERANCE_FT) {
      problems.push(planProblem('error', 'line-load-zero-length', `Line load ${ll.id}: zero length; it is left out`, { elementId: ll.id, path: `lineLoads[${i}]` }));
      return;
    }
    // Along a member: both ends on the same member.
    const index = topology.memberIndex.get(ll.level);
    const candidates = index ? index.inBox(p0, p1) : [];
    const host = candidates.find(
      (m) => projectPointOnSegment(p0, m.start, m.end).distanceFt <= SUPPORT_TOLERANCE_FT && projectPointOnSegment(p1, m.start, m.end).distanceFt <= SUPPORT_TOLERANCE_FT,
    );
    if (host) {
      const s0 = projectPointOnSegment(p0, host.start, host.end).t * host.span_ft;
      const s1 = projectPointOnSegment(p1, host.start, host.end).t * host.span_ft;
      for (const [c, w] of cases) {
        sinks.member(host.id, { case: c, kind: 'partial', w_klf: w, from_ft: Math.min(s0, s1), to_ft: Math.max(s0, s1), source: `line load ${ll.id}` });
        add(i, c, w, Math.abs(s1 - s0));
      }
      return;
    }
    const onLevel = levelDecks.get(ll.level) ?? [];
    const holes = openings.get(ll.level) ?? [];
    const cuts = new Set<number>([0, 1]);
    for (const ctx of onLevel) {
      for (const t of crossingsWithPolygon(p0, p1, ctx.deck.polygon as Point[])) cuts.add(t);
      const a = toDeckFrame(p0, ctx.deck.spanDirection);
      const b = toDeckFrame(p1, ctx.deck.spanDirection);
      for (const s of ctx.supporters) {
        if (Math.abs(b[0] - a[0]) > 1e-12) cuts.add((s.u_ft - a[0]) / (b[0] - a[0]));
        if (Math.abs(b[1] - a[1]) > 1e-12) {
          cuts.add((s.vMin_ft - a[1]) / (b[1] - a[1]));
          cuts.add((s.vMax_ft - a[1]) / (b[1] - a[1]));
        }
      }
    }
    for (const h of holes) for (const t of crossingsWithPolygon(p0, p1, h)) cuts.add(t);
    const ts = [...cuts].filter((t) => t >= 0 && t <= 1).sort((a, b) => a - b);
    let offFloor_ft = 0;
    const at = (t: number): Point => [p0[0] + t * (p1[0] - p0[0]), p0[1] + t * (p1[1] - p0[1])];
    for (let k = 0; k + 1 < ts.length; k++) {
      const t0 = ts[k];
      const t1 = ts[k + 1];
      if (t1 - t0 <= 1e-12) continue;
      const pieceLength = (t1 - t0) * length;
      const ctx = deckAtPoint(at((t0 + t1) / 2), onLevel, holes);
      const span = ctx?.deck.spanDirection ?? 'x';
      const [u0, v0] = toDeckFrame(at(t0), span);
      const [u1, v1] = toDeckFrame(at(t1), span);
      const [um, vm] = toDeckFrame(at((t0 + t1) / 2), span);
      const sides = ctx ? leverRuleSupporters(ctx, um, vm) : { left: null, right: null };
      const sharesMid = leverFractions(sides.left, sides.right, um);
      if (!ctx || sharesMid.length === 0) {
        offFloor_ft += pieceLength;
        for (const [c, w] of cases) add(i, c, w, pieceLength);
        continue;
      }
      const f0 = leverFractions(sides.left, sides.right, u0);
      const f1 = leverFractions(sides.left, sides.right, u1);
      sharesMid.forEach((share, j) => {
        const fa = f0[j]?.fraction ?? share.fraction;
        const fb = f1[j]?.fraction ?? share.fraction;
        if (fa <= 0 && fb <= 0) return;
        const source = `line load ${ll.id} (deck ${ctx.deck.id}, lever rule)`;
        for (const [c, w] of cases) {
          if (Math.abs(v1 - v0) > 1e-6) {
            // Distributed along the member: intensity per foot of member = w · piece length / |Δv| · fraction.
            const k2 = (w * pieceLength) / Math.abs(v1 - v0);
            let s0 = positionAlong(ctx, share.id, v0);
            let s1 = positionAlong(ctx, share.id, v1);
            let wa = k2 * fa;
            let wb = k2 * fb;
            if (s1 < s0) {
              [s0, s1] = [s1, s0];
              [wa, wb] = [wb, wa];
            }
            if (s1 - s0 <= 1e-9) continue;
            sinks.member(share.id, Math.abs(wa - wb) < 1e-12 ? { case: c, kind: 'partial', w_klf: wa, from_ft: s0, to_ft: s1, source } : { case: c, kind: 'linear', w1_klf: wa, w2_klf: wb, from_ft: s0, to_ft: s1, source });
          } else {
            sinks.member(share.id, { case: c, kind: 'point', P_kip: w * pieceLength * ((fa + fb) / 2), x_ft: positionAlong(ctx, share.id, vm), source });
          }
        }
      });
      for (const [c, w] of cases) add(i, c, w, pieceLength);
    }
    if (offFloor_ft > 1e-6) {
      problems.push(
        planProblem('error', 'load-off-floor', `Line load ${ll.id}: ${offFloor_ft.toFixed(2)} ft of its length is on no deck or member on level ${ll.level}; nothing carries that part, so it is in the applied load but in no reaction`, {
          elementId: ll.id,
          path: `lineLoads[${i}]`,
        }),
      );
    }
  });
  return { applied, problems };
}
