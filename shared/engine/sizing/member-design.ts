import { shapeConstantsByWeight, shapeConstantsFor, type WShapeConstants } from '../design/aisc360/w-shape-constants';
import { buildMemberContext, type MemberContext } from './member-context';
import type { AlternativeShape, MemberDesignInput, MemberDesignResult } from './member-design.types';
import { assertValidMemberInput, MemberInputError } from './member-input.validation';
import { buildMemberResult, describeGoverning } from './member-result.builder';
import { evaluateShape, mayPass, type ShapeEvaluation } from './shape-evaluation';

/** Candidates honouring the depth and series constraints, lightest first (ties: shallower). */
const candidateCache = new Map<string, readonly WShapeConstants[]>();

export function candidateShapes(input: MemberDesignInput): readonly WShapeConstants[] {
  const key = `${input.Fy_ksi}|${input.maxDepth_in ?? ''}|${input.minDepth_in ?? ''}|${input.allowedNominalDepths?.join(',') ?? ''}`;
  let list = candidateCache.get(key);
  if (!list) {
    list = filterCandidates(input);
    if (candidateCache.size > 1000) candidateCache.clear();
    candidateCache.set(key, list);
  }
  return list;
}

function filterCandidates(input: MemberDesignInput): WShapeConstants[] {
  const maxD = input.maxDepth_in ?? Infinity;
  const minD = input.minDepth_in ?? 0;
  const series = input.allowedNominalDepths && input.allowedNominalDepths.length > 0 ? new Set(input.allowedNominalDepths) : null;
  return shapeConstantsByWeight(input.Fy_ksi).filter(
    (k) => k.dIn <= maxD && k.dIn >= minD && (series === null || series.has(k.nominalDepthIn)),
  );
}

function constraintText(input: MemberDesignInput): string {
  const parts: string[] = [];
  if (input.maxDepth_in != null) parts.push(`d ≤ ${input.maxDepth_in} in`);
  if (input.minDepth_in != null) parts.push(`d ≥ ${input.minDepth_in} in`);
  if (input.allowedNominalDepths?.length) parts.push(`nominal depths ${input.allowedNominalDepths.join(', ')} in`);
  return parts.length ? ` within the constraints (${parts.join('; ')})` : '';
}

/** Why a locked shape breaks the member's depth or series constraints, or null when it keeps them. */
export function lockedShapeOutsideConstraints(input: MemberDesignInput, k: WShapeConstants): string | null {
  if (input.maxDepth_in != null && k.dIn > input.maxDepth_in) return `depth d = ${k.dIn} in is more than maxDepth_in = ${input.maxDepth_in} in`;
  if (input.minDepth_in != null && k.dIn < input.minDepth_in) return `depth d = ${k.dIn} in is less than minDepth_in = ${input.minDepth_in} in`;
  if (input.allowedNominalDepths?.length && !input.allowedNominalDepths.includes(k.nominalDepthIn)) {
    return `nominal depth ${k.nominalDepthIn} in is not among allowedNominalDepths (${input.allowedNominalDepths.join(', ')} in)`;
  }
  return null;
}

/**
 * The lightest passing shape among the candidates (exact: each candidate is checked with its own
 * self weight, which is the fixed point of the self-weight iteration). Cheap necessary conditions
 * (Zx, shear, Ix without self weight) skip shapes that cannot pass; the result equals brute force.
 */
export function selectLightest(ctx: MemberContext, candidates: readonly WShapeConstants[]): ShapeEvaluation | null {
  for (const k of candidates) {
    if (!k.webCompact || !mayPass(ctx, k)) continue;
    const ev = evaluateShape(ctx, k, false);
    if (ev.passes) return ev;
  }
  return null;
}

/** AISC 360-16 member design of a simple span: check a locked shape, or select the lightest passing one. */
export function designMember(input: MemberDesignInput): MemberDesignResult {
  assertValidMemberInput(input);
  const ctx = buildMemberContext(input);
  if (input.shape) {
    const k = shapeConstantsFor(input.shape, input.Fy_ksi)!;
    const result = buildMemberResult(ctx, evaluateShape(ctx, k, true), true);
    const outside = lockedShapeOutsideConstraints(input, k);
    if (outside) {
      // A locked size the member's own limits forbid never reads as passing (the architect's
      // depth limit is as binding as a strength check).
      result.passes = false;
      result.failure = `Locked shape ${k.label}: ${outside}.`;
    } else if (!k.webCompact) {
      result.passes = false;
      result.failure = `Locked shape ${k.label}: web noncompact in flexure at Fy = ${input.Fy_ksi} ksi (AISC 360-16 F4 is outside the engine's scope, so the shape is not permitted).`;
    } else if (!result.passes) {
      result.failure = `Locked shape ${k.label} does not pass: ratio ${result.ratio.toFixed(3)}, ${describeGoverning(result)}.`;
    }
    return result;
  }
  const candidates = candidateShapes(input);
  if (candidates.length === 0) {
    throw new MemberInputError('no catalog shape satisfies the depth constraints', [
      `maxDepth_in: no W-shape in AISC Shapes Database v15.0 is left${constraintText(input)}`,
    ]);
  }
  const chosen = selectLightest(ctx, candidates);
  if (chosen) {
    return buildMemberResult(ctx, evaluateShape(ctx, chosen.k, true), false);
  }
  // Nothing passes: report the candidate with the lowest governing ratio (ties: lighter).
  let best: ShapeEvaluation | null = null;
  for (const k of candidates) {
    if (!k.webCompact) continue;
    const ev = evaluateShape(ctx, k, false);
    if (best === null || ev.ratio < best.ratio) best = ev;
  }
  if (best === null) {
    throw new MemberInputError('no permitted shape', [`Fy_ksi: no candidate W-shape has a compact web at ${input.Fy_ksi} ksi`]);
  }
  const result = buildMemberResult(ctx, evaluateShape(ctx, best.k, true), false);
  result.passes = false;
  result.failure = `No W-shape${constraintText(input)} passes. Best ratio reached: ${result.ratio.toFixed(3)} with ${
    result.shape}, governed by ${describeGoverning(result)}.`;
  return result;
}

function alternative(ev: ShapeEvaluation): AlternativeShape {
  return { shape: ev.k.label, weight_plf: ev.k.weightPlf, d_in: ev.k.dIn, passes: ev.passes, ratio: ev.ratio, governing: ev.governing };
}

/**
 * For a design, the next lighter candidate (the heaviest candidate strictly lighter than the
 * shape, checked), a candidate of the same weight when there is one (named as such, never as
 * lighter), and the lightest passing candidate of a smaller nominal depth, with their ratios.
 */
export function memberAlternatives(
  input: MemberDesignInput, shape: string,
): { nextLighter: AlternativeShape | null; nextShallower: AlternativeShape | null; sameWeight: AlternativeShape | null } {
  assertValidMemberInput({ ...input, shape });
  const ctx = buildMemberContext(input);
  const k = shapeConstantsFor(shape, input.Fy_ksi)!;
  const candidates = candidateShapes({ ...input, shape: null }).filter((c) => c.webCompact);
  let lighter: WShapeConstants | null = null;
  let same: WShapeConstants | null = null;
  // Candidates run lightest first: the last strictly lighter one is the next lighter.
  for (const c of candidates) {
    if (c.weightPlf < k.weightPlf) lighter = c;
    else if (c.weightPlf > k.weightPlf) break;
    else if (c.label !== k.label && same === null) same = c;
  }
  const nextLighter = lighter ? alternative(evaluateShape(ctx, lighter, false)) : null;
  const sameWeight = same ? alternative(evaluateShape(ctx, same, false)) : null;
  const shallower = candidates.filter((c) => c.nominalDepthIn < k.nominalDepthIn);
  const sel = selectLightest(ctx, shallower);
  return { nextLighter, nextShallower: sel ? alternative(sel) : null, sameWeight };
}
