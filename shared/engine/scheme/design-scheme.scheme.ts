/**
 * Whole-scheme design (`calc plan`, calc-interface.md): takedown in topological order with
 * each member sized as it is reached, so its reactions carry its own self weight before its
 * supporter is designed (the whole-plan iteration; with grouping, repeated to a fixed point).
 *
 * Re-design after an edit: pass `previous` (the last result of this function, in memory).
 * Designs are reused wherever a member's design input is unchanged, so only the changed
 * members and what their change reaches (neighbours sharing a strip, supporters up the
 * order) are sized again. On the same framing geometry and design basis (not with grouping),
 * a member whose own data and placed loads are unchanged and which carries only such members
 * also keeps its takedown (LastPass, TakedownReuse) — with a wet stage, in each stage, its
 * composite site and wet takedown unchanged too — so a one-member edit takes down that
 * member and what carries it. `changedIds` is accepted as a
 * hint for callers; correctness does not depend on it because the inputs themselves are
 * compared (with value copies, so edits made in place to an earlier plan are caught).
 */
import type { Plan } from '../../schemas/plan.schema';
import { planProblem, type PlanProblem } from '../../schemas/plan-problem.schema';
import { designMember } from '../sizing/member-design';
import { MemberInputError } from '../sizing/member-input.validation';
import type { MemberDesignInput, MemberDesignResult } from '../sizing/member-design.types';
import type { MemberLoad } from '../analysis/member-load.types';
import type { TakedownLoad } from '../takedown/member-load.takedown';
import { planGeometry, type PlanGeometry, type PlanGeometryMemo } from './plan-geometry-memo.scheme';
import { lockedShapeWeightPlf, prepareDeckLoads, reducedLiveKip, runTakedown, type PreparedDeckLoads, type EndReaction, type MemberTakedown, type TakedownResult, type TakedownReuse } from '../takedown/gravity-takedown.takedown';
import { copyValue, sameValue, sameValueInOrder } from '../plain-value';
import type { Bracing } from '../takedown/member-bracing.takedown';
import { assignMarks, levelMarkPrefix, sharedMarkConflicts, type MarkInput } from './member-marks.scheme';
import { compositeMemberInput, compositeSites, planNeedsWetStage, wetStagePlan, type MemberCompositeStatus } from './composite-plan.scheme';
import type { CompositeMemberInput } from '../sizing/member-design.types';
import { schemeColumns, type SchemeColumn } from './column-design.scheme';
import { memberDeflectionLimits } from './member-settings.scheme';
import { LevelRenamer, typicalLevelTemplates, type LevelTemplate } from './typical-levels.scheme';
import { deckAppliedLoads, emptyTakedownTrace, equilibriumOf, type TakedownTrace } from '../takedown/gravity-takedown.takedown';
import { orderBySupport, type EndSupport, type FramingMember } from '../geometry/framing-topology.geometry';
import { stackColumns, type ColumnReceipt } from '../takedown/column-stack.takedown';
import { LOAD_CASES, type LoadCase } from '../takedown/member-load.takedown';
import { zeroCaseTotals } from '../loads/placed-loads.loads';
import type { DeckContext } from '../loads/deck-loads.loads';

export interface SchemeOptions {
  /** Members of the same level, kind, span, load layout and bracing get one size: the heaviest demand governs. */
  groupIdentical?: boolean;
  /** The previous result for this plan (in memory), to reuse unchanged designs. */
  previous?: SchemeResult;
  /** Ids of the elements the caller changed (a hint; see the file comment). */
  changedIds?: string[];
  /** Design levels alike once and place the result on each (typical-levels.scheme; same figures). Default true. */
  typicalLevels?: boolean;
  /**
   * Default true. False: each member's `loads` list is left empty, for a caller that does not
   * print it (calc plan without --detail), so 10,000 members' load lists with their ids made
   * real are not built for nothing. Every other figure is the same.
   */
  memberLoads?: boolean;
}

export interface SchemeReactionEnd {
  D_kip: number;
  /** Live load this member passes on after its own reduction. */
  L_kip: number;
  Lr_kip: number;
  S_kip: number;
  /** Live load before reduction. */
  Lunreduced_kip: number;
  supportedBy: string | null;
}

export interface SchemeMember {
  id: string;
  mark: string;
  kind: 'girder' | 'beam';
  level: string;
  shape: string | null;
  span_ft: number;
  passes: boolean;
  governing: string | null;
  ratio: number | null;
  tributaryWidth_ft: number;
  tributaryArea_ft2: number;
  /** AT of ASCE 7-16 Eq. 4.7-1: area of reducible live load carried, ft². */
  reducibleArea_ft2: number;
  KLL: number;
  liveReductionFactor: number;
  Lb_ft: number | null;
  Cb: number | null;
  Mr_kipft: number | null;
  Mc_kipft: number | null;
  weight_plf: number;
  reactions: { start: SchemeReactionEnd; end: SchemeReactionEnd };
  /** The loads the member was designed for (live reduced), each with where it came from. */
  loads: MemberLoad[];
  bracing: Bracing;
  connections: number;
  design: MemberDesignResult | null;
  /** calc-interface.md "Additions": total studs, camber (in) and ΣQn / full composite; null where not composite. */
  /** Present only on plans with a wet-concrete stage (composite or the superimposed-dead deflection setting), so version 1 results are unchanged; `calc plan` always writes them. */
  studs?: number | null;
  camber_in?: number | null;
  percentComposite?: number | null;
  /** Why the member is bare steel (composite off, marked non-composite, no slab), or null when composite. */
  compositeNote?: string | null;
  /** The composite and pre-composite parts of the design input (for re-checks on the member sheet). */
  designExtras?: MemberDesignExtras | null;
}

/** What a plan adds to a member's design input beyond memberDesignInput (composite, total deflection setting). */
export interface MemberDesignExtras {
  composite: CompositeMemberInput | null;
  totalDeflectionIncludes: 'deadAndLive' | 'superimposedDeadAndLive';
  preCompositeDead: MemberLoad[];
}

export type { SchemeColumnLevel, SchemeColumn, SchemeColumnTier } from './column-design.scheme';

export interface SchemeBreakdown {
  steelWeight_lb: number;
  pieces: number;
  floorArea_ft2: number;
}

export interface SchemeResult {
  name: string;
  method: 'LRFD' | 'ASD';
  members: SchemeMember[];
  columns: SchemeColumn[];
  totals: {
    /** Beams and girders (members); columns are in columnWeight_lb. */
    steelWeight_lb: number;
    /** Gravity columns: Σ shape weight × length (design-basis §8). */
    columnWeight_lb: number;
    columnPieces: number;
    floorArea_ft2: number;
    steel_psf: number;
    pieces: number;
    connections: number;
    byLevel: (SchemeBreakdown & { level: string; columnWeight_lb: number; columnPieces: number })[];
    byKind: (Omit<SchemeBreakdown, 'floorArea_ft2'> & { kind: 'girder' | 'beam' })[];
  };
  equilibrium: Record<'D' | 'L' | 'Lr' | 'S', { applied_kip: number; reactions_kip: number }>;
  problems: PlanProblem[];
  caution: string;
}

export const SCHEME_CAUTION =
  'Baywright results must be checked by a licensed engineer before use; local codes and the engineer of record govern.';

type DesignEntry = MemberDesignResult | { error: string[] };

/** The takedown's self-weight load (a uniform dead load; the kind test first spares the text test). */
const isSelfWeight = (l: TakedownLoad) => l.kind === 'uniform' && l.case === 'D' && l.source.startsWith('self weight');

/**
 * A reducible load written without `reducible`, its magnitudes × f and `suffix` on its source.
 * Keys in the order the takedown writes them (deck strips: kind first; delivered reactions:
 * case first), built literally so each kind has one object layout (a generic key-by-key copy
 * was the slowest part of this function).
 */
function reducedCopy(l: TakedownLoad, f: number, suffix: string): MemberLoad {
  const source = suffix === '' ? l.source : l.source + suffix;
  const caseFirst = firstKeyIsCase(l);
  switch (l.kind) {
    case 'point':
      return caseFirst
        ? { case: l.case, kind: 'point', P_kip: l.P_kip * f, x_ft: l.x_ft, source }
        : { kind: 'point', P_kip: l.P_kip * f, x_ft: l.x_ft, case: l.case, source };
    case 'uniform':
      return caseFirst ? { case: l.case, kind: 'uniform', w_klf: l.w_klf * f, source } : { kind: 'uniform', w_klf: l.w_klf * f, case: l.case, source };
    case 'partial':
      return caseFirst
        ? { case: l.case, kind: 'partial', w_klf: l.w_klf * f, from_ft: l.from_ft, to_ft: l.to_ft, source }
        : { kind: 'partial', w_klf: l.w_klf * f, from_ft: l.from_ft, to_ft: l.to_ft, case: l.case, source };
    case 'linear':
      return caseFirst
        ? { case: l.case, kind: 'linear', w1_klf: l.w1_klf * f, w2_klf: l.w2_klf * f, from_ft: l.from_ft, to_ft: l.to_ft, source }
        : { kind: 'linear', w1_klf: l.w1_klf * f, w2_klf: l.w2_klf * f, from_ft: l.from_ft, to_ft: l.to_ft, case: l.case, source };
  }
}

/** Whether `case` is the load's first key (the takedown writes no other key before kind or case). */
function firstKeyIsCase(l: TakedownLoad): boolean {
  for (const k in l) return k === 'case';
  return false;
}

/**
 * Reduced copies already made, by takedown load and factor: the deck strip loads are reused
 * across re-designs (plan-geometry-memo), so a member whose factor is unchanged gets the same
 * copy again instead of a new object and text. Copies are never mutated (like the takedown's
 * own loads, which results share).
 */
const reducedCopies = new WeakMap<TakedownLoad, { f: number; copy: MemberLoad }>();

function reducedCopyOnce(l: TakedownLoad, f: number, note: string): MemberLoad {
  const hit = reducedCopies.get(l);
  if (hit !== undefined && hit.f === f) return hit.copy;
  const copy = reducedCopy(l, f, note);
  reducedCopies.set(l, { f, copy });
  return copy;
}

/** The loads a member is designed for: reducible live × its reduction factor (ASCE 7-16 Eq. 4.7-1). */
export function designLoads(mt: MemberTakedown): MemberLoad[] {
  const f = mt.liveReductionFactor;
  const out: MemberLoad[] = [];
  let note: string | null = null;
  const loads = mt.loads;
  for (let i = 0; i < loads.length; i++) {
    const l = loads[i];
    if (isSelfWeight(l)) continue; // the sizing engine adds self weight itself
    if (l.reducible === undefined) {
      // Nothing to drop or scale: the takedown's own object (never mutated after the takedown).
      out.push(l as MemberLoad);
      continue;
    }
    // Same keys in the same order, without `reducible`; reducible live scaled by the factor.
    if (l.reducible && f !== 1) {
      note ??= ` × ${f.toFixed(3)} (ASCE 7-16 Eq. 4.7-1)`;
      out.push(reducedCopyOnce(l, f, note));
    } else out.push(reducedCopyOnce(l, 1, ''));
  }
  return out;
}

export function memberDesignInput(plan: Plan, mt: MemberTakedown, forcedShape: string | null, loads: MemberLoad[] = designLoads(mt)): MemberDesignInput {
  const m = mt.member;
  return {
    span_ft: mt.span_ft,
    loads,
    bracing: mt.bracing,
    method: plan.designBasis.method,
    Fy_ksi: plan.designBasis.Fy_ksi,
    deflectionLimits: m.deflectionLimits ? limitsOnly(memberDeflectionLimits(plan.designBasis, m)) : plan.designBasis.deflectionLimits,
    shape: forcedShape ?? m.shape,
    maxDepth_in: m.maxDepth_in,
    minDepth_in: m.minDepth_in ?? null,
    allowedNominalDepths: m.allowedNominalDepths ?? null,
    includeSelfWeight: true,
    Lb_override_ft: m.Lb_override_ft ?? null,
  };
}

const limitsOnly = (d: { live: number | null; total: number | null }) => ({ live: d.live, total: d.total });

/** Rounding of the design key: positions and magnitudes far below any engineering meaning. */
const n9 = (v: number) => Math.round(v * 1e9) / 1e9;
const LOAD_CASE_CODE = { D: 0, L: 1, Lr: 2, S: 3 } as const;
/** Stands for null / absent in a key slot (never a value the slots can hold). */
const ABSENT = -0.5e300;

/**
 * Memo of member designs within a run and across re-designs: the design is a pure function of
 * its input, so members whose inputs agree (to the rounding above) share one design. The key
 * is a list of numbers (span, bracing, basis, constraints, every load's case, kind, magnitudes
 * and positions, rounded) plus the locked shape; it is hashed, and equal hashes are confirmed
 * number by number, so no two different inputs share a design.
 */
/** One memoised design: its key (numbers and locked shape, with their hash) and the design. */
interface TableEntry {
  nums: Float64Array;
  shape: string;
  hash: number;
  value: DesignEntry;
}

class DesignTable {
  private readonly buckets = new Map<number, TableEntry[]>();
  /** Entries this table holds (so one adopted by several members is entered once). */
  private readonly held = new Set<TableEntry>();
  size = 0;

  /** The key being looked up: scratch[0 … length) and the locked shape, with its hash. */
  private static scratch = new Float64Array(256);
  private static length = 0;
  private static shape = '';
  private static hash = 0;

  private static push(v: number): void {
    if (DesignTable.length === DesignTable.scratch.length) {
      const grown = new Float64Array(DesignTable.scratch.length * 2);
      grown.set(DesignTable.scratch);
      DesignTable.scratch = grown;
    }
    DesignTable.scratch[DesignTable.length++] = v;
  }

  /** Fills the scratch key for this input. */
  static keyOf(plan: Plan, mt: MemberTakedown, shape: string | null, loads: readonly MemberLoad[], extra = ''): void {
    const push = DesignTable.push;
    DesignTable.length = 0;
    const m = mt.member;
    const basis = plan.designBasis;
    push(n9(mt.span_ft));
    const b = mt.bracing;
    if (b === 'continuous') push(0);
    else if (b === 'none') push(1);
    else {
      push(2);
      push(b.points_ft.length);
      for (let i = 0; i < b.points_ft.length; i++) push(n9(b.points_ft[i]));
    }
    push(basis.method === 'LRFD' ? 0 : 1);
    push(basis.Fy_ksi);
    const limits = m.deflectionLimits ? memberDeflectionLimits(basis, m) : basis.deflectionLimits;
    push(limits.live ?? ABSENT);
    push(limits.total ?? ABSENT);
    push(m.maxDepth_in ?? ABSENT);
    push(m.minDepth_in ?? ABSENT);
    const allowed = m.allowedNominalDepths ?? [];
    push(allowed.length);
    for (let i = 0; i < allowed.length; i++) push(allowed[i]);
    push(m.Lb_override_ft ?? ABSENT);
    push(loads.length);
    for (let i = 0; i < loads.length; i++) {
      const l = loads[i];
      push(LOAD_CASE_CODE[l.case]);
      switch (l.kind) {
        case 'uniform':
          push(0);
          push(n9(l.w_klf));
          break;
        case 'partial':
          push(1);
          push(n9(l.w_klf));
          push(n9(l.from_ft));
          push(n9(l.to_ft));
          break;
        case 'linear':
          push(2);
          push(n9(l.w1_klf));
          push(n9(l.w2_klf));
          push(n9(l.from_ft));
          push(n9(l.to_ft));
          break;
        case 'point':
          push(3);
          push(n9(l.P_kip));
          push(n9(l.x_ft));
          break;
      }
    }
    const k = DesignTable.scratch;
    let h = 0x811c9dc5 | 0;
    for (let i = 0; i < DesignTable.length; i++) {
      const v = k[i] * 1e9;
      h = Math.imul(h ^ (v | 0), 0x01000193);
      h = Math.imul(h ^ ((v / 4294967296) | 0), 0x01000193);
    }
    DesignTable.shape = (shape ?? '') + extra;
    DesignTable.hash = h;
  }

  /** The memo entry for the scratch key, if any. */
  entry(): TableEntry | undefined {
    const list = this.buckets.get(DesignTable.hash);
    if (!list) return undefined;
    const k = DesignTable.scratch;
    const n = DesignTable.length;
    outer: for (const e of list) {
      if (e.shape !== DesignTable.shape || e.nums.length !== n) continue;
      // === on doubles: equal values, and 0 equals -0 (as the key's text did).
      for (let i = 0; i < n; i++) if (e.nums[i] !== k[i]) continue outer;
      return e;
    }
    return undefined;
  }

  /**
   * The design for the scratch key from `from` (the previous run's memo), entered in this memo
   * as the same entry object (entries are never mutated), so a re-design copies no key.
   */
  adoptFrom(from: DesignTable): TableEntry | undefined {
    const e = from.entry();
    if (e) this.adopt(e);
    return e;
  }

  /** Enter an entry of an earlier memo (by its own key), once. */
  adopt(e: TableEntry): void {
    if (this.held.has(e)) return;
    this.held.add(e);
    const list = this.buckets.get(e.hash);
    if (list) list.push(e);
    else this.buckets.set(e.hash, [e]);
    this.size++;
  }

  /** Memoise a design under the scratch key. */
  set(value: DesignEntry): TableEntry {
    const entry: TableEntry = { nums: DesignTable.scratch.slice(0, DesignTable.length), shape: DesignTable.shape, hash: DesignTable.hash, value };
    this.adopt(entry);
    return entry;
  }
}

/** Memos carried (non-enumerable, so never serialised) on each result, for the next re-design. */
const CACHE = Symbol('baywright.designCache');
interface SchemeMemo {
  designs: DesignTable;
  /** The whole plan's geometry, or null when the run was made from level templates. */
  geometry: PlanGeometryMemo | null;
  /** Each level template's geometry, by template signature. */
  templates: Map<string, PlanGeometryMemo> | null;
  /** The last pass of a design made at once, for reuse by the next (see LastPass). */
  last: LastPass | null;
  /** How many members this run took from the previous run's takedown (TakedownReuse). */
  reusedMembers: number;
  /** What a run from level templates placed, for the next such run (see PlacedMemo). */
  placed?: PlacedMemo;
}

/**
 * The members a run from level templates placed on the levels, kept so the next run reuses
 * each placed result that would come out the same. A placed member's result is a function of
 * its template member's result (compared by value, then the earlier object kept), its id,
 * level, mark and whether an error stands against it, the level's real ids (the renaming) and
 * whether loads are reported; where all of these are as before, the earlier object is the
 * result. After a one-member edit on one floor, the other floors' members are all reused.
 */
interface PlacedMemo {
  withLoads: boolean;
  /** Template members' results by template signature and placeholder id. */
  bases: Map<string, Map<string, SchemeMember>>;
  /** The result's members in file order, and for each the template member's result it was placed from (undefined: not placed). */
  members: readonly SchemeMember[];
  baseAt: (SchemeMember | undefined)[];
  /** Each level's real ids by placeholder rank. */
  levelIds: Map<string, readonly string[]>;
}

/** A result's placed members, by template signature (see PlacedMemo); signatureOf names each core's template. */
interface PlacedReuse {
  before: PlacedMemo | null;
  signatureOf: Map<DesignCore, string>;
  /** Filled by buildSchemeResult for the next run. */
  next: PlacedMemo | null;
}
function cacheOf(result: SchemeResult | undefined): SchemeMemo | null {
  return (result as unknown as { [CACHE]?: SchemeMemo } | undefined)?.[CACHE] ?? null;
}

/** Whether a result was made from level templates (typical-levels.scheme), for tests and benchmarks. */
export function designedFromLevelTemplates(result: SchemeResult): boolean {
  const memo = cacheOf(result);
  return memo !== null && memo.templates !== null;
}

/** How many members a re-design took as they were from the previous run's takedown, for tests and benchmarks. */
export function reusedMemberTakedowns(result: SchemeResult): number {
  return cacheOf(result)?.reusedMembers ?? 0;
}

/** Group key: level, kind, span, bracing and the layout (case, kind, position) of the loads. */
function groupKey(mt: MemberTakedown): string {
  const layout = mt.loads
    .filter((l) => !l.source.startsWith('self weight'))
    .map((l) => `${l.case}${l.kind}${'x_ft' in l ? l.x_ft.toFixed(1) : 'from_ft' in l ? `${l.from_ft.toFixed(1)}-${l.to_ft.toFixed(1)}` : ''}`)
    .sort()
    .join(',');
  const key = [mt.level, mt.kind, mt.span_ft.toFixed(2), JSON.stringify(mt.bracing), mt.member.shape ?? '', layout];
  // Members with their own Lb or deflection limits group only with members that set the same.
  if (mt.member.Lb_override_ft != null) key.push(`Lb${mt.member.Lb_override_ft}`);
  if (mt.member.deflectionLimits) key.push(`defl${JSON.stringify(mt.member.deflectionLimits)}`);
  return key.join('|');
}

/** The wet-concrete stage of a plan: composite sites and the construction takedown. */
interface WetStage {
  sites: Map<string, MemberCompositeStatus>;
  takedown: TakedownResult;
}

/** One design pass: the takedown with each member sized as it is reached. */
class DesignPass {
  readonly designs = new Map<string, DesignEntry>();
  readonly loadsOf = new Map<string, MemberLoad[]>();
  readonly extrasOf = new Map<string, MemberDesignExtras>();

  constructor(
    private readonly plan: Plan,
    private readonly table: DesignTable,
    private readonly previous: DesignTable | null,
    private readonly forced: Map<string, string>,
    private readonly wet: WetStage | null = null,
  ) {}

  private extrasFor(mt: MemberTakedown): MemberDesignExtras | null {
    if (!this.wet) return null;
    const wmt = this.wet.takedown.members.get(mt.id);
    const construction = wmt ? designLoads(wmt) : [];
    const status = this.wet.sites.get(mt.id);
    return {
      composite: status?.composite ? compositeMemberInput(this.plan, status.site, construction, mt.framingPoints_ft, mt.member.studs ?? null) : null,
      totalDeflectionIncludes: this.plan.designBasis.totalDeflectionIncludes ?? 'deadAndLive',
      preCompositeDead: construction.filter((l) => l.case === 'D'),
    };
  }

  /** The takedown's self-weight hook: size the member, return its weight (plf). */
  readonly selfWeight = (mt: MemberTakedown): number => {
    const loads = designLoads(mt);
    this.loadsOf.set(mt.id, loads);
    const shape = this.forced.get(mt.id) ?? mt.member.shape;
    const extras = this.extrasFor(mt);
    if (extras) this.extrasOf.set(mt.id, extras);
    DesignTable.keyOf(this.plan, mt, shape, loads, extras ? `|${JSON.stringify(extras)}` : '');
    let entry = this.table.entry();
    if (!entry && this.previous) entry = this.table.adoptFrom(this.previous);
    if (!entry) {
      let result: DesignEntry;
      try {
        result = designMember({ ...memberDesignInput(this.plan, mt, this.forced.get(mt.id) ?? null, loads), ...(extras ?? {}) });
      } catch (e) {
        if (!(e instanceof MemberInputError)) throw e;
        result = { error: [e.message, ...e.problems] };
      }
      entry = this.table.set(result);
    }
    this.entries.set(mt.id, entry);
    const result = entry.value;
    this.designs.set(mt.id, result);
    return 'error' in result ? lockedShapeWeightPlf(mt.member) : result.weight_plf;
  };

  /** Each member's memo entry (for the next re-design's reuse). */
  readonly entries = new Map<string, TableEntry>();
  /** Members whose earlier takedown and design were used (TakedownReuse). */
  readonly reusedIds = new Set<string>();

  /** The takedown's reuse hook: the member's earlier design, loads and extras, as they were. */
  private readonly reused = (mt: MemberTakedown): void => {
    const last = this.last!.stage;
    const entry = last.entries.get(mt.id)!;
    this.table.adopt(entry);
    this.entries.set(mt.id, entry);
    this.designs.set(mt.id, entry.value);
    const loads = last.loadsOf.get(mt.id);
    if (loads) this.loadsOf.set(mt.id, loads);
    const extras = last.extrasOf.get(mt.id);
    if (extras) this.extrasOf.set(mt.id, extras);
    this.reusedIds.add(mt.id);
  };

  /** The trace of the last run (when traced). */
  trace: TakedownTrace | null = null;

  /**
   * The same pass of the last run, which this one may reuse members of: a member whose own data
   * is unchanged (`sameMember`) and, with a wet stage, whose design extras are (`sameExtras`:
   * its wet-stage takedown and composite site), and which carries only such members.
   */
  last: { stage: StagePass; sameMember: (fm: FramingMember) => boolean; sameExtras: ((id: string) => boolean) | null } | null = null;

  run(geometry: PlanGeometry, traced = false): TakedownResult {
    this.trace = traced ? emptyTakedownTrace() : null;
    const last = this.last;
    const reuse: TakedownReuse | undefined = last && !traced
      ? {
          previous: last.stage.takedown,
          unchanged: last.sameExtras ? (fm) => last.sameMember(fm) && last.sameExtras!(fm.id) : last.sameMember,
          reused: this.reused,
        }
      : undefined;
    return runTakedown(this.plan, {
      topology: geometry.topology,
      deckLoads: geometry.deckLoads,
      selfWeight: this.selfWeight,
      ...(this.trace ? { trace: this.trace } : {}),
      ...(reuse ? { reuse } : {}),
    });
  }
}

/** What one design pass leaves for the same pass of the next re-design: its takedown, each member's memo entry, design loads and extras. */
interface StagePass {
  takedown: TakedownResult;
  entries: Map<string, TableEntry>;
  loadsOf: Map<string, MemberLoad[]>;
  extrasOf: Map<string, MemberDesignExtras>;
}

/**
 * What a design leaves for the next re-design of the same plan to reuse: its final pass, with a
 * wet stage also the composite sites, both wet-stage takedowns and the first pass, and value
 * copies of what the takedowns read beyond the framing geometry and the placed loads (each
 * member, the design basis). Not kept with grouping (a forced size depends on other members).
 */
interface LastPass {
  geometry: PlanGeometryMemo;
  main: StagePass;
  wet: { sites: Map<string, MemberCompositeStatus>; wet1: TakedownResult; pass1: StagePass; wet2: TakedownResult; deckLoads: PreparedDeckLoads } | null;
  members: Map<string, Plan['members'][number]>;
  /** Copy of passRest(plan) when taken down. */
  rest: unknown;
}

/**
 * Deck loads prepared for an earlier wet plan of the same geometry and basis, pointed at this
 * wet plan's decks and zones (wetStagePlan keeps the plan's deck order and ids), so nothing
 * reads an earlier plan's objects. The strips and tributaries are values and stay shared.
 */
function reboundDeckLoads(prepared: PreparedDeckLoads, wetPlan: Plan): PreparedDeckLoads | null {
  const decks = new Map(wetPlan.decks.map((d) => [d.id, d]));
  const zones = new Map(wetPlan.zones.map((z) => [z.id, z]));
  if (decks.size !== wetPlan.decks.length) return null;
  const bound = prepared.decks.map((ctx) => {
    const deck = decks.get(ctx.deck.id);
    const zone = deck ? zones.get(deck.zone) : undefined;
    return deck && zone ? { deck, zone } : null;
  });
  if (bound.some((b) => b === null)) return null;
  prepared.decks.forEach((ctx, k) => {
    ctx.deck = bound[k]!.deck;
    ctx.zone = bound[k]!.zone;
  });
  return prepared;
}

const stageOf = (pass: DesignPass, takedown: TakedownResult): StagePass => ({ takedown, entries: pass.entries, loadsOf: pass.loadsOf, extrasOf: pass.extrasOf });

/** Whether a member's composite site is the same as before (its deck by id: deck values are part of the geometry memo's comparison). */
function sameSite(a: MemberCompositeStatus | undefined, b: MemberCompositeStatus | undefined): boolean {
  if (a === undefined || b === undefined) return a === b;
  if (!a.composite || !b.composite) return !a.composite && !b.composite && a.reason === b.reason;
  return a.site.deck.id === b.site.deck.id && a.site.orientation === b.site.orientation && Object.is(a.site.effectiveWidth_in, b.site.effectiveWidth_in) && a.site.basis === b.site.basis;
}

/** What a takedown reads of a plan beyond its framing geometry, its members and the loads placed on them (compared in the takedown). */
const passRest = (plan: Plan) => ({ designBasis: plan.designBasis });

/**
 * What buildSchemeResult reads of a takedown. From level templates, `members` holds each
 * member's template takedown (placeholder ids) and `renamers` the member's level, by which
 * the ids it reports are made real.
 */
type SchemeTakedown = Pick<TakedownResult, 'members' | 'columns' | 'equilibrium' | 'floorArea_ft2' | 'byLevelFloorArea_ft2' | 'problems'> & { placements?: Map<string, Placement> };

/**
 * Where a member designed from a level template came from: the template's design (`core`),
 * its placeholder id there (`pid`) and its level's renamer. Its result is the template member's
 * result, built once per template, with the ids it reports made real for the level.
 */
interface Placement {
  core: DesignCore;
  pid: string;
  at: LevelRenamer;
}

/** A plan's takedown with every member designed: what the scheme result is built from. */
interface DesignCore {
  takedown: TakedownResult;
  designs: Map<string, DesignEntry>;
  loadsOf: Map<string, MemberLoad[]>;
  extrasOf: Map<string, MemberDesignExtras>;
  sites: Map<string, MemberCompositeStatus> | null;
  /** The final takedown's trace (when traced). */
  trace: TakedownTrace | null;
  /** What a later re-design may reuse (no grouping, not traced), else null. */
  reusable: ReusableCore | null;
}

export function designScheme(plan: Plan, options: SchemeOptions = {}): SchemeResult {
  const memo = cacheOf(options.previous);
  // Read from this run's memo, then the previous one; keep only designs this run used.
  const table = new DesignTable();
  const previous = memo?.designs ?? null;
  const templates = options.typicalLevels === false ? null : typicalLevelTemplates(plan);
  if (templates) {
    const fromTemplates = designFromTemplates(plan, templates, options, table, previous, memo?.templates ?? null, memo?.placed ?? null);
    if (fromTemplates) return fromTemplates;
  }
  const geometry = planGeometry(plan, memo?.geometry ?? null);
  // The last pass is reused only on the same framing geometry and design basis (placed loads are compared in the takedown).
  const lastPass = memo?.last && memo.last.geometry === geometry && sameValue(passRest(plan), memo.last.rest) ? memo.last : null;
  const core = designCore(plan, geometry, options, table, previous, false, lastPass);
  const result = buildSchemeResult(plan, core.takedown, core.designs, core.loadsOf, core.extrasOf, core.sites, options.memberLoads !== false);
  const next: SchemeMemo = { designs: table, geometry, templates: null, last: core.reusable ? nextLastPass(plan, geometry, core.reusable, lastPass) : null, reusedMembers: core.reusable?.pass.reusedIds.size ?? 0 };
  Object.defineProperty(result, CACHE, { value: next, enumerable: false });
  return result;
}

/** The LastPass of a pass just run: copies made only of members worked out again, and of the rest if it changed. */
function nextLastPass(plan: Plan, geometry: PlanGeometryMemo, core: ReusableCore, before: LastPass | null): LastPass {
  const { pass, takedown } = core;
  const members = new Map<string, Plan['members'][number]>();
  for (const mt of takedown.members.values()) {
    // A member reused by the final pass was compared equal to its copy, which stays good.
    const kept = pass.reusedIds.has(mt.id) ? before?.members.get(mt.id) : undefined;
    members.set(mt.id, kept ?? copyValue(mt.member));
  }
  return { geometry, main: stageOf(pass, takedown), wet: core.wet, members, rest: before ? before.rest : copyValue(passRest(plan)) };
}

/** A design core's parts a later re-design may reuse (see LastPass). */
interface ReusableCore {
  pass: DesignPass;
  takedown: TakedownResult;
  wet: LastPass['wet'];
}

/** The takedown of a plan with each member sized as it is reached (wet stage and grouping included). */
function designCore(
  plan: Plan, geometry: PlanGeometry, options: SchemeOptions, table: DesignTable, previous: DesignTable | null, traced: boolean, last: LastPass | null = null,
): DesignCore {
  const forced = new Map<string, string>();
  // Composite plans (and the superimposed-dead total deflection setting) need the wet-concrete
  // stage: a takedown of the wet slab and construction live on the same framing. Its girders
  // carry the beams' self weight, so it is run with locked weights first, then again with the
  // sizes of the first design pass (beams' inputs do not change, so only girders re-design).
  let wet: WetStage | null = null;
  const wetPlan = planNeedsWetStage(plan) ? wetStagePlan(plan) : null;
  const reusable = !options.groupIdentical && !traced;
  // Reuse of the last run (LastPass): each member's own data is compared once with its copy.
  const reuseFrom = reusable && last && (wetPlan ? last.wet !== null : last.wet === null) ? last : null;
  // Same geometry, decks and basis (LastPass): a member's site is as before unless its own composite setting changed.
  // (A kept site names this plan's deck object, never the earlier plan's, which its owner may have edited since.)
  const decksById = reuseFrom?.wet ? new Map(plan.decks.map((d) => [d.id, d])) : null;
  const keptSite = reuseFrom?.wet
    ? (fm: FramingMember): MemberCompositeStatus | undefined => {
        const before = reuseFrom.members.get(fm.id);
        const site = before && sameValue(before.composite, fm.member.composite) ? reuseFrom.wet!.sites.get(fm.id) : undefined;
        if (!site || !site.composite) return site;
        const deck = decksById!.get(site.site.deck.id);
        return deck ? { composite: true, site: { ...site.site, deck } } : undefined;
      }
    : undefined;
  const sites = wetPlan ? compositeSites(plan, geometry.topology, keptSite) : null;
  const sameOwn = new Map<string, boolean>();
  const sameMember = (fm: FramingMember): boolean => {
    let same = sameOwn.get(fm.id);
    if (same === undefined) {
      const before = reuseFrom!.members.get(fm.id);
      sameOwn.set(fm.id, (same = before !== undefined && sameValue(fm.member, before)));
    }
    return same;
  };
  const sameSiteOf = (id: string) => sameSite(sites!.get(id), reuseFrom!.wet!.sites.get(id));
  // The wet plan's deck loads: a function of the geometry, decks, zones and basis, so as before
  // when reusing (pointed at this wet plan's deck and zone objects), else prepared once for both stages.
  const wetDeckLoads = wetPlan ? ((reuseFrom?.wet ? reboundDeckLoads(reuseFrom.wet.deckLoads, wetPlan) : null) ?? prepareDeckLoads(wetPlan, geometry.topology)) : null;
  const wetTakedown = (weight: (mt: MemberTakedown) => number, previousWet: TakedownResult | null, unchanged: (fm: FramingMember) => boolean, reusedIds: Set<string>) =>
    runTakedown(wetPlan!, {
      topology: geometry.topology,
      deckLoads: wetDeckLoads!,
      selfWeight: weight,
      ...(previousWet ? { reuse: { previous: previousWet, unchanged, reused: (mt: MemberTakedown) => void reusedIds.add(mt.id) } } : {}),
    });
  let wetParts: LastPass['wet'] = null;
  const wet1Reused = new Set<string>();
  if (wetPlan) wet = { sites: sites!, takedown: wetTakedown((mt) => lockedShapeWeightPlf(mt.member), reuseFrom?.wet?.wet1 ?? null, sameMember, wet1Reused) };
  let pass = new DesignPass(plan, table, previous, forced, wet);
  if (reuseFrom) pass.last = { stage: reuseFrom.wet ? reuseFrom.wet.pass1 : reuseFrom.main, sameMember, sameExtras: reuseFrom.wet ? (id) => wet1Reused.has(id) && sameSiteOf(id) : null };
  let takedown = pass.run(geometry, traced);
  if (wetPlan) {
    const first = pass.designs;
    const firstPass = pass;
    const wet1 = wet!.takedown;
    const wet2Reused = new Set<string>();
    // The second wet takedown carries the first pass's sizes: a member keeps its wet takedown
    // only if the first pass kept its design (so its weight) as well.
    wet = {
      sites: sites!,
      takedown: wetTakedown(
        (mt) => { const d = first.get(mt.id); return d && !('error' in d) ? d.weight_plf : lockedShapeWeightPlf(mt.member); },
        reuseFrom?.wet?.wet2 ?? null,
        (fm) => sameMember(fm) && firstPass.reusedIds.has(fm.id),
        wet2Reused,
      ),
    };
    pass = new DesignPass(plan, table, previous, forced, wet);
    if (reuseFrom) pass.last = { stage: reuseFrom.main, sameMember, sameExtras: (id) => wet2Reused.has(id) && sameSiteOf(id) };
    wetParts = { sites: sites!, wet1, pass1: stageOf(firstPass, takedown), wet2: wet.takedown, deckLoads: wetDeckLoads! };
    takedown = pass.run(geometry, traced);
  }

  if (options.groupIdentical) {
    // Fixed point: a group's size changes its members' self weight, hence their supporters' loads.
    for (let iteration = 0; iteration < 10; iteration++) {
      const designs = pass.designs;
      const groups = new Map<string, string[]>();
      for (const id of takedown.order) {
        const mt = takedown.members.get(id)!;
        if (mt.member.shape) continue;
        const key = groupKey(mt);
        const g = groups.get(key);
        if (g) g.push(id);
        else groups.set(key, [id]);
      }
      const nextForced = new Map<string, string>();
      for (const ids of groups.values()) {
        if (ids.length < 2) continue;
        let heaviest: MemberDesignResult | null = null;
        for (const id of ids) {
          const d = designs.get(id);
          if (!d || 'error' in d || !d.passes) continue;
          if (!heaviest || d.weight_plf > heaviest.weight_plf) heaviest = d;
        }
        if (heaviest) for (const id of ids) nextForced.set(id, heaviest.shape);
      }
      // Members that fail with the group shape keep their own selection.
      for (const [id, shape] of nextForced) {
        const d = designs.get(id);
        if (forced.get(id) === shape && d && !('error' in d) && !d.passes) nextForced.delete(id);
      }
      const same = nextForced.size === forced.size && [...nextForced].every(([k, v]) => forced.get(k) === v);
      if (same) break;
      forced.clear();
      nextForced.forEach((v, k) => forced.set(k, v));
      pass = new DesignPass(plan, table, previous, forced, wet);
      takedown = pass.run(geometry, traced);
    }
  }
  return { takedown, designs: pass.designs, loadsOf: pass.loadsOf, extrasOf: pass.extrasOf, sites, trace: pass.trace, reusable: reusable ? { pass, takedown, wet: wetParts } : null };
}

/**
 * The scheme designed level template by level template (typical-levels.scheme), each
 * template's takedown and designs placed on its levels under their ids, and the whole-plan
 * sums made again in the whole plan's order (as runTakedown makes them): the same result as
 * designing the plan at once. Null where a template has a problem (the plan is then designed
 * at once, so every problem is reported as it always is).
 */
function designFromTemplates(
  plan: Plan, templates: LevelTemplate[], options: SchemeOptions, table: DesignTable, previous: DesignTable | null, previousGeometry: Map<string, PlanGeometryMemo> | null,
  previousPlaced: PlacedMemo | null,
): SchemeResult | null {
  const wetWhole = planNeedsWetStage(plan);
  for (const t of templates) if (planNeedsWetStage(t.plan) !== wetWhole) return null;
  const geometries = new Map<string, PlanGeometryMemo>();
  const cores: DesignCore[] = [];
  for (const t of templates) {
    const geometry = planGeometry(t.plan, previousGeometry?.get(t.signature) ?? null);
    const core = designCore(t.plan, geometry, options, table, previous, true);
    if (core.takedown.problems.length > 0 || !core.trace) return null;
    geometries.set(t.signature, geometry);
    cores.push(core);
  }
  const planMember = new Map(plan.members.map((m) => [m.id, m]));
  const pointIndex = new Map(plan.pointLoads.map((l, i) => [l.id!, i]));
  const lineIndex = new Map(plan.lineLoads.map((l, i) => [l.id!, i]));
  const deckIndex = new Map(plan.decks.map((d, i) => [d.id, i]));
  const members = new Map<string, MemberTakedown>();
  const placements = new Map<string, Placement>();
  const designs = new Map<string, DesignEntry>();
  // The whole plan's leaves (members that carry none), and per template what each member readies (orderBySupport).
  const leaves: string[] = [];
  const readiedBy = new Map<DesignCore, Map<string, string[]>>();
  const pointReceipts = new Map<number, ColumnReceipt[]>();
  const memberReceipts = new Map<string, ColumnReceipt[]>();
  const pointApplied = new Map<number, { case: LoadCase; kip: number }[]>();
  const lineApplied = new Map<number, { case: LoadCase; kip: number }[]>();
  const deckEntries: { index: number; ctx: DeckContext; level: string }[] = [];

  templates.forEach((t, k) => {
    const core = cores[k];
    const trace = core.trace!;
    const geometry = geometries.get(t.signature)!;
    const readied = new Map<string, string[]>();
    orderBySupport(geometry.topology.members, readied);
    readiedBy.set(core, readied);
    const templateLeaves: string[] = [];
    for (const fm of geometry.topology.members.values()) if (fm.carries.length === 0) templateLeaves.push(fm.id);
    for (const level of t.levels) {
      const at = new LevelRenamer(level);
      for (const [pid, mt] of core.takedown.members) {
        const id = at.text(pid);
        // The template's takedown stands for this member; its ids are made real where reported (buildSchemeResult).
        members.set(id, mt);
        placements.set(id, { core, pid, at });
        const entry = core.designs.get(pid);
        if (entry) designs.set(id, 'error' in entry ? at.data(entry) : entry);
      }
      for (const pid of templateLeaves) leaves.push(at.text(pid));
      trace.receipts.forEach((r, i) => {
        const from = trace.receiptFrom[i];
        const receipt: ColumnReceipt = { ...r, level: level.levelId, source: at.text(r.source) };
        if (typeof from === 'number') {
          const gi = pointIndex.get(at.text(t.plan.pointLoads[from].id!))!;
          let list = pointReceipts.get(gi);
          if (!list) pointReceipts.set(gi, (list = []));
          list.push(receipt);
        } else {
          const id = at.text(from);
          let list = memberReceipts.get(id);
          if (!list) memberReceipts.set(id, (list = []));
          list.push(receipt);
        }
      });
      for (const [log, into, index, loads] of [
        [trace.pointApplied, pointApplied, pointIndex, t.plan.pointLoads],
        [trace.lineApplied, lineApplied, lineIndex, t.plan.lineLoads],
      ] as const) {
        for (const e of log) {
          const gi = index.get(at.text(loads[e.index].id!))!;
          let list = into.get(gi);
          if (!list) into.set(gi, (list = []));
          list.push({ case: e.case, kip: e.kip });
        }
      }
      for (const ctx of geometry.deckLoads.decks) deckEntries.push({ index: deckIndex.get(at.text(ctx.deck.id))!, ctx, level: level.levelId });
    }
  });
  // The whole plan's order of takedown, as orderBySupport gives it for the whole plan's framing:
  // every leaf in id order, then each member queues the supporters it readies. Levels never
  // bear on each other and placeholders order as the real ids do, so within a level the same
  // members are processed in the same relative order as in its template, and each member
  // readies the same supporters as its template member (the template's trace, renamed).
  const order = leaves.sort();
  for (let i = 0; i < order.length; i++) {
    const p = placements.get(order[i])!;
    const next = readiedBy.get(p.core)!.get(p.pid);
    if (next) for (const pid of next) order.push(p.at.text(pid));
  }
  if (order.length !== members.size) return null;
  deckEntries.sort((a, b) => a.index - b.index);
  const deckApplied = deckAppliedLoads(deckEntries.map((e) => e.ctx), (_, k) => deckEntries[k].level);
  const sumInFileOrder = (logs: Map<number, { case: LoadCase; kip: number }[]>) => {
    const totals = zeroCaseTotals();
    for (const gi of [...logs.keys()].sort((a, b) => a - b)) for (const e of logs.get(gi)!) totals[e.case] += e.kip;
    return totals;
  };
  const points = sumInFileOrder(pointApplied);
  const lines = sumInFileOrder(lineApplied);
  const applied = zeroCaseTotals();
  for (const c of LOAD_CASES) applied[c] = deckApplied.applied[c] + points[c] + lines[c];
  const receipts: ColumnReceipt[] = [];
  for (const gi of [...pointReceipts.keys()].sort((a, b) => a - b)) receipts.push(...pointReceipts.get(gi)!);
  for (const id of order) {
    const mt = members.get(id)!;
    applied.D += (mt.selfWeight_plf / 1000) * mt.span_ft;
    const mine = memberReceipts.get(id);
    if (mine) receipts.push(...mine);
  }
  const takedown: SchemeTakedown = {
    members,
    placements,
    columns: stackColumns(plan, receipts, plan.designBasis.liveLoadReduction),
    equilibrium: equilibriumOf(applied, receipts),
    floorArea_ft2: deckApplied.total,
    byLevelFloorArea_ft2: deckApplied.byLevel,
    problems: [],
  };
  const reuse: PlacedReuse = { before: previousPlaced, signatureOf: new Map(templates.map((t, k) => [cores[k], t.signature])), next: null };
  const result = buildSchemeResult(plan, takedown, designs, new Map(), new Map(), wetWhole ? new Map() : null, options.memberLoads !== false, marksFromTemplates(plan, templates, cores), reuse);
  const next: SchemeMemo = { designs: table, geometry: null, templates: geometries, last: null, reusedMembers: 0, placed: reuse.next ?? undefined };
  Object.defineProperty(result, CACHE, { value: next, enumerable: false });
  return result;
}

/** A reaction as the scheme reports it: live reduced by the member's own factor. */
function schemeReactionEnd(r: EndReaction, factor: number): SchemeReactionEnd {
  return {
    D_kip: r.D_kip,
    L_kip: reducedLiveKip(r, factor),
    Lr_kip: r.Lr_kip,
    S_kip: r.S_kip,
    Lunreduced_kip: r.L_kip,
    supportedBy: r.supportedBy,
  };
}

/** The loads reported for a member: its design loads, then its self weight. */
function reportedLoads(mt: MemberTakedown, designed: MemberLoad[] | undefined): MemberLoad[] {
  const out = designed ? designed.slice() : designLoads(mt);
  for (const l of mt.loads) {
    if (!isSelfWeight(l)) continue;
    if (l.reducible === undefined) out.push(l as MemberLoad);
    else {
      const { reducible: _r, ...rest } = l;
      out.push(rest as MemberLoad);
    }
  }
  return out;
}

/** A member's result from its takedown and design (ids as the takedown wrote them). */
function schemeMember(
  m: Plan['members'][number], mt: MemberTakedown, design: MemberDesignResult | null, mark: string, errored: boolean,
  designed: MemberLoad[] | undefined, extras: MemberDesignExtras | undefined, status: MemberCompositeStatus | undefined, composite: boolean, withLoads: boolean,
): SchemeMember {
  const member: SchemeMember = {
    id: m.id,
    mark,
    kind: m.kind,
    level: m.level,
    shape: design ? design.shape : m.shape,
    span_ft: mt.span_ft,
    passes: design ? design.passes && !errored : false,
    governing: design ? design.governing : null,
    ratio: design ? design.ratio : null,
    tributaryWidth_ft: mt.tributaryWidth_ft,
    tributaryArea_ft2: mt.tributaryArea_ft2,
    reducibleArea_ft2: mt.reducibleArea_ft2,
    KLL: mt.KLL,
    liveReductionFactor: mt.liveReductionFactor,
    Lb_ft: design ? design.Lb_ft : null,
    Cb: design ? design.Cb : null,
    Mr_kipft: design ? design.Mr_kipft : null,
    Mc_kipft: design ? design.Mc_kipft : null,
    weight_plf: mt.selfWeight_plf,
    reactions: { start: schemeReactionEnd(mt.reactions.start, mt.liveReductionFactor), end: schemeReactionEnd(mt.reactions.end, mt.liveReductionFactor) },
    loads: withLoads ? reportedLoads(mt, designed) : [],
    bracing: mt.bracing,
    connections: 2 + mt.framingPoints_ft.length,
    design,
  };
  if (composite) {
    member.studs = design?.composite ? design.composite.studs : null;
    member.camber_in = design?.composite ? design.composite.camber_in : null;
    member.percentComposite = design?.composite ? design.composite.percentComposite : null;
    member.compositeNote = status && !status.composite ? status.reason : null;
    member.designExtras = extras ?? null;
  }
  return member;
}

/** A reaction end on a level: shared unless it names a member of the level. */
function placedEnd(r: SchemeReactionEnd, at: LevelRenamer): SchemeReactionEnd {
  if (r.supportedBy === null) return r;
  const supportedBy = at.text(r.supportedBy);
  return supportedBy === r.supportedBy ? r : { ...r, supportedBy };
}

/**
 * A template member's result placed on a level: the same result (parts without ids shared),
 * with the member's own id, mark and level and every id it reports made real.
 */
function placedMember(base: SchemeMember, m: Plan['members'][number], mark: string, errored: boolean, at: LevelRenamer, withLoads: boolean): SchemeMember {
  // Written out field by field in schemeMember's order (a spread of 30 fields was most of the
  // placement's time); the typical-level tests compare the text with a design made level by level.
  const member: SchemeMember = {
    id: m.id,
    mark,
    kind: base.kind,
    level: m.level,
    shape: base.shape,
    span_ft: base.span_ft,
    passes: base.passes && !errored,
    governing: base.governing,
    ratio: base.ratio,
    tributaryWidth_ft: base.tributaryWidth_ft,
    tributaryArea_ft2: base.tributaryArea_ft2,
    reducibleArea_ft2: base.reducibleArea_ft2,
    KLL: base.KLL,
    liveReductionFactor: base.liveReductionFactor,
    Lb_ft: base.Lb_ft,
    Cb: base.Cb,
    Mr_kipft: base.Mr_kipft,
    Mc_kipft: base.Mc_kipft,
    weight_plf: base.weight_plf,
    reactions: { start: placedEnd(base.reactions.start, at), end: placedEnd(base.reactions.end, at) },
    loads: withLoads ? at.loads(base.loads) : [],
    bracing: base.bracing,
    connections: base.connections,
    design: base.design,
  };
  if ('studs' in base) {
    member.studs = base.studs;
    member.camber_in = base.camber_in;
    member.percentComposite = base.percentComposite;
    member.compositeNote = base.compositeNote ? at.text(base.compositeNote) : (base.compositeNote ?? null);
    member.designExtras = base.designExtras ? at.data(base.designExtras) : (base.designExtras ?? null);
  }
  return member;
}

/** What assignMarks reads of each member: kind, size, span, midpoint, marks it carries, studs and camber. */
function markInputsOf(members: readonly Plan['members'][number][], designs: Map<string, DesignEntry>, takedowns: Map<string, MemberTakedown>): MarkInput[] {
  return members.map((m) => {
    const d = designs.get(m.id);
    return {
      id: m.id,
      level: m.level,
      kind: m.kind,
      shape: d && !('error' in d) ? d.shape : m.shape,
      span_ft: takedowns.get(m.id)!.span_ft,
      midpoint: [(m.start[0] + m.end[0]) / 2, (m.start[1] + m.end[1]) / 2] as const,
      lockedMark: m.markLocked && m.mark ? m.mark : null,
      issuedMark: m.markLocked ? null : (m.mark ?? null),
      studs: d && !('error' in d) && d.composite ? d.composite.studs : null,
      camber_in: d && !('error' in d) && d.composite ? d.composite.camber_in : null,
    };
  });
}

/**
 * Marks of a plan designed from level templates, worked out once per template. assignMarks
 * numbers each mark prefix on its own, in plan order, and only issued or locked marks reach
 * across levels; so where no member carries a mark and no two levels share a prefix, a level's
 * marks are its template's marks under the level's prefix (placeholders order as the real
 * ids do, so plan order ties break alike). Null otherwise (the whole plan is marked at once).
 */
function marksFromTemplates(plan: Plan, templates: LevelTemplate[], cores: DesignCore[]): Map<string, string> | null {
  for (const m of plan.members) if (m.mark) return null;
  const prefixes = new Map(plan.levels.map((l) => [l.id, levelMarkPrefix(l)]));
  if (new Set(prefixes.values()).size !== plan.levels.length) return null;
  const marks = new Map<string, string>();
  templates.forEach((t, k) => {
    const core = cores[k];
    const first = plan.levels.find((l) => l.id === t.levels[0].levelId)!;
    const templateLevel = t.plan.levels[0];
    const inputs = markInputsOf(t.plan.members.filter((m) => core.takedown.members.has(m.id)), core.designs, core.takedown.members);
    const named = { id: templateLevel.id, name: first.name, roof: first.roof };
    const own = assignMarks(inputs, [named]);
    // (Numbering never reads the prefix's text; a name without a number falls back to the id, here a placeholder.)
    const templatePrefix = levelMarkPrefix(named);
    for (const level of t.levels) {
      const at = new LevelRenamer(level);
      const prefix = prefixes.get(level.levelId)!;
      for (const [pid, mark] of own) marks.set(at.text(pid), prefix + mark.slice(templatePrefix.length));
    }
  });
  return marks;
}

function buildSchemeResult(
  plan: Plan, takedown: SchemeTakedown, designs: Map<string, DesignEntry>, loadsOf: Map<string, MemberLoad[]>,
  extrasOf: Map<string, MemberDesignExtras> = new Map(), sites: Map<string, MemberCompositeStatus> | null = null, withLoads = true,
  presetMarks: Map<string, string> | null = null, reuse: PlacedReuse | null = null,
): SchemeResult {
  const problems: PlanProblem[] = [...takedown.problems];
  const fileOrder = plan.members.filter((m) => takedown.members.has(m.id));
  const markInputs: MarkInput[] = presetMarks ? [] : markInputsOf(fileOrder, designs, takedown.members);
  const marks = presetMarks ?? assignMarks(markInputs, plan.levels);
  // A locked mark carried by members that no longer match (a load or span changed since it was
  // set) is said, never silent: one mark is one fabricated piece.
  const levelName = new Map(plan.levels.map((l) => [l.id, l.name]));
  // assignMarks gives each design its own mark, so only a locked mark can be carried by members
  // of different designs (tests/unit/plan/member-marks.test.ts holds that as a property).
  const anyLocked = markInputs.some((m) => !!m.lockedMark);
  for (const c of anyLocked ? sharedMarkConflicts(markInputs, marks) : []) {
    const designsText = c.designs
      .map((d) => `${d.shape ?? 'not sized'} spanning ${d.span_ft.toFixed(2)} ft${d.studs !== null ? ` with ${d.studs} studs` : ''}${d.camber_in ? `, camber ${d.camber_in} in` : ''}`)
      .join(', ');
    problems.push(
      planProblem('warning', 'mark-shared-by-different-designs', `Mark ${c.mark} on ${levelName.get(c.level) ?? c.level} is carried by ${c.memberIds.length} members of different designs (${designsText}); give one of them another mark.`, { elementId: c.memberIds[0] }),
    );
  }

  // A member with an error against it (e.g. an end that lands on nothing) never reads as passing,
  // whatever its sizing said: the sizing assumed supports the framing does not have.
  const erroredIds = new Set<string>();
  for (const p of takedown.problems) if (p.severity === 'error' && p.elementId) erroredIds.add(p.elementId);

  // A template member's result, built once for all the levels it is placed on.
  const templateMembers = new Map<DesignCore, Map<string, SchemeMember>>();
  const templateMember = (p: Placement, m: Plan['members'][number]): SchemeMember => {
    let built = templateMembers.get(p.core);
    if (!built) templateMembers.set(p.core, (built = new Map()));
    let base = built.get(p.pid);
    if (!base) {
      const { core, pid } = p;
      const entry = core.designs.get(pid);
      base = schemeMember(m, core.takedown.members.get(pid)!, entry && !('error' in entry) ? entry : null, '', false, core.loadsOf.get(pid), core.extrasOf.get(pid), sites ? core.sites?.get(pid) : undefined, sites !== null, withLoads);
      if (placed) {
        const signature = reuse!.signatureOf.get(core)!;
        const earlier = before?.bases.get(signature)?.get(pid);
        if (earlier && sameValueInOrder(base, earlier, seen)) base = earlier;
        let bases = placed.bases.get(signature);
        if (!bases) placed.bases.set(signature, (bases = new Map()));
        bases.set(pid, base);
      }
      built.set(pid, base);
    }
    return base;
  };
  // Placed members of the previous run from templates, and this run's for the next (PlacedMemo).
  const before = reuse?.before && reuse.before.withLoads === withLoads ? reuse.before : null;
  const placed: PlacedMemo | null = reuse ? { withLoads, bases: new Map(), members: [], baseAt: [], levelIds: new Map() } : null;
  if (reuse) reuse.next = placed;
  const seen = new WeakMap<object, object>();
  const sameRenaming = new Map<LevelRenamer['level'], boolean>();
  const renamedAsBefore = (level: LevelRenamer['level']): boolean => {
    let same = sameRenaming.get(level);
    if (same === undefined) {
      const ids = before?.levelIds.get(level.levelId);
      same = ids !== undefined && ids.length === level.ids.length && ids.every((id, i) => id === level.ids[i]);
      sameRenaming.set(level, same);
      placed!.levelIds.set(level.levelId, level.ids);
    }
    return same;
  };
  /** The member at `index` of the file-order list (an earlier list's member there is kept only if its id is the same). */
  const placedResult = (p: Placement, m: Plan['members'][number], index: number, mark: string, errored: boolean): SchemeMember => {
    const base = templateMember(p, m);
    if (placed) {
      placed.baseAt[index] = base;
      const renamed = renamedAsBefore(p.at.level); // (also notes the level's renaming for the next run)
      const was = renamed && before!.baseAt[index] === base ? before!.members[index] : undefined;
      if (was && was.id === m.id && was.mark === mark && was.level === m.level && was.passes === (base.passes && !errored)) return was;
    }
    return placedMember(base, m, mark, errored, p.at, withLoads);
  };

  const members: SchemeMember[] = fileOrder.map((m, index) => {
    const entry = designs.get(m.id);
    const design = entry && !('error' in entry) ? entry : null;
    if (entry && 'error' in entry) {
      problems.push(planProblem('error', 'member-not-designed', `Member ${m.id}: could not be designed — ${entry.error.join('; ')}`, { elementId: m.id }));
    } else if (design && !design.passes) {
      problems.push(planProblem('error', 'member-fails', `Member ${m.id}: ${design.failure ?? 'does not pass'}`, { elementId: m.id }));
    }
    const mark = marks.get(m.id) ?? '';
    const errored = erroredIds.has(m.id);
    const placement = takedown.placements?.get(m.id);
    if (placement) return placedResult(placement, m, index, mark, errored);
    return schemeMember(m, takedown.members.get(m.id)!, design, mark, errored, loadsOf.get(m.id), extrasOf.get(m.id), sites?.get(m.id), sites !== null, withLoads);
  });
  if (placed) placed.members = members.slice(); // its own list: a caller may reorder the result's

  // One pass; each sum sees its members in file order, as summing each filtered list would.
  let steelWeight_lb = 0;
  let girderWeight_lb = 0, girderPieces = 0, beamWeight_lb = 0, beamPieces = 0;
  const levelSums = new Map<string, { steelWeight_lb: number; pieces: number }>();
  for (const l of plan.levels) levelSums.set(l.id, { steelWeight_lb: 0, pieces: 0 });
  for (const s of members) {
    const w = s.weight_plf * s.span_ft;
    steelWeight_lb += w;
    const ls = levelSums.get(s.level);
    if (ls) {
      ls.steelWeight_lb += w;
      ls.pieces++;
    }
    if (s.kind === 'girder') {
      girderWeight_lb += w;
      girderPieces++;
    } else if (s.kind === 'beam') {
      beamWeight_lb += w;
      beamPieces++;
    }
  }
  const floorArea_ft2 = takedown.floorArea_ft2;
  const col = schemeColumns(plan, takedown.columns);
  problems.push(...col.problems);
  const byLevel = plan.levels.map((l) => {
    const ls = levelSums.get(l.id)!;
    const cl = col.totals.byLevel.get(l.id);
    return { level: l.id, steelWeight_lb: ls.steelWeight_lb, pieces: ls.pieces, floorArea_ft2: takedown.byLevelFloorArea_ft2.get(l.id) ?? 0, columnWeight_lb: cl?.weight_lb ?? 0, columnPieces: cl?.pieces ?? 0 };
  });
  const byKind = [
    { kind: 'girder' as const, steelWeight_lb: girderWeight_lb, pieces: girderPieces },
    { kind: 'beam' as const, steelWeight_lb: beamWeight_lb, pieces: beamPieces },
  ];

  return {
    name: plan.name,
    method: plan.designBasis.method,
    members,
    columns: col.columns,
    totals: {
      steelWeight_lb,
      columnWeight_lb: col.totals.columnWeight_lb,
      columnPieces: col.totals.columnPieces,
      floorArea_ft2,
      steel_psf: floorArea_ft2 > 0 ? steelWeight_lb / floorArea_ft2 : 0,
      pieces: members.length,
      connections: members.length * 2,
      byLevel,
      byKind,
    },
    equilibrium: takedown.equilibrium,
    problems,
    caution: SCHEME_CAUTION,
  };
}
