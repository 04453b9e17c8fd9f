/**
 * Member schedule rows from a scheme design (designScheme / `calc plan` output) and the plan
 * it was computed from: one row per member, in level order then mark order. Pure.
 *
 * End reactions are the design's unfactored per-case values (L is the live load the member
 * passes on after its own reduction, D includes self weight). The factored reaction is the
 * largest over the ASCE 7-16 §2.3.1 (LRFD) or §2.4.1 (ASD) gravity combinations of the cases
 * present at that end — with floor loads only that is 1.2D+1.6L (LRFD) or D+L (ASD); roof
 * live or snow add their combinations so a roof reaction is never understated.
 */
import { sharedLoadCombinations, type LoadCase } from '../engine/index';
import type { SchemeMember, SchemeResult } from '../engine/index';
import type { Plan } from '../schemas/plan.schema';
import { gridLocation } from './grid-location.drafting';

export type DesignMethod = 'LRFD' | 'ASD';

export interface ScheduleReactionEnd {
  D_kip: number;
  L_kip: number;
  Lr_kip: number;
  S_kip: number;
  /** Largest factored (LRFD) or service (ASD) combination of the cases at this end. */
  factored_kip: number;
  /** Name of that combination, e.g. "1.2D+1.6L". */
  combination: string;
  supportedBy: string | null;
}

export interface ScheduleRow {
  memberId: string;
  level: string;
  levelName: string;
  /** Position of the level in the plan, for sorting (levels are listed bottom to top or as drawn). */
  levelOrder: number;
  kind: 'girder' | 'beam';
  mark: string;
  /** Designed (or locked) shape, null when the member could not be designed. */
  size: string | null;
  /** Members on the same level with the same mark. */
  count: number;
  span_ft: number;
  /** "B–C / 2", or null when the plan has no grids. */
  gridLocation: string | null;
  start: ScheduleReactionEnd;
  end: ScheduleReactionEnd;
  governing: string | null;
  ratio: number | null;
  passes: boolean;
  weight_plf: number;
  /** Studs and camber of a composite design (null on a bare-steel member). */
  camber_in: number | null;
  studs: number | null;
}

export interface ScheduleBasis {
  method: DesignMethod;
  /** What the factored column means, e.g. "LRFD: largest of ASCE 7-16 §2.3.1 gravity combinations (1.2D+1.6L for floors)". */
  factoredNote: string;
  /** The combination that governs floor members: "1.2D+1.6L" (LRFD) or "D+L" (ASD). */
  floorCombination: string;
}

export function scheduleBasis(method: DesignMethod): ScheduleBasis {
  return method === 'LRFD'
    ? {
        method,
        floorCombination: '1.2D+1.6L',
        factoredNote: 'LRFD factored: 1.2D+1.6L for floors; roof live and snow per ASCE 7-16 §2.3.1, largest governs',
      }
    : {
        method,
        floorCombination: 'D+L',
        factoredNote: 'ASD service: D+L for floors; roof live and snow per ASCE 7-16 §2.4.1, largest governs',
      };
}

/** The largest combination of one end's unfactored reactions (all gravity cases ≥ 0). */
export function factoredReaction(
  method: DesignMethod,
  r: Pick<ScheduleReactionEnd, 'D_kip' | 'L_kip' | 'Lr_kip' | 'S_kip'>,
): { factored_kip: number; combination: string } {
  const values: Record<LoadCase, number> = { D: r.D_kip, L: r.L_kip, Lr: r.Lr_kip, S: r.S_kip };
  const present = (Object.keys(values) as LoadCase[]).filter((c) => values[c] !== 0);
  if (present.length === 0) return { factored_kip: 0, combination: method === 'LRFD' ? '1.2D+1.6L' : 'D+L' };
  let best = { factored_kip: -Infinity, combination: '' };
  for (const combo of sharedLoadCombinations(method, present)) {
    const total = combo.factors.D * values.D + combo.factors.L * values.L + combo.factors.Lr * values.Lr + combo.factors.S * values.S;
    if (total > best.factored_kip) best = { factored_kip: total, combination: combo.name };
  }
  return best;
}

function reactionEnd(method: DesignMethod, r: SchemeMember['reactions']['start']): ScheduleReactionEnd {
  const base = { D_kip: r.D_kip, L_kip: r.L_kip, Lr_kip: r.Lr_kip ?? 0, S_kip: r.S_kip ?? 0 };
  return { ...base, ...factoredReaction(method, base), supportedBy: r.supportedBy ?? null };
}

// One collator for every comparison: `localeCompare` with options builds a new one per call,
// which made sorting a few hundred marks take tens of milliseconds. Same order (ECMA-402:
// localeCompare(b, locales, options) compares as new Intl.Collator(locales, options).compare).
const MARK_COLLATOR = new Intl.Collator('en', { numeric: true, sensitivity: 'base' });

/** "2G10" after "2G9": marks compare by prefix, then number. */
export function compareMarks(a: string, b: string): number {
  return MARK_COLLATOR.compare(a, b);
}

export function scheduleRows(design: Pick<SchemeResult, 'members' | 'method'>, plan: Pick<Plan, 'levels' | 'members' | 'grids'>): ScheduleRow[] {
  const method: DesignMethod = design.method === 'ASD' ? 'ASD' : 'LRFD';
  const levelIndex = new Map(plan.levels.map((l, i) => [l.id, i]));
  const levelName = new Map(plan.levels.map((l) => [l.id, l.name]));
  const planMember = new Map(plan.members.map((m) => [m.id, m]));
  const counts = new Map<string, number>();
  for (const m of design.members) {
    const key = `${m.level}\u0000${m.mark}`;
    counts.set(key, (counts.get(key) ?? 0) + 1);
  }
  const rows = design.members.map((m): ScheduleRow => {
    const pm = planMember.get(m.id);
    return {
      memberId: m.id,
      level: m.level,
      levelName: levelName.get(m.level) ?? m.level,
      levelOrder: levelIndex.get(m.level) ?? plan.levels.length,
      kind: m.kind,
      mark: m.mark,
      size: m.shape ?? null,
      count: counts.get(`${m.level}\u0000${m.mark}`) ?? 1,
      span_ft: m.span_ft,
      gridLocation: pm ? gridLocation(pm.start, pm.end, plan.grids) : null,
      start: reactionEnd(method, m.reactions.start),
      end: reactionEnd(method, m.reactions.end),
      governing: m.governing ?? null,
      ratio: m.ratio ?? null,
      passes: Boolean(m.passes),
      weight_plf: m.weight_plf,
      camber_in: m.camber_in ?? null,
      studs: m.studs ?? null,
    };
  });
  return rows.sort(
    (a, b) => a.levelOrder - b.levelOrder || compareMarks(a.mark, b.mark) || (a.memberId < b.memberId ? -1 : a.memberId > b.memberId ? 1 : 0),
  );
}

/** One row per piece mark: the members of a level carrying one mark with one size and span. */
export interface ScheduleMarkRow {
  /** Unique per row: level, mark and (when a mark is split) size and span. */
  key: string;
  level: string;
  levelName: string;
  levelOrder: number;
  kind: 'girder' | 'beam';
  mark: string;
  size: string | null;
  /** How many members carry this mark with this size and span. */
  quantity: number;
  span_ft: number;
  /** Grid locations of the members, in schedule order, without repeats. */
  gridLocations: string[];
  memberIds: string[];
  /**
   * Reaction envelope: the largest of each case over both ends of every member of the row, and
   * the largest combined reaction with its combination. Conservative for every connection of
   * the piece (ends drawn either way round share one envelope); said as such on screen.
   */
  reaction: Omit<ScheduleReactionEnd, 'supportedBy'>;
  /** True when the ends' reactions differ, so the envelope is larger than some of them. */
  enveloped: boolean;
  governing: string | null;
  /** Largest ratio of the row's members. */
  ratio: number | null;
  passes: boolean;
  weight_plf: number;
  camber_in: number | null;
  studs: number | null;
  /** True when this mark is carried by members of another size, span, camber or stud count too (one row each). */
  split: boolean;
}

const spanKey = (span_ft: number) => span_ft.toFixed(2);
const maxOrNull = (values: (number | null)[]) => {
  const real = values.filter((v): v is number => v !== null && Number.isFinite(v));
  return real.length ? Math.max(...real) : null;
};

/** The schedule grouped by mark: one row per (level, mark, size, span), in schedule order. */
export function scheduleMarkRows(rows: readonly ScheduleRow[]): ScheduleMarkRow[] {
  const groups = new Map<string, ScheduleRow[]>();
  const designsOfMark = new Map<string, Set<string>>();
  for (const r of rows) {
    const markKey = `${r.level}\u0000${r.mark}`;
    // Camber and studs split a mark too: one row states one piece.
    const key = `${markKey}\u0000${r.size ?? ''}\u0000${spanKey(r.span_ft)}\u0000${r.camber_in ?? ''}\u0000${r.studs ?? ''}`;
    const list = groups.get(key);
    if (list) list.push(r);
    else groups.set(key, [r]);
    let designs = designsOfMark.get(markKey);
    if (!designs) designsOfMark.set(markKey, (designs = new Set()));
    designs.add(key);
  }
  const out: ScheduleMarkRow[] = [];
  for (const [key, list] of groups) {
    const first = list[0];
    const ends = list.flatMap((r) => [r.start, r.end]);
    const top = ends.reduce((a, b) => (b.factored_kip > a.factored_kip ? b : a));
    const reaction = {
      D_kip: Math.max(...ends.map((e) => e.D_kip)),
      L_kip: Math.max(...ends.map((e) => e.L_kip)),
      Lr_kip: Math.max(...ends.map((e) => e.Lr_kip)),
      S_kip: Math.max(...ends.map((e) => e.S_kip)),
      factored_kip: top.factored_kip,
      combination: top.combination,
    };
    const enveloped = ends.some((e) => e.D_kip !== reaction.D_kip || e.L_kip !== reaction.L_kip || e.Lr_kip !== reaction.Lr_kip || e.S_kip !== reaction.S_kip || e.factored_kip !== reaction.factored_kip);
    const worst = list.reduce((a, b) => ((b.ratio ?? -1) > (a.ratio ?? -1) ? b : a));
    out.push({
      key,
      level: first.level,
      levelName: first.levelName,
      levelOrder: first.levelOrder,
      kind: first.kind,
      mark: first.mark,
      size: first.size,
      quantity: list.length,
      span_ft: Math.max(...list.map((r) => r.span_ft)),
      gridLocations: [...new Set(list.map((r) => r.gridLocation).filter((g): g is string => !!g))],
      memberIds: list.map((r) => r.memberId),
      reaction,
      enveloped,
      governing: worst.governing,
      ratio: maxOrNull(list.map((r) => r.ratio)),
      passes: list.every((r) => r.passes),
      weight_plf: first.weight_plf,
      camber_in: first.camber_in,
      studs: first.studs,
      split: designsOfMark.get(`${first.level}\u0000${first.mark}`)!.size > 1,
    });
  }
  return out;
}
