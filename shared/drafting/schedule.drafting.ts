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
import { loadCombinations, type LoadCase } from '../engine/index';
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
  /** Composite design is not in Baywright yet: always null until it is. */
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
  for (const combo of loadCombinations(method, present)) {
    const total = combo.factors.D * values.D + combo.factors.L * values.L + combo.factors.Lr * values.Lr + combo.factors.S * values.S;
    if (total > best.factored_kip) best = { factored_kip: total, combination: combo.name };
  }
  return best;
}

function reactionEnd(method: DesignMethod, r: SchemeMember['reactions']['start']): ScheduleReactionEnd {
  const base = { D_kip: r.D_kip, L_kip: r.L_kip, Lr_kip: r.Lr_kip ?? 0, S_kip: r.S_kip ?? 0 };
  return { ...base, ...factoredReaction(method, base), supportedBy: r.supportedBy ?? null };
}

/** "2G10" after "2G9": marks compare by prefix, then number. */
export function compareMarks(a: string, b: string): number {
  return a.localeCompare(b, 'en', { numeric: true, sensitivity: 'base' });
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
