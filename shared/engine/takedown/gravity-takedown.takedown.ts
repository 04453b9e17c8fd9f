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
import { buildFramingTopology, type EndSupport, type FramingMember, type FramingTopology, type MemberEnd } from '../geometry/framing-topology.geometry';
import { buildDeckContexts, deckStripLoads, zonePressures, type DeckContext } from '../loads/deck-loads.loads';
import { placeLineLoads, placePointLoads, zeroCaseTotals, type CaseTotals, type PlacedLoadSinks } from '../loads/placed-loads.loads';
import { kllTable4_7_1, liveLoadReductionFactor } from '../loads/live-load-reduction.loads';
import { LOAD_CASES, mergeContiguousLoads, type AreaLoad, type LoadCase, type TakedownLoad } from './member-load.takedown';
import { lastResultant, resultantKip, simpleSpanReactions } from './simple-span-statics.takedown';
import { deriveMemberBracing, type Bracing } from './member-bracing.takedown';
import { stackColumns, type ColumnReceipt, type ColumnTakedown } from './column-stack.takedown';
import { sameValue } from '../plain-value';

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
  /** Reuse deck loads already prepared for this plan and topology (see prepareDeckLoads). */
  deckLoads?: PreparedDeckLoads;
  /** Filled with what the whole-plan sums are made of, in the order they are made (see TakedownTrace). */
  trace?: TakedownTrace;
  /** Reuse of an earlier takedown of this plan's framing (see TakedownReuse). Ignored with `trace`. */
  reuse?: TakedownReuse;
}

/**
 * An earlier takedown of the same framing (the same topology object, with the same deck
 * loads), which the caller vouches was made with the same design basis. A member's takedown
 * is a function of its own plan member, its deck strips, the point and line loads placed on
 * it (compared by value with what was placed on it before), the reactions of the members it
 * carries, and its self weight (a function of the same inputs, through the selfWeight hook).
 * So a member whose own inputs are unchanged and which carries only such members (carried
 * members are taken down first) comes out as before: its earlier takedown is used and
 * `selfWeight` is not called for it; `reused` is called instead. Every other member is
 * taken down as always.
 */
export interface TakedownReuse {
  previous: TakedownResult;
  /** Whether this member's own plan member is unchanged since `previous` (compared by value). */
  unchanged: (fm: FramingMember) => boolean;
  /** Called for each member whose earlier takedown is used, in topological order. */
  reused: (mt: MemberTakedown) => void;
}

/** The members a takedown must work out again: changed ones and everything that carries them. */
function membersToRedo(topology: FramingTopology, reuse: TakedownReuse, placed: Map<string, PlacedParts>): Set<string> {
  const redo = new Set<string>();
  const placedBefore = reuse.previous.placed;
  for (const id of topology.order) {
    const fm = topology.members.get(id)!;
    if (redo.has(id) || !reuse.previous.members.has(id) || !reuse.unchanged(fm) || !sameValue(placed.get(id), placedBefore.get(id))) {
      redo.add(id);
      // Supporters come later in the order, so marking them here reaches them in time.
      if (fm.supports.start.kind === 'member') redo.add(fm.supports.start.id);
      if (fm.supports.end.kind === 'member') redo.add(fm.supports.end.id);
    }
  }
  return redo;
}

/**
 * The parts of a takedown's whole-plan sums (equilibrium, column receipts) in the order they
 * were added, each with the element it came from, so a takedown of one level can be placed in
 * a larger plan and its sums re-made in that plan's order (typical-levels.scheme).
 */
export interface TakedownTrace {
  /** Column receipts as pushed; `receiptFrom[i]` is the point load's index in plan.pointLoads, or the member id. */
  receipts: ColumnReceipt[];
  receiptFrom: (number | string)[];
  /** Additions to the applied totals by point loads and line loads: load index, case, kip. */
  pointApplied: { index: number; case: LoadCase; kip: number }[];
  lineApplied: { index: number; case: LoadCase; kip: number }[];
}

export const emptyTakedownTrace = (): TakedownTrace => ({ receipts: [], receiptFrom: [], pointApplied: [], lineApplied: [] });

/**
 * Everything the takedown draws from the decks alone: their contexts and problems, and each
 * member's strip loads and tributary area (merged). A pure function of the topology, decks,
 * zones, openings and levels, so a re-design that changes none of them can reuse it; the
 * load objects are never mutated, the lists are copied before use.
 */
export interface PreparedDeckLoads {
  decks: DeckContext[];
  problems: PlanProblem[];
  strips: Map<string, { loads: TakedownLoad[]; areas: AreaLoad[] }>;
}

const sameLoadKind = (a: TakedownLoad, b: TakedownLoad) => a.case === b.case && a.source === b.source && !!a.reducible === !!b.reducible;
const sameAreaKind = (a: AreaLoad, b: AreaLoad) => a.of === b.of;

export function prepareDeckLoads(plan: Plan, topology: FramingTopology): PreparedDeckLoads {
  const { decks, problems } = buildDeckContexts(plan, topology);
  const strips = new Map<string, { loads: TakedownLoad[]; areas: AreaLoad[] }>();
  for (const id of topology.members.keys()) strips.set(id, { loads: [], areas: [] });
  const memberSink = (id: string, load: TakedownLoad) => void strips.get(id)!.loads.push(load);
  const areaSink = (id: string, load: AreaLoad) => void strips.get(id)!.areas.push(load);
  for (const ctx of decks) deckStripLoads(ctx, memberSink, areaSink);
  for (const [id, g] of strips) {
    const span = topology.members.get(id)!.span_ft;
    g.loads = mergeContiguousLoads(g.loads, span, sameLoadKind);
    g.areas = mergeContiguousLoads(g.areas, span, sameAreaKind);
  }
  return { decks, problems, strips };
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
  /** The point- and line-load parts each member received (members that received any), for TakedownReuse. */
  placed: Map<string, PlacedParts>;
}

/** What the point and line loads placed on one member, in placing order. */
interface PlacedParts {
  loads: TakedownLoad[];
  areas: AreaLoad[];
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

/** Placeholder while a member is being taken down (replaced before runTakedown returns; never mutated). */
const PENDING_REACTIONS: Record<MemberEnd, EndReaction> = Object.freeze({ start: Object.freeze(emptyReaction(null)), end: Object.freeze(emptyReaction(null)) });

export function lockedShapeWeightPlf(member: PlanMember): number {
  return member.shape ? findWShape(member.shape)?.W_plf ?? 0 : 0;
}

/** Sum of a load list's resultants per case (kip). */
export function loadTotalsByCase(loads: readonly TakedownLoad[], spanFt: number): CaseTotals {
  const totals = zeroCaseTotals();
  for (const l of loads) totals[l.case] += simpleSpanReactions([l], spanFt).total;
  return totals;
}

/**
 * Running sums of resultants and moments about the start, per case and for the area carried,
 * filled in one pass over a member's loads (each sum sees its loads in list order, so the
 * result equals summing each case's list separately).
 */
class EndSums {
  tD = 0; mD = 0; tL = 0; mL = 0; tLr = 0; mLr = 0; tS = 0; mS = 0; tRed = 0; mRed = 0;
  tArea = 0; mArea = 0; tRedArea = 0; mRedArea = 0;

  reset(): void {
    this.tD = 0; this.mD = 0; this.tL = 0; this.mL = 0; this.tLr = 0; this.mLr = 0; this.tS = 0; this.mS = 0; this.tRed = 0; this.mRed = 0;
    this.tArea = 0; this.mArea = 0; this.tRedArea = 0; this.mRedArea = 0;
  }

  addLoads(loads: readonly TakedownLoad[], spanFt: number): void {
    for (let i = 0; i < loads.length; i++) {
      const l = loads[i];
      const t = resultantKip(l, spanFt);
      const m = lastResultant.momentAboutStartKipFt;
      switch (l.case) {
        case 'D': this.tD += t; this.mD += m; break;
        case 'L':
          this.tL += t; this.mL += m;
          if (l.reducible) { this.tRed += t; this.mRed += m; }
          break;
        case 'Lr': this.tLr += t; this.mLr += m; break;
        case 'S': this.tS += t; this.mS += m; break;
      }
    }
  }

  /** Adds the area loads; returns the 'all' area total after the first `directCount` of them. */
  addAreas(areas: readonly AreaLoad[], spanFt: number, directCount: number): number {
    let direct = 0;
    for (let i = 0; i < areas.length; i++) {
      if (i === directCount) direct = this.tArea;
      const a = areas[i];
      const t = resultantKip(a, spanFt);
      if (a.of === 'all') { this.tArea += t; this.mArea += lastResultant.momentAboutStartKipFt; }
      else { this.tRedArea += t; this.mRedArea += lastResultant.momentAboutStartKipFt; }
    }
    return directCount >= areas.length ? this.tArea : direct;
  }

  /** Both ends' reactions: end = ΣM/L, start = ΣP − end. */
  reactions(spanFt: number, startSupport: string | null, endSupport: string | null): Record<MemberEnd, EndReaction> {
    const eD = this.mD / spanFt, eL = this.mL / spanFt, eLr = this.mLr / spanFt, eS = this.mS / spanFt, eRed = this.mRed / spanFt;
    const eArea = this.mArea / spanFt, eRedArea = this.mRedArea / spanFt;
    return {
      start: {
        D_kip: this.tD - eD, L_kip: this.tL - eL, Lreducible_kip: this.tRed - eRed, Lr_kip: this.tLr - eLr, S_kip: this.tS - eS,
        area_ft2: this.tArea - eArea, reducibleArea_ft2: this.tRedArea - eRedArea, supportedBy: startSupport,
      },
      end: { D_kip: eD, L_kip: eL, Lreducible_kip: eRed, Lr_kip: eLr, S_kip: eS, area_ft2: eArea, reducibleArea_ft2: eRedArea, supportedBy: endSupport },
    };
  }
}

const supportIdOf = (s: EndSupport) => (s.kind === 'none' ? null : s.id);

/** End reactions per case of a member (unreduced), and the area passed to each end. */
export function memberEndReactions(m: Pick<MemberTakedown, 'loads' | 'areaLoads' | 'span_ft' | 'supports'>): Record<MemberEnd, EndReaction> {
  const sums = new EndSums();
  sums.addLoads(m.loads, m.span_ft);
  sums.addAreas(m.areaLoads, m.span_ft, m.areaLoads.length);
  return sums.reactions(m.span_ft, supportIdOf(m.supports.start), supportIdOf(m.supports.end));
}

/** Push a member's reaction onto its supporter's lists as point loads at the connection. */
function deliverReaction(source: string, r: EndReaction, x_ft: number, loads: TakedownLoad[], areas: AreaLoad[]): void {
  if (r.D_kip !== 0) loads.push({ case: 'D', kind: 'point', P_kip: r.D_kip, x_ft, source });
  if (r.Lreducible_kip !== 0) loads.push({ case: 'L', kind: 'point', P_kip: r.Lreducible_kip, x_ft, source: `${source} (reducible live)`, reducible: true });
  const nonReducible = r.L_kip - r.Lreducible_kip;
  if (Math.abs(nonReducible) > 1e-12) loads.push({ case: 'L', kind: 'point', P_kip: nonReducible, x_ft, source: `${source} (live, not reducible)` });
  if (r.Lr_kip !== 0) loads.push({ case: 'Lr', kind: 'point', P_kip: r.Lr_kip, x_ft, source });
  if (r.S_kip !== 0) loads.push({ case: 'S', kind: 'point', P_kip: r.S_kip, x_ft, source });
  if (r.area_ft2 !== 0) areas.push({ kind: 'point', P_kip: r.area_ft2, x_ft, of: 'all' });
  if (r.reducibleArea_ft2 !== 0) areas.push({ kind: 'point', P_kip: r.reducibleArea_ft2, x_ft, of: 'reducibleLive' });
}

/** A member's reaction delivered to its supporter as point loads at the connection. */
export function reactionAsPointLoads(from: MemberTakedown, r: EndReaction, x_ft: number): { loads: TakedownLoad[]; areas: AreaLoad[] } {
  const loads: TakedownLoad[] = [];
  const areas: AreaLoad[] = [];
  deliverReaction(`${from.kind} ${from.id} reaction`, r, x_ft, loads, areas);
  return { loads, areas };
}

/** KLL of a beam or girder, ASCE 7-16 Table 4.7-1: 2; 1 for an edge member with a cantilever slab. */
export function memberKll(carriesOverhang: boolean): number {
  return carriesOverhang ? kllTable4_7_1('other') : kllTable4_7_1('interior-beam');
}

/** Net deck area per level and the applied deck load per case. */
export function deckAppliedLoads(decks: readonly DeckContext[], levelOf: (ctx: DeckContext, k: number) => string = (ctx) => ctx.deck.level): { applied: CaseTotals; byLevel: Map<string, number>; total: number } {
  const applied = zeroCaseTotals();
  const byLevel = new Map<string, number>();
  let total = 0;
  for (let k = 0; k < decks.length; k++) {
    const ctx = decks[k];
    const level = levelOf(ctx, k);
    const area = ctx.tributary.netArea_ft2;
    total += area;
    byLevel.set(level, (byLevel.get(level) ?? 0) + area);
    for (const p of zonePressures(ctx.zone, ctx.roof, ctx.deck.slab)) applied[p.case] += (p.psf * area) / 1000;
  }
  return { applied, byLevel, total };
}

/** Loads gathered for one member before its turn. */
interface Gathered {
  loads: TakedownLoad[];
  areas: AreaLoad[];
  /** How many of `areas` came from deck strips (the rest are delivered reactions). */
  deckAreaCount: number;
}

const ascending = (a: number, b: number) => a - b;

/** Positions where other members frame in, strictly inside the span (as listed, and distinct ascending). */
function framingPointsOf(fm: FramingMember): { listed: number[]; distinct: number[] } {
  const listed: number[] = [];
  for (let i = 0; i < fm.carries.length; i++) {
    const x = fm.carries[i].position_ft;
    if (x > 1e-6 && x < fm.span_ft - 1e-6) listed.push(x);
  }
  if (listed.length === 0) return { listed, distinct: [] };
  return { listed, distinct: [...new Set(listed)].sort(ascending) };
}

const NO_COVERAGE: [number, number][] = [];

export function runTakedown(plan: Plan, options: TakedownOptions = {}): TakedownResult {
  const topology = options.topology ?? buildFramingTopology(plan);
  const problems: PlanProblem[] = [...topology.problems];
  const prepared = options.deckLoads ?? prepareDeckLoads(plan, topology);
  const decks = prepared.decks;
  problems.push(...prepared.problems);

  const gathered = new Map<string, Gathered>();
  for (const [id, strip] of prepared.strips) gathered.set(id, { loads: strip.loads.slice(), areas: strip.areas.slice(), deckAreaCount: strip.areas.length });
  const receipts: ColumnReceipt[] = [];
  const trace = options.trace ?? null;
  let appliedLog: TakedownTrace['pointApplied'] | null = trace ? trace.pointApplied : null;
  const sinks: PlacedLoadSinks = {
    member: (id: string, load: TakedownLoad) => void gathered.get(id)!.loads.push(load),
    column: (columnId: string, level: string, c: LoadCase, kip: number, source: string, loadIndex: number) => {
      receipts.push({ columnId, level, D_kip: c === 'D' ? kip : 0, L_kip: c === 'L' ? kip : 0, Lreducible_kip: 0, Lr_kip: c === 'Lr' ? kip : 0, S_kip: c === 'S' ? kip : 0, reducibleArea_ft2: 0, area_ft2: 0, cantileverSlab: false, source });
      if (trace) trace.receiptFrom.push(loadIndex);
    },
    ...(trace ? { applied: (index: number, c: LoadCase, kip: number) => void appliedLog!.push({ index, case: c, kip }) } : {}),
  };

  const points = placePointLoads(plan, topology, decks, sinks);
  if (trace) appliedLog = trace.lineApplied;
  const lines = placeLineLoads(plan, topology, decks, sinks);
  problems.push(...points.problems, ...lines.problems);

  const deckApplied = deckAppliedLoads(decks);
  const applied = zeroCaseTotals();
  for (const c of LOAD_CASES) applied[c] = deckApplied.applied[c] + points.applied[c] + lines.applied[c];

  const overhang = new Set<string>();
  const deckCoverage = new Map<string, [number, number][]>();
  for (const ctx of decks) {
    ctx.tributary.overhangMemberIds.forEach((id) => overhang.add(id));
    for (const [id, ranges] of ctx.tributary.bearing_v) {
      const axis = ctx.axes.get(id)!;
      let list = deckCoverage.get(id);
      if (!list) deckCoverage.set(id, (list = []));
      for (const [v1, v2] of ranges) list.push([axis.sign * (v1 - axis.vStart_ft), axis.sign * (v2 - axis.vStart_ft)]);
    }
  }

  const members = new Map<string, MemberTakedown>();
  const llrOn = plan.designBasis.liveLoadReduction;
  const sums = new EndSums();
  const selfWeightLoads = new Map<number, TakedownLoad>();
  const placed = new Map<string, PlacedParts>();
  for (const [id, strip] of prepared.strips) {
    const g = gathered.get(id)!;
    if (g.loads.length > strip.loads.length || g.areas.length > strip.areas.length) placed.set(id, { loads: g.loads.slice(strip.loads.length), areas: g.areas.slice(strip.areas.length) });
  }
  const reuse = !trace && options.reuse && options.reuse.previous.topology === topology ? options.reuse : null;
  const redo = reuse ? membersToRedo(topology, reuse, placed) : null;
  for (const id of topology.order) {
    const fm = topology.members.get(id)!;
    if (redo && !redo.has(id)) {
      reusedMember(reuse!.previous.members.get(id)!, fm, reuse!, redo, gathered, receipts, members);
      const prev = members.get(id)!;
      applied.D += (prev.selfWeight_plf / 1000) * prev.span_ft;
      continue;
    }
    const g = gathered.get(id)!;
    const loads = g.loads;
    const areaLoads = g.areas;
    const span = fm.span_ft;
    sums.reset();
    const deckDirectArea = sums.addAreas(areaLoads, span, g.deckAreaCount);
    const all = sums.tArea;
    const reducibleArea = sums.tRedArea;
    const carriesOverhang = overhang.has(id);
    const KLL = memberKll(carriesOverhang);
    const framing = framingPointsOf(fm);
    const mt: MemberTakedown = {
      id,
      member: fm.member,
      level: fm.level,
      kind: fm.member.kind,
      span_ft: span,
      loads,
      areaLoads,
      selfWeight_plf: 0,
      tributaryWidth_ft: deckDirectArea / span,
      tributaryArea_ft2: all,
      reducibleArea_ft2: reducibleArea,
      KLL,
      liveReductionFactor: llrOn ? liveLoadReductionFactor(KLL, reducibleArea, 1) : 1,
      carriesOverhang,
      bracing: deriveMemberBracing(fm.member, span, deckCoverage.get(id) ?? NO_COVERAGE, framing.listed),
      framingPoints_ft: framing.distinct,
      supports: fm.supports,
      reactions: PENDING_REACTIONS,
    };
    sums.addLoads(loads, span);
    const plf = options.selfWeight ? options.selfWeight(mt) : lockedShapeWeightPlf(fm.member);
    mt.selfWeight_plf = plf;
    if (plf > 0) {
      // One load object per weight in a run (members of one size share it; never mutated).
      let selfWeight = selfWeightLoads.get(plf);
      if (!selfWeight) selfWeightLoads.set(plf, (selfWeight = { case: 'D', kind: 'uniform', w_klf: plf / 1000, source: `self weight ${plf} plf` }));
      loads.push(selfWeight);
      sums.tD += resultantKip(selfWeight, span);
      sums.mD += lastResultant.momentAboutStartKipFt;
    }
    applied.D += (plf / 1000) * span;
    const reactions = sums.reactions(span, supportIdOf(fm.supports.start), supportIdOf(fm.supports.end));
    mt.reactions = reactions;
    members.set(id, mt);

    let source: string | null = null;
    for (let e = 0; e < 2; e++) {
      const end: MemberEnd = e === 0 ? 'start' : 'end';
      const support = fm.supports[end];
      const r = reactions[end];
      if (support.kind === 'member') {
        const target = gathered.get(support.id);
        if (!target || !topology.members.has(support.id)) continue;
        deliverReaction((source ??= `${mt.kind} ${id} reaction`), r, support.position_ft, target.loads, target.areas);
      } else if (support.kind === 'column') {
        receipts.push(columnReceipt(support.id, fm.level, r, carriesOverhang, `${mt.kind} ${id} ${end}`));
        if (trace) trace.receiptFrom.push(id);
      }
    }
  }

  if (trace) trace.receipts = receipts;
  const columns = stackColumns(plan, receipts, llrOn);
  const equilibrium = equilibriumOf(applied, receipts);

  return {
    topology,
    members,
    order: topology.order,
    columns,
    equilibrium,
    floorArea_ft2: deckApplied.total,
    byLevelFloorArea_ft2: deckApplied.byLevel,
    problems,
    placed,
  };
}

/** A member end's reaction as its column receives it. */
function columnReceipt(columnId: string, level: string, r: EndReaction, cantileverSlab: boolean, source: string): ColumnReceipt {
  return {
    columnId,
    level,
    D_kip: r.D_kip,
    L_kip: r.L_kip,
    Lreducible_kip: r.Lreducible_kip,
    Lr_kip: r.Lr_kip,
    S_kip: r.S_kip,
    area_ft2: r.area_ft2,
    reducibleArea_ft2: r.reducibleArea_ft2,
    cantileverSlab,
    source,
  };
}

/**
 * A member taken down as before (TakedownReuse): its earlier takedown on this plan's member,
 * its reactions delivered to the supporters being worked out again and its column receipts
 * pushed, each exactly as the full loop does them.
 */
function reusedMember(
  prev: MemberTakedown, fm: FramingMember, reuse: TakedownReuse, redo: Set<string>, gathered: Map<string, Gathered>, receipts: ColumnReceipt[], members: Map<string, MemberTakedown>,
): void {
  const mt: MemberTakedown = { ...prev, member: fm.member };
  reuse.reused(mt);
  members.set(mt.id, mt);
  let source: string | null = null;
  for (let e = 0; e < 2; e++) {
    const end: MemberEnd = e === 0 ? 'start' : 'end';
    const support = fm.supports[end];
    const r = mt.reactions[end];
    if (support.kind === 'member') {
      // A supporter taken down as before already holds this reaction in its earlier loads.
      if (!redo.has(support.id)) continue;
      const target = gathered.get(support.id);
      if (!target) continue;
      deliverReaction((source ??= `${mt.kind} ${mt.id} reaction`), r, support.position_ft, target.loads, target.areas);
    } else if (support.kind === 'column') {
      receipts.push(columnReceipt(support.id, fm.level, r, mt.carriesOverhang, `${mt.kind} ${mt.id} ${end}`));
    }
  }
}

/** Equilibrium per case: the applied totals beside the sum of the column receipts (in their order). */
export function equilibriumOf(applied: CaseTotals, receipts: readonly ColumnReceipt[]): Record<LoadCase, EquilibriumCase> {
  const reactionsByCase = zeroCaseTotals();
  for (const r of receipts) {
    reactionsByCase.D += r.D_kip;
    reactionsByCase.L += r.L_kip;
    reactionsByCase.Lr += r.Lr_kip;
    reactionsByCase.S += r.S_kip;
  }
  return Object.fromEntries(LOAD_CASES.map((c) => [c, { applied_kip: applied[c], reactions_kip: reactionsByCase[c] }])) as Record<LoadCase, EquilibriumCase>;
}

/** L this member passes on after its own reduction: reducible part × factor + the rest. */
export function reducedLiveKip(r: EndReaction, factor: number): number {
  return r.Lreducible_kip * factor + (r.L_kip - r.Lreducible_kip);
}
