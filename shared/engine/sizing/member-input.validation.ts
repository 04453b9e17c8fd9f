import { findWShape } from '../../catalog/w-shapes.catalog';
import type { MemberDesignInput } from './member-design.types';

export interface InputProblem {
  path: (string | number)[];
  message: string;
}

/** "loads[2].x_ft" from ["loads", 2, "x_ft"]. */
export function formatProblemPath(path: readonly PropertyKey[]): string {
  let out = '';
  for (const p of path) out += typeof p === 'number' ? `[${p}]` : out === '' ? String(p) : `.${String(p)}`;
  return out || 'input';
}

export const formatProblem = (p: InputProblem): string => `${formatProblemPath(p.path)}: ${p.message}`;

/** Thrown by the engine for input it cannot design; problems name the field path. */
export class MemberInputError extends Error {
  readonly problems: string[];
  constructor(message: string, problems: string[]) {
    super(message);
    this.name = 'MemberInputError';
    this.problems = problems;
  }
}

const isNum = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

/** Longest simple span the engine designs, ft. */
export const MEMBER_MAX_SPAN_FT = 200;
/** Yield stress the engine's W-shape checks cover, ksi (every rolled W-shape web compact for Fy ≤ 65 ksi; 70 the top of the range accepted). */
export const FY_RANGE_KSI = { min: 30, max: 70 } as const;
/**
 * Magnitudes far past any W-shape's strength, so sums and squares stay finite (a 1e308 klf
 * load would overflow to Infinity and then NaN). Loads delivered through a plan's takedown
 * stay within these too.
 */
export const MEMBER_LOAD_LIMITS = { w_klf: 10_000, P_kip: 100_000, loads: 10_000, bracePoints: 1_000, deflectionDenominator: 100_000, depth_in: 100 } as const;
const fmt = (v: number): string => String(Math.round(v * 1000) / 1000);

/**
 * Cross-field rules for a member (positions within the span, ranges, known shape). The zod
 * schema (shared/schemas/member.schema.ts) checks types first and then calls this, so the CLI,
 * the API and direct engine callers report the same problems.
 */
export function memberInputProblems(input: MemberDesignInput): InputProblem[] {
  const out: InputProblem[] = [];
  const L = input.span_ft;
  if (!isNum(L) || L <= 0) out.push({ path: ['span_ft'], message: 'must be a number greater than 0' });
  else if (L > MEMBER_MAX_SPAN_FT) out.push({ path: ['span_ft'], message: `must be at most ${MEMBER_MAX_SPAN_FT} ft` });
  const spanOk = isNum(L) && L > 0;
  const within = (x: number): boolean => !spanOk || (x >= 0 && x <= L);
  const spanText = (): string => (spanOk ? `0–${fmt(L)} ft` : 'span');
  if (!Array.isArray(input.loads)) out.push({ path: ['loads'], message: 'must be a list of loads' });
  else if (input.loads.length > MEMBER_LOAD_LIMITS.loads) out.push({ path: ['loads'], message: `must have at most ${MEMBER_LOAD_LIMITS.loads} loads` });
  else input.loads.forEach((l, i) => {
    const at = (f: string, message: string): void => { out.push({ path: ['loads', i, f], message }); };
    const nonNeg = (f: string, v: unknown): void => {
      const max = f === 'P_kip' ? MEMBER_LOAD_LIMITS.P_kip : MEMBER_LOAD_LIMITS.w_klf;
      if (!isNum(v)) at(f, 'must be a number');
      else if (v < 0) at(f, 'must be 0 or more (gravity loads act downward)');
      else if (v > max) at(f, `must be at most ${max} ${f === 'P_kip' ? 'kip' : 'klf'}`);
    };
    if (!l || typeof l !== 'object') { out.push({ path: ['loads', i], message: 'must be a load object' }); return; }
    if (!['D', 'L', 'Lr', 'S'].includes(l.case)) at('case', 'must be one of D, L, Lr, S');
    switch (l.kind) {
      case 'uniform': nonNeg('w_klf', l.w_klf); break;
      case 'partial':
      case 'linear': {
        if (l.kind === 'partial') nonNeg('w_klf', l.w_klf);
        else { nonNeg('w1_klf', l.w1_klf); nonNeg('w2_klf', l.w2_klf); }
        if (!isNum(l.from_ft) || !within(l.from_ft)) at('from_ft', `must be within the span ${spanText()}`);
        if (!isNum(l.to_ft) || !within(l.to_ft)) at('to_ft', `must be within the span ${spanText()}`);
        else if (isNum(l.from_ft) && l.to_ft <= l.from_ft) at('to_ft', 'must be greater than from_ft');
        break;
      }
      case 'point':
        nonNeg('P_kip', l.P_kip);
        if (!isNum(l.x_ft) || !within(l.x_ft)) at('x_ft', `must be within the span ${spanText()}`);
        break;
      default: at('kind', 'must be one of uniform, partial, linear, point');
    }
  });
  if (Array.isArray(input.loads) && input.includeSelfWeight === false) {
    const anyLoad = input.loads.some((l) => l && (l.kind === 'point' ? l.P_kip > 0 : l.kind === 'linear' ? l.w1_klf > 0 || l.w2_klf > 0 : l.w_klf > 0));
    if (!anyLoad) out.push({ path: ['loads'], message: 'needs at least one load above 0 (or includeSelfWeight)' });
  }
  const b = input.bracing;
  if (b !== 'continuous' && b !== 'none') {
    if (!b || typeof b !== 'object' || !Array.isArray(b.points_ft)) {
      out.push({ path: ['bracing'], message: 'must be "continuous", "none" or { "points_ft": [...] }' });
    } else if (b.points_ft.length > MEMBER_LOAD_LIMITS.bracePoints) {
      out.push({ path: ['bracing', 'points_ft'], message: `must have at most ${MEMBER_LOAD_LIMITS.bracePoints} brace points` });
    } else b.points_ft.forEach((x, i) => {
      if (!isNum(x) || !within(x)) out.push({ path: ['bracing', 'points_ft', i], message: `must be within the span ${spanText()}` });
    });
  }
  if (input.method !== 'LRFD' && input.method !== 'ASD') out.push({ path: ['method'], message: 'must be LRFD or ASD' });
  if (!isNum(input.Fy_ksi) || input.Fy_ksi < FY_RANGE_KSI.min || input.Fy_ksi > FY_RANGE_KSI.max) {
    out.push({ path: ['Fy_ksi'], message: `must be between ${FY_RANGE_KSI.min} and ${FY_RANGE_KSI.max} ksi` });
  }
  const dl = input.deflectionLimits;
  if (!dl || typeof dl !== 'object') out.push({ path: ['deflectionLimits'], message: 'must be { live, total }' });
  else for (const k of ['live', 'total'] as const) {
    const v = dl[k];
    if (v !== null && (!isNum(v) || v <= 0)) out.push({ path: ['deflectionLimits', k], message: 'must be a positive span/n denominator or null' });
    else if (v !== null && v > MEMBER_LOAD_LIMITS.deflectionDenominator) out.push({ path: ['deflectionLimits', k], message: `must be at most ${MEMBER_LOAD_LIMITS.deflectionDenominator} (span/n denominator)` });
  }
  if (input.shape != null && (typeof input.shape !== 'string' || !findWShape(input.shape))) {
    out.push({ path: ['shape'], message: `unknown W-shape "${String(input.shape)}" (not in AISC Shapes Database v15.0)` });
  }
  for (const k of ['maxDepth_in', 'minDepth_in'] as const) {
    const v = input[k];
    if (v != null && (!isNum(v) || v <= 0)) out.push({ path: [k], message: 'must be a positive depth in inches or null' });
    else if (v != null && v > MEMBER_LOAD_LIMITS.depth_in) out.push({ path: [k], message: `must be at most ${MEMBER_LOAD_LIMITS.depth_in} in or null` });
  }
  if (isNum(input.maxDepth_in) && isNum(input.minDepth_in) && input.minDepth_in > input.maxDepth_in) {
    out.push({ path: ['minDepth_in'], message: 'must not exceed maxDepth_in' });
  }
  if (input.allowedNominalDepths != null) {
    if (!Array.isArray(input.allowedNominalDepths) || input.allowedNominalDepths.length === 0) {
      out.push({ path: ['allowedNominalDepths'], message: 'must be a non-empty list of nominal depths (in) or null' });
    } else if (input.allowedNominalDepths.length > 50) {
      out.push({ path: ['allowedNominalDepths'], message: 'must have at most 50 nominal depths' });
    } else input.allowedNominalDepths.forEach((v, i) => {
      if (!isNum(v) || v <= 0) out.push({ path: ['allowedNominalDepths', i], message: 'must be a positive nominal depth in inches' });
    });
  }
  const lb = input.Lb_override_ft;
  if (lb != null && (!isNum(lb) || lb < 0 || (spanOk && lb > L))) {
    out.push({ path: ['Lb_override_ft'], message: `must be between 0 and the span (${spanText()}) or null` });
  }
  return out;
}

export function assertValidMemberInput(input: MemberDesignInput): void {
  const problems = memberInputProblems(input);
  if (problems.length > 0) throw new MemberInputError('invalid member input', problems.map(formatProblem));
}
