/**
 * Gravity takedown of a whole plan (design-basis §2): deck, point and line loads onto
 * members; members in topological order (carried before carrier), each passing its
 * unfactored end reactions per case to what it bears on, as point loads at the
 * connection; columns collect them level by level.
 *
 * Live load reduction (ASCE 7-16 §4.7) is per member, on its own tributary area AT traced
 * through the framing: a member passes area to each end in proportion to its reactions
 * (statics of the area itself), so a girder's AT is the area its beams actually deliver,
 * smaller than "span × half the beam spans" — the conservative reading of design-basis §2.
 * Loads passed on to supporters are unreduced; each supporter reduces on its own AT.
 */
import type { Plan, PlanMember } from '../../schemas/plan.schema';
import type { PlanProblem } from '../../schemas/plan-problem.schema';
import { findWShape } from '../../catalog/w-shapes.catalog';
import { buildFramingTopology, type EndSupport, type FramingTopology, type MemberEnd } from '../geometry/framing-topology.geometry';
import { buildDeckContexts, deckStripLoads, zonePressures, type DeckContext } from '../loads/deck-loads.loads';
import { placeLineLoads, placePointLoads, zeroCaseTotals, type CaseTotals } from '../loads/placed-loads.loads';
import { kllTable4_7_1, liveLoadReductionFactor } from '../loads/live-load-reduction.loads';
import { LOAD_CASES, mergeContiguousLoads, type AreaLoad, type LoadCase, type TakedownLoad } from './member-load.takedown';
import { simpleSpanReactions } from './simple-span-statics.takedown';
import { deriveMemberBracing, type Bracing } from './member-bracing.takedown';
import { stackColumns, type ColumnReceipt, type ColumnTakedown } from './column-stack.takedown';

/** Unfactored reaction at one end, per case, before live load reduction, plus the area passed on. */
export interface EndReaction {
  D_kip: number;
  /** All live, unreduced. */
  L_kip: number;
  /** The part of L_kip that §4.7 may reduce. */
  Lreducible_kip: number;
  Lr_kip: number;
  S_kip: number;
  /** Tributary area passed to this end, ft² (all deck area; and the reducible-live part). */
  area_ft2: number;
  reducibleArea_ft2: number;
  supportedBy: string | null;
}

export interface MemberTakedown {
  id: string;
  member: PlanMember;
  level: string;
  kind: 'girder' | 'beam';
  span_ft: number;
  /** Unreduced loads, with self weight last once it is known. */
  loads: TakedownLoad[];
  areaLoads: AreaLoad[];
  selfWeight_plf: number;
  /** Deck area carried directly / span, ft (0 for members the deck does not bear on). */
  tributaryWidth_ft: number;
  /** Traced tributary area, all deck area carried, ft². */
  tributaryArea_ft2: number;
  /** Traced tributary area of reducible live load (AT of ASCE 7-16 Eq. 4.7-1), ft². */
  reducibleArea_ft2: number;
  KLL: number;
  liveReductionFactor: number;
  /** The deck reaches past this member to a slab edge (cantilever slab). */
  carriesOverhang: boolean;
  bracing: Bracing;
  /** Positions along the member where other members frame in, ft. */
  framingPoints_ft: number[];
  supports: Record<MemberEnd, EndSupport>;
  reactions: Record<MemberEnd, EndReaction>;
}

export interface TakedownOptions {
  /**
   * Called once per member in topological order, with its loads gathered and its live load
   * reduction worked out; returns the self weight in plf (the scheme sizes the member here).
   * Default: the weight of a locked shape from the catalog, else 0.
   */
  selfWeight?: (member: MemberTakedown) => number;
  /** Reuse a topology already built for this plan. */
  topology?: FramingTopology;
}

export interface EquilibriumCase {
  applied_kip: number;
  reactions_kip: number;
}

export interface TakedownResult {
  topology: FramingTopology;
  members: Map<string, MemberTakedown>;
  /** Members in the order they were taken down. */
  order: string[];
  columns: ColumnTakedown[];
  equilibrium: Record<LoadCase, EquilibriumCase>;
  floorArea_ft2: number;
  byLevelFloorArea_ft2: Map<string, number>;
  problems: PlanProblem[];
}

const emptyReaction = (supportedBy: string | null): EndReaction => ({
  D_kip: 0,
  L_kip: 0,
  Lreducible_kip: 0,
  Lr_kip: 0,
  S_kip: 0,
  area_ft2: 0,
  reducibleArea_ft2: 0,
  supportedBy,
});

export function lockedShapeWeightPlf(member: PlanMember): number {
  return member.shape ? findWShape(member.shape)?.W_plf ?? 0 : 0;
}

/** Sum of a load list's resultants per case (kip). */
export function loadTotalsByCase(loads: readonly TakedownLoad[], spanFt: number): CaseTotals {
  const totals = zeroCaseTotals();
  for (const l of loads) totals[l.case] += simpleSpanReactions([l], spanFt).total;
  return totals;
}

/** End reactions per case of a member (unreduced), and the area passed to each end. */
export function memberEndReactions(m: Pick<MemberTakedown, 'loads' | 'areaLoads' | 'span_ft' | 'supports'>): Record<MemberEnd, EndReaction> {
  const supportId = (s: EndSupport) => (s.kind === 'none' ? null : s.id);
  const out = { start: emptyReaction(supportId(m.supports.start)), end: emptyReaction(supportId(m.supports.end)) };
  for (const c of LOAD_CASES) {
    const r = simpleSpanReactions(m.loads.filter((l) => l.case === c), m.span_ft);
    out.start[`${c}_kip`] = r.start;
    out.end[`${c}_kip`] = r.end;
  }
  const red = simpleSpanReactions(m.loads.filter((l) => l.case === 'L' && l.reducible), m.span_ft);
  out.start.Lreducible_kip = red.start;
  out.end.Lreducible_kip = red.end;
  const all = simpleSpanReactions(m.areaLoads.filter((a) => a.of === 'all'), m.span_ft);
  const redArea = simpleSpanReactions(m.areaLoads.filter((a) => a.of === 'reducibleLive'), m.span_ft);
  out.start.area_ft2 = all.start;
  out.end.area_ft2 = all.end;
  out.start.reducibleArea_ft2 = redArea.start;
  out.end.reducibleArea_ft2 = redArea.end;
  return out;
}

/** A member's reaction delivered to its supporter as point loads at the connection. */
export function reactionAsPointLoads(from: MemberTakedown, r: EndReaction, x_ft: number): { loads: TakedownLoad[]; areas: AreaLoad[] } {
  const source = `${from.kind} ${from.id} reaction`;
  const loads: TakedownLoad[] = [];
  if (r.D_kip !== 0) loads.push({ case: 'D', kind: 'point', P_kip: r.D_kip, x_ft, source });
  if (r.Lreducible_kip !== 0) loads.push({ case: 'L', kind: 'point', P_kip: r.Lreducible_kip, x_ft, source: `${source} (reducible live)`, reducible: true });
  const nonReducible = r.L_kip - r.Lreducible_kip;
  if (Math.abs(nonReducible) > 1e-12) loads.push({ case: 'L', kind: 'point', P_kip: nonReducible, x_ft, source: `${source} (live, not reducible)` });
  if (r.Lr_kip !== 0) loads.push({ case: 'Lr', kind: 'point', P_kip: r.Lr_kip, x_ft, source });
  if (r.S_kip !== 0) loads.push({ case: 'S', kind: 'point', P_kip: r.S_kip, x_ft, source });
  const areas: AreaLoad[] = [];
  if (r.area_ft2 !== 0) areas.push({ kind: 'point', P_kip: r.area_ft2, x_ft, of: 'all' });
  if (r.reducibleArea_ft2 !== 0) areas.push({ kind: 'point', P_kip: r.reducibleArea_ft2, x_ft, of: 'reducibleLive' });
  return { loads, areas };
}

/** KLL of a beam or girder, ASCE 7-16 Table 4.7-1: 2; 1 for an edge member with a cantilever slab. */
export function memberKll(carriesOverhang: boolean): number {
  return carriesOverhang ? kllTable4_7_1('other') : kllTable4_7_1('interior-beam');
}

/** Net deck area per level and the applied deck load per case. */
function deckAppliedLoads(decks: readonly DeckContext[]): { applied: CaseTotals; byLevel: Map<string, number>; total: number } {
  const applied = zeroCaseTotals();
  const byLevel = new Map<string, number>();
  let total = 0;
  for (const ctx of decks) {
    const area = ctx.tributary.netArea_ft2;
    total += area;
    byLevel.set(ctx.deck.level, (byLevel.get(ctx.deck.level) ?? 0) + area);
    for (const p of zonePressures(ctx.zone, ctx.roof)) applied[p.case] += (p.psf * area) / 1000;
  }
  return { applied, byLevel, total };
}

export function runTakedown(plan: Plan, options: TakedownOptions = {}): TakedownResult {
  const topology = options.topology ?? buildFramingTopology(plan);
  const problems: PlanProblem[] = [...topology.problems];
  const { decks, problems: deckProblems } = buildDeckContexts(plan, topology);
  problems.push(...deckProblems);

  const loadsOf = new Map<string, TakedownLoad[]>();
  const areasOf = new Map<string, AreaLoad[]>();
  for (const id of topology.members.keys()) {
    loadsOf.set(id, []);
    areasOf.set(id, []);
  }
  const receipts: ColumnReceipt[] = [];
  const memberSink = (id: string, load: TakedownLoad) => loadsOf.get(id)!.push(load);
  const areaSink = (id: string, load: AreaLoad) => areasOf.get(id)!.push(load);
  const sinks = {
    member: memberSink,
    column: (columnId: string, level: string, c: LoadCase, kip: number, source: string) =>
      receipts.push({ columnId, level, D_kip: c === 'D' ? kip : 0, L_kip: c === 'L' ? kip : 0, Lreducible_kip: 0, Lr_kip: c === 'Lr' ? kip : 0, S_kip: c === 'S' ? kip : 0, reducibleArea_ft2: 0, area_ft2: 0, cantileverSlab: false, source }),
  };

  for (const ctx of decks) deckStripLoads(ctx, memberSink, areaSink);
  for (const [id, list] of loadsOf) {
    const span = topology.members.get(id)!.span_ft;
    loadsOf.set(id, mergeContiguousLoads(list, span, (a, b) => a.case === b.case && a.source === b.source && !!a.reducible === !!b.reducible));
    areasOf.set(id, mergeContiguousLoads(areasOf.get(id)!, span, (a, b) => a.of === b.of));
  }
  const points = placePointLoads(plan, topology, decks, sinks);
  const lines = placeLineLoads(plan, topology, decks, sinks);
  problems.push(...points.problems, ...lines.problems);

  const deckApplied = deckAppliedLoads(decks);
  const applied = zeroCaseTotals();
  for (const c of LOAD_CASES) applied[c] = deckApplied.applied[c] + points.applied[c] + lines.applied[c];

  const overhang = new Set<string>();
  const deckCoverage = new Map<string, [number, number][]>();
  const deckDirectArea = new Map<string, number>();
  for (const ctx of decks) {
    ctx.tributary.overhangMemberIds.forEach((id) => overhang.add(id));
    for (const [id, ranges] of ctx.tributary.bearing_v) {
      const axis = ctx.axes.get(id)!;
      const list = deckCoverage.get(id) ?? [];
      for (const [v1, v2] of ranges) list.push([axis.sign * (v1 - axis.vStart_ft), axis.sign * (v2 - axis.vStart_ft)]);
      deckCoverage.set(id, list);
    }
  }
  for (const [id, areas] of areasOf) {
    const fm = topology.members.get(id)!;
    deckDirectArea.set(id, simpleSpanReactions(areas.filter((a) => a.of === 'all'), fm.span_ft).total);
  }

  const members = new Map<string, MemberTakedown>();
  const llrOn = plan.designBasis.liveLoadReduction;
  for (const id of topology.order) {
    const fm = topology.members.get(id)!;
    const loads = loadsOf.get(id)!;
    const areaLoads = areasOf.get(id)!;
    const all = simpleSpanReactions(areaLoads.filter((a) => a.of === 'all'), fm.span_ft).total;
    const reducibleArea = simpleSpanReactions(areaLoads.filter((a) => a.of === 'reducibleLive'), fm.span_ft).total;
    const carriesOverhang = overhang.has(id);
    const KLL = memberKll(carriesOverhang);
    const framingPoints_ft = fm.carries.map((c) => c.position_ft).filter((x) => x > 1e-6 && x < fm.span_ft - 1e-6);
    const mt: MemberTakedown = {
      id,
      member: fm.member,
      level: fm.level,
      kind: fm.member.kind,
      span_ft: fm.span_ft,
      loads,
      areaLoads,
      selfWeight_plf: 0,
      tributaryWidth_ft: (deckDirectArea.get(id) ?? 0) / fm.span_ft,
      tributaryArea_ft2: all,
      reducibleArea_ft2: reducibleArea,
      KLL,
      liveReductionFactor: llrOn ? liveLoadReductionFactor(KLL, reducibleArea, 1) : 1,
      carriesOverhang,
      bracing: deriveMemberBracing(fm.member, fm.span_ft, deckCoverage.get(id) ?? [], framingPoints_ft),
      framingPoints_ft: [...new Set(framingPoints_ft)].sort((a, b) => a - b),
      supports: fm.supports,
      reactions: { start: emptyReaction(null), end: emptyReaction(null) },
    };
    const plf = options.selfWeight ? options.selfWeight(mt) : lockedShapeWeightPlf(fm.member);
    mt.selfWeight_plf = plf;
    if (plf > 0) loads.push({ case: 'D', kind: 'uniform', w_klf: plf / 1000, source: `self weight ${plf} plf` });
    applied.D += (plf / 1000) * fm.span_ft;
    mt.reactions = memberEndReactions(mt);
    members.set(id, mt);

    for (const end of ['start', 'end'] as const) {
      const support = fm.supports[end];
      const r = mt.reactions[end];
      if (support.kind === 'member') {
        if (!topology.members.has(support.id)) continue;
        const delivered = reactionAsPointLoads(mt, r, support.position_ft);
        loadsOf.get(support.id)!.push(...delivered.loads);
        areasOf.get(support.id)!.push(...delivered.areas);
      } else if (support.kind === 'column') {
        receipts.push({
          columnId: support.id,
          level: fm.level,
          D_kip: r.D_kip,
          L_kip: r.L_kip,
          Lreducible_kip: r.Lreducible_kip,
          Lr_kip: r.Lr_kip,
          S_kip: r.S_kip,
          area_ft2: r.area_ft2,
          reducibleArea_ft2: r.reducibleArea_ft2,
          cantileverSlab: carriesOverhang,
          source: `${mt.kind} ${id} ${end}`,
        });
      }
    }
  }

  const columns = stackColumns(plan, receipts, llrOn);
  const reactionsByCase = zeroCaseTotals();
  for (const r of receipts) {
    reactionsByCase.D += r.D_kip;
    reactionsByCase.L += r.L_kip;
    reactionsByCase.Lr += r.Lr_kip;
    reactionsByCase.S += r.S_kip;
  }
  const equilibrium = Object.fromEntries(LOAD_CASES.map((c) => [c, { applied_kip: applied[c], reactions_kip: reactionsByCase[c] }])) as Record<LoadCase, EquilibriumCase>;

  return {
    topology,
    members,
    order: topology.order,
    columns,
    equilibrium,
    floorArea_ft2: deckApplied.total,
    byLevelFloorArea_ft2: deckApplied.byLevel,
    problems,
  };
}

/** L this member passes on after its own reduction: reducible part × factor + the rest. */
export function reducedLiveKip(r: EndReaction, factor: number): number {
  return r.Lreducible_kip * factor + (r.L_kip - r.Lreducible_kip);
}
