// Everything the Member sheet shows that is not already in the scheme result: the member's
// design input rebuilt from its loads and the design basis, its diagrams (from the engine's
// memberDiagrams), the next lighter and next shallower shapes (memberAlternatives) and a
// preview of a shape before it is locked. Pure functions of their arguments.
import {
  designMember, memberAlternatives, memberDeflectionLimits, memberDiagrams, MemberInputError,
  type AlternativeShape, type MemberDesignInput, type MemberDesignResult, type MemberLoad, type SchemeMember,
} from '../../../../shared/engine/index';
import type { PlanBracing, PlanDesignBasis, PlanMemberDeflectionLimits } from '../../../../shared/schemas/plan.schema';

/** Per-member constraints the engineer may set (plan member fields of the same names). */
export interface MemberConstraints {
  maxDepth_in: number | null;
  minDepth_in: number | null;
  allowedNominalDepths: number[] | null;
}

/** What the plan stores for the member besides geometry: the lock, constraints, Lb override. */
export interface MemberPlanSettings extends MemberConstraints {
  shape: string | null;
  Lb_override_ft?: number | null;
  /** Bracing set on the member (null: derived from the framing and deck). */
  bracing?: PlanBracing | null;
  /** Deflection limits set on the member (null: the design basis). */
  deflectionLimits?: PlanMemberDeflectionLimits | null;
  /** null follows the design basis; true/false forces composite or bare steel. */
  composite?: boolean | null;
}

export const SELF_WEIGHT_PREFIX = 'self weight';

export function isSelfWeight(load: MemberLoad): boolean {
  return (load.source ?? '').startsWith(SELF_WEIGHT_PREFIX);
}

/**
 * The design input the scheme used for this member (designScheme's memberDesignInput): the
 * member's loads without self weight (the engine adds it from the shape), the basis, its
 * bracing and constraints. `shape` is left to the caller.
 */
export function sheetDesignInput(member: SchemeMember, basis: PlanDesignBasis, settings?: Partial<MemberPlanSettings> | null): MemberDesignInput {
  return {
    span_ft: member.span_ft,
    loads: member.loads.filter((l) => !isSelfWeight(l)),
    bracing: member.bracing,
    method: basis.method,
    Fy_ksi: basis.Fy_ksi,
    deflectionLimits: (({ live, total }) => ({ live, total }))(memberDeflectionLimits(basis, { deflectionLimits: settings?.deflectionLimits ?? null })),
    shape: null,
    maxDepth_in: settings?.maxDepth_in ?? null,
    minDepth_in: settings?.minDepth_in ?? null,
    allowedNominalDepths: settings?.allowedNominalDepths ?? null,
    includeSelfWeight: true,
    Lb_override_ft: settings?.Lb_override_ft ?? null,
    // composite members: the slab, effective width, studs and construction loads the scheme used
    ...(member.designExtras ?? {}),
  };
}

export interface SheetDiagrams {
  x_ft: number[];
  /** Governing flexure combination (factored). */
  combination: string;
  V_kip: number[];
  M_kipft: number[];
  /** Service deflection under every load case together (D + L + Lr + S), the "total" of the checks. */
  deflectionTotal_in: number[];
  /** Which cases the deflected shape includes, e.g. "D+L". */
  deflectionCases: string;
}

/** Shear and moment for the governing combination, and the total service deflection, at the engine's stations. */
export function sheetDiagrams(input: MemberDesignInput, shape: string): SheetDiagrams {
  const d = memberDiagrams(input, shape);
  const transient = input.loads.filter((l) => l.case === 'Lr' || l.case === 'S');
  const cases = ['D', ...(['L', 'Lr', 'S'] as const).filter((c) => input.loads.some((l) => l.case === c))];
  let deflectionTotal_in = d.D.deflection_in.map((y, i) => y + d.L.deflection_in[i]);
  if (transient.length > 0) {
    // memberDiagrams plots D and L only: count Lr and S as L for the service picture (same stations).
    const asLive = memberDiagrams({ ...input, loads: input.loads.map((l) => (l.case === 'Lr' || l.case === 'S' ? { ...l, case: 'L' } : l)) }, shape);
    deflectionTotal_in = asLive.D.deflection_in.map((y, i) => y + asLive.L.deflection_in[i]);
  }
  return {
    x_ft: d.x_ft,
    combination: d.governing.label,
    V_kip: d.governing.V_kip,
    M_kipft: d.governing.M_kipft,
    deflectionTotal_in,
    deflectionCases: cases.join('+'),
  };
}

export interface Alternatives {
  nextLighter: AlternativeShape | null;
  nextShallower: AlternativeShape | null;
  /** Another shape of the same weight (not lighter), when the catalog has one. */
  sameWeight: AlternativeShape | null;
}

export function sheetAlternatives(input: MemberDesignInput, shape: string): Alternatives {
  return memberAlternatives(input, shape);
}

/** The member designed with a given shape (what locking it would give). */
export function previewShape(input: MemberDesignInput, shape: string): MemberDesignResult {
  return designMember({ ...input, shape });
}

/** Runs an engine call, turning its input errors into a message for the sheet. */
export function attempt<T>(run: () => T): { value: T; error: null } | { value: null; error: string } {
  try {
    return { value: run(), error: null };
  } catch (e) {
    if (e instanceof MemberInputError) return { value: null, error: [e.message, ...e.problems].join('; ') };
    if (e instanceof Error) return { value: null, error: e.message };
    throw e;
  }
}

/** Index of the value with the largest magnitude (first on ties). */
export function peakIndex(values: readonly number[]): number {
  let best = 0;
  for (let i = 1; i < values.length; i++) if (Math.abs(values[i]) > Math.abs(values[best])) best = i;
  return best;
}

/** Total unfactored distributed intensity (kip/ft) at x, all cases and self weight. */
export function distributedIntensityKlf(loads: readonly MemberLoad[], x: number, spanFt: number): number {
  let w = 0;
  for (const l of loads) {
    if (l.kind === 'uniform') w += l.w_klf;
    else if (l.kind === 'partial' && x >= l.from_ft && x <= l.to_ft) w += l.w_klf;
    else if (l.kind === 'linear' && x >= l.from_ft && x <= l.to_ft && l.to_ft > l.from_ft) {
      w += l.w1_klf + ((l.w2_klf - l.w1_klf) * (x - l.from_ft)) / (l.to_ft - l.from_ft);
    }
  }
  return x < 0 || x > spanFt ? 0 : w;
}

/**
 * Outline of the total distributed load along the span, as (x, w) corners: constant or linear
 * between consecutive load ends, so one point each side of every step.
 */
export function intensityOutline(loads: readonly MemberLoad[], spanFt: number): { x_ft: number; w_klf: number }[] {
  const ends = new Set<number>([0, spanFt]);
  for (const l of loads) {
    if (l.kind === 'partial' || l.kind === 'linear') {
      ends.add(Math.min(Math.max(l.from_ft, 0), spanFt));
      ends.add(Math.min(Math.max(l.to_ft, 0), spanFt));
    }
  }
  const xs = [...ends].sort((a, b) => a - b);
  const eps = spanFt * 1e-9;
  const out: { x_ft: number; w_klf: number }[] = [];
  for (let i = 0; i + 1 < xs.length; i++) {
    const a = xs[i];
    const b = xs[i + 1];
    if (b - a <= eps) continue;
    out.push({ x_ft: a, w_klf: distributedIntensityKlf(loads, a + eps, spanFt) });
    out.push({ x_ft: b, w_klf: distributedIntensityKlf(loads, b - eps, spanFt) });
  }
  return out;
}

/** Point loads summed by position (unfactored, all cases). */
export function pointLoadsByPosition(loads: readonly MemberLoad[]): { x_ft: number; P_kip: number }[] {
  const byX = new Map<string, { x_ft: number; P_kip: number }>();
  for (const l of loads) {
    if (l.kind !== 'point') continue;
    const key = l.x_ft.toFixed(4);
    const entry = byX.get(key) ?? { x_ft: l.x_ft, P_kip: 0 };
    entry.P_kip += l.P_kip;
    byX.set(key, entry);
  }
  return [...byX.values()].sort((a, b) => a.x_ft - b.x_ft);
}

/** Brace points inside the span, from the member's bracing. */
export function bracePoints(member: Pick<SchemeMember, 'bracing' | 'span_ft'>): number[] {
  const b = member.bracing;
  if (typeof b === 'object') return b.points_ft.filter((p) => p > 0 && p < member.span_ft).sort((x, y) => x - y);
  return [];
}
