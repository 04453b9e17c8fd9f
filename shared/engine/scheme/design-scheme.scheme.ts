/**
 * Whole-scheme design (`calc plan`, calc-interface.md): takedown in topological order with
 * each member sized as it is reached, so its reactions carry its own self weight before its
 * supporter is designed (the whole-plan iteration; with grouping, repeated to a fixed point).
 *
 * Re-design after an edit: pass `previous` (the last result of this function, in memory).
 * Designs are reused wherever a member's design input is unchanged, so only the changed
 * members and what their change reaches (neighbours sharing a strip, supporters up the
 * order) are sized again. `changedIds` is accepted as a hint for callers; correctness does
 * not depend on it because the inputs themselves are compared.
 */
import type { Plan } from '../../schemas/plan.schema';
import { planProblem, type PlanProblem } from '../../schemas/plan-problem.schema';
import { designMember } from '../sizing/member-design';
import { MemberInputError } from '../sizing/member-input.validation';
import type { MemberDesignInput, MemberDesignResult } from '../sizing/member-design.types';
import type { MemberLoad } from '../analysis/member-load.types';
import { buildFramingTopology } from '../geometry/framing-topology.geometry';
import { lockedShapeWeightPlf, reducedLiveKip, runTakedown, type MemberTakedown, type TakedownResult } from '../takedown/gravity-takedown.takedown';
import type { Bracing } from '../takedown/member-bracing.takedown';
import { assignMarks } from './member-marks.scheme';

export interface SchemeOptions {
  /** Members of the same level, kind, span, load layout and bracing get one size: the heaviest demand governs. */
  groupIdentical?: boolean;
  /** The previous result for this plan (in memory), to reuse unchanged designs. */
  previous?: SchemeResult;
  /** Ids of the elements the caller changed (a hint; see the file comment). */
  changedIds?: string[];
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
}

export interface SchemeColumnLevel {
  level: string;
  D_kip: number;
  L_kip: number;
  Lr_kip: number;
  S_kip: number;
  Lunreduced_kip: number;
  tributaryArea_ft2: number;
  KLL: number;
  liveReductionFactor: number;
  Pr_kip: number;
  combination: string;
}

export interface SchemeBreakdown {
  steelWeight_lb: number;
  pieces: number;
  floorArea_ft2: number;
}

export interface SchemeResult {
  name: string;
  method: 'LRFD' | 'ASD';
  members: SchemeMember[];
  columns: { id: string; levels: SchemeColumnLevel[] }[];
  totals: {
    steelWeight_lb: number;
    floorArea_ft2: number;
    steel_psf: number;
    pieces: number;
    connections: number;
    byLevel: (SchemeBreakdown & { level: string })[];
    byKind: (Omit<SchemeBreakdown, 'floorArea_ft2'> & { kind: 'girder' | 'beam' })[];
  };
  equilibrium: Record<'D' | 'L' | 'Lr' | 'S', { applied_kip: number; reactions_kip: number }>;
  problems: PlanProblem[];
  caution: string;
}

export const SCHEME_CAUTION =
  'Baywright results must be checked by a licensed engineer before use; local codes and the engineer of record govern.';

/** Design cache carried (non-enumerable, so never serialised) on each result. */
const CACHE = Symbol('baywright.designCache');
type DesignCache = Map<string, MemberDesignResult | { error: string[] }>;
interface CacheView {
  get(key: string): MemberDesignResult | { error: string[] } | undefined;
  set(key: string, value: MemberDesignResult | { error: string[] }): void;
}
function cacheOf(result: SchemeResult | undefined): DesignCache {
  return (result as unknown as { [CACHE]?: DesignCache } | undefined)?.[CACHE] ?? new Map();
}

/** The loads a member is designed for: reducible live × its reduction factor (ASCE 7-16 Eq. 4.7-1). */
export function designLoads(mt: MemberTakedown): MemberLoad[] {
  const f = mt.liveReductionFactor;
  const out: MemberLoad[] = [];
  for (const l of mt.loads) {
    if (l.source.startsWith('self weight')) continue; // the sizing engine adds self weight itself
    const { reducible, ...load } = l;
    if (!reducible || f === 1) {
      out.push(load as MemberLoad);
      continue;
    }
    const note = ` × ${f.toFixed(3)} (ASCE 7-16 Eq. 4.7-1)`;
    switch (load.kind) {
      case 'uniform':
      case 'partial':
        out.push({ ...load, w_klf: load.w_klf * f, source: load.source + note });
        break;
      case 'linear':
        out.push({ ...load, w1_klf: load.w1_klf * f, w2_klf: load.w2_klf * f, source: load.source + note });
        break;
      case 'point':
        out.push({ ...load, P_kip: load.P_kip * f, source: load.source + note });
        break;
    }
  }
  return out;
}

export function memberDesignInput(plan: Plan, mt: MemberTakedown, forcedShape: string | null): MemberDesignInput {
  const m = mt.member;
  return {
    span_ft: mt.span_ft,
    loads: designLoads(mt),
    bracing: mt.bracing,
    method: plan.designBasis.method,
    Fy_ksi: plan.designBasis.Fy_ksi,
    deflectionLimits: plan.designBasis.deflectionLimits,
    shape: forcedShape ?? m.shape,
    maxDepth_in: m.maxDepth_in,
    minDepth_in: m.minDepth_in ?? null,
    allowedNominalDepths: m.allowedNominalDepths ?? null,
    includeSelfWeight: true,
    Lb_override_ft: m.Lb_override_ft ?? null,
  };
}

/** Key of the design input: positions and magnitudes rounded far below any engineering meaning. */
function inputKey(input: MemberDesignInput): string {
  const n = (v: number) => Math.round(v * 1e9) / 1e9;
  const loads = input.loads.map((l) => {
    switch (l.kind) {
      case 'uniform':
        return `${l.case}u${n(l.w_klf)}`;
      case 'partial':
        return `${l.case}p${n(l.w_klf)},${n(l.from_ft)},${n(l.to_ft)}`;
      case 'linear':
        return `${l.case}l${n(l.w1_klf)},${n(l.w2_klf)},${n(l.from_ft)},${n(l.to_ft)}`;
      case 'point':
        return `${l.case}P${n(l.P_kip)},${n(l.x_ft)}`;
    }
  });
  return [
    n(input.span_ft), typeof input.bracing === 'string' ? input.bracing : input.bracing.points_ft.map(n).join(','), input.method, input.Fy_ksi,
    input.deflectionLimits.live, input.deflectionLimits.total, input.shape ?? '', input.maxDepth_in ?? '', input.minDepth_in ?? '',
    (input.allowedNominalDepths ?? []).join(','), input.includeSelfWeight, input.Lb_override_ft ?? '', input.liveLoadFactorHalf ?? '', loads.join(';'),
  ].join('|');
}

/** Group key: level, kind, span, bracing and the layout (case, kind, position) of the loads. */
function groupKey(mt: MemberTakedown): string {
  const layout = mt.loads
    .filter((l) => !l.source.startsWith('self weight'))
    .map((l) => `${l.case}${l.kind}${'x_ft' in l ? l.x_ft.toFixed(1) : 'from_ft' in l ? `${l.from_ft.toFixed(1)}-${l.to_ft.toFixed(1)}` : ''}`)
    .sort()
    .join(',');
  return [mt.level, mt.kind, mt.span_ft.toFixed(2), JSON.stringify(mt.bracing), mt.member.shape ?? '', layout].join('|');
}

function runDesignPass(
  plan: Plan,
  topology: ReturnType<typeof buildFramingTopology>,
  cache: CacheView,
  forced: Map<string, string>,
  designs: Map<string, MemberDesignResult | { error: string[] }>,
): TakedownResult {
  return runTakedown(plan, {
    topology,
    selfWeight: (mt) => {
      const input = memberDesignInput(plan, mt, forced.get(mt.id) ?? null);
      const key = inputKey(input);
      let result = cache.get(key);
      if (!result) {
        try {
          result = designMember(input);
        } catch (e) {
          if (!(e instanceof MemberInputError)) throw e;
          result = { error: [e.message, ...e.problems] };
        }
        cache.set(key, result);
      }
      designs.set(mt.id, result);
      return 'error' in result ? lockedShapeWeightPlf(mt.member) : result.weight_plf;
    },
  });
}

export function designScheme(plan: Plan, options: SchemeOptions = {}): SchemeResult {
  const topology = buildFramingTopology(plan);
  const previousCache = cacheOf(options.previous);
  // Read from this run's cache, then the previous one; keep only designs this run used.
  const cache: DesignCache = new Map();
  const combined: CacheView = {
    get: (k) => {
      const hit = cache.get(k) ?? previousCache.get(k);
      if (hit) cache.set(k, hit);
      return hit;
    },
    set: (k, v) => void cache.set(k, v),
  };

  const forced = new Map<string, string>();
  let designs = new Map<string, MemberDesignResult | { error: string[] }>();
  let takedown = runDesignPass(plan, topology, combined, forced, designs);

  if (options.groupIdentical) {
    // Fixed point: a group's size changes its members' self weight, hence their supporters' loads.
    for (let iteration = 0; iteration < 10; iteration++) {
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
      designs = new Map();
      takedown = runDesignPass(plan, topology, combined, forced, designs);
    }
  }

  const result = buildSchemeResult(plan, takedown, designs);
  Object.defineProperty(result, CACHE, { value: cache, enumerable: false });
  return result;
}

function buildSchemeResult(plan: Plan, takedown: TakedownResult, designs: Map<string, MemberDesignResult | { error: string[] }>): SchemeResult {
  const problems: PlanProblem[] = [...takedown.problems];
  const fileOrder = plan.members.filter((m) => takedown.members.has(m.id));
  const marks = assignMarks(
    fileOrder.map((m) => {
      const d = designs.get(m.id);
      return {
        id: m.id,
        level: m.level,
        kind: m.kind,
        shape: d && !('error' in d) ? d.shape : m.shape,
        span_ft: takedown.members.get(m.id)!.span_ft,
        midpoint: [(m.start[0] + m.end[0]) / 2, (m.start[1] + m.end[1]) / 2] as const,
        lockedMark: m.markLocked && m.mark ? m.mark : null,
      };
    }),
    plan.levels,
  );

  const members: SchemeMember[] = fileOrder.map((m) => {
    const mt = takedown.members.get(m.id)!;
    const entry = designs.get(m.id);
    const design = entry && !('error' in entry) ? entry : null;
    if (entry && 'error' in entry) {
      problems.push(planProblem('error', 'member-not-designed', `Member ${m.id}: could not be designed — ${entry.error.join('; ')}`, { elementId: m.id }));
    } else if (design && !design.passes) {
      problems.push(planProblem('error', 'member-fails', `Member ${m.id}: ${design.failure ?? 'does not pass'}`, { elementId: m.id }));
    }
    const end = (e: 'start' | 'end'): SchemeReactionEnd => {
      const r = mt.reactions[e];
      return {
        D_kip: r.D_kip,
        L_kip: reducedLiveKip(r, mt.liveReductionFactor),
        Lr_kip: r.Lr_kip,
        S_kip: r.S_kip,
        Lunreduced_kip: r.L_kip,
        supportedBy: r.supportedBy,
      };
    };
    return {
      id: m.id,
      mark: marks.get(m.id) ?? '',
      kind: m.kind,
      level: m.level,
      shape: design ? design.shape : m.shape,
      span_ft: mt.span_ft,
      passes: design ? design.passes : false,
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
      reactions: { start: end('start'), end: end('end') },
      loads: [...designLoads(mt), ...mt.loads.filter((l) => l.source.startsWith('self weight')).map(({ reducible: _r, ...l }) => l as MemberLoad)],
      bracing: mt.bracing,
      connections: 2 + mt.framingPoints_ft.length,
      design,
    };
  });

  const weightOf = (s: SchemeMember) => s.weight_plf * s.span_ft;
  const steelWeight_lb = members.reduce((sum, s) => sum + weightOf(s), 0);
  const floorArea_ft2 = takedown.floorArea_ft2;
  const byLevel = plan.levels.map((l) => {
    const here = members.filter((s) => s.level === l.id);
    return { level: l.id, steelWeight_lb: here.reduce((sum, s) => sum + weightOf(s), 0), pieces: here.length, floorArea_ft2: takedown.byLevelFloorArea_ft2.get(l.id) ?? 0 };
  });
  const byKind = (['girder', 'beam'] as const).map((kind) => {
    const here = members.filter((s) => s.kind === kind);
    return { kind, steelWeight_lb: here.reduce((sum, s) => sum + weightOf(s), 0), pieces: here.length };
  });

  return {
    name: plan.name,
    method: plan.designBasis.method,
    members,
    columns: takedown.columns.map((c) => ({
      id: c.id,
      levels: c.levels.map((l) => ({
        level: l.level,
        D_kip: l.D_kip,
        L_kip: l.L_kip,
        Lr_kip: l.Lr_kip,
        S_kip: l.S_kip,
        Lunreduced_kip: l.Lunreduced_kip,
        tributaryArea_ft2: l.reducibleArea_ft2 > 0 ? l.reducibleArea_ft2 : l.tributaryArea_ft2,
        KLL: l.KLL,
        liveReductionFactor: l.liveReductionFactor,
        Pr_kip: l.Pr_kip,
        combination: l.combination,
      })),
    })),
    totals: {
      steelWeight_lb,
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
