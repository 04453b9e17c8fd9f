/**
 * Gravity column sizing by tier (design-basis §8): each tier gets the lightest shape of the
 * allowed series whose available axial strength (AISC 360-16 E1, E3/E7) meets the factored
 * load of every length in the tier for every gravity combination (ASCE 7-16 §2.3.1 / §2.4.1).
 * Tiers are sized from the top down; unless the project allows it, a tier is never lighter than
 * the sized tier above it (common practice: "never heavier above than below"). A locked tier
 * keeps its shape and is checked, never replaced; a locked tier does not bind the tiers below.
 *
 * Pr at a length includes the column's own weight down to the bottom of that length (the
 * tiers above and this tier's shape over its lengths down to here), as dead load: the
 * conservative reading (the stack's own loads exclude it). Pr at the bottom of a tier usually
 * governs the tier, but every length in the tier is checked with its own Pr and Lc, so a tall
 * upper storey in a tier is never missed (conservative).
 *
 * Slenderness: the User Note of AISC 360-16 E2 says Lc/r preferably should not exceed 200.
 * Sizing takes it as a limit (the conservative reading): a shape with Lc/r over 200 on any
 * length of the tier is not chosen. A locked size is checked on strength as usual and its Lc/r
 * is reported, so the scheme can warn of it.
 */
import { listWShapes, nominalDepthIn } from '../../catalog/w-shapes.catalog';
import { compressionConstantsFor, compressionStrengthE1, availableCompressionKip, type CompressionConstants, type CompressionStrength } from '../design/aisc360/chapter-e/e1';
import { columnRequiredAxialKip } from '../takedown/column-stack.takedown';
import type { DesignMethod } from '../design/aisc360/resistance-factors';
import { IN_PER_FT } from '../units/units.constants';
import { LOAD_CASES, loadCombinations } from '../loads/combinations';

/** Default candidate series for gravity columns (design-basis §8, a project setting). */
export const DEFAULT_COLUMN_SERIES: readonly string[] = ['W14', 'W12', 'W10'];

export interface ColumnLengthInput {
  level: string;
  Lc_ft: number;
  tier: number;
  /** Cumulative unfactored loads carried by this length (live already reduced). */
  D_kip: number;
  L_kip: number;
  Lr_kip: number;
  S_kip: number;
}

export interface ColumnDesignInput {
  method: DesignMethod;
  Fy_ksi: number;
  /** Nominal series allowed, e.g. ["W14", "W12"]. */
  series: readonly string[];
  /** Lengths top down, as in the column stack. */
  lengths: readonly ColumnLengthInput[];
  /** Locked shape per tier number (absent or null: size it). */
  locked?: ReadonlyMap<number, string | null>;
  /** Allow an upper tier heavier than the one below it (default false). */
  allowHeavierAbove?: boolean;
  /** Include the column's own weight in Pr (default true). */
  includeSelfWeight?: boolean;
}

export interface ColumnLengthResult {
  level: string;
  tier: number;
  shape: string | null;
  Lc_ft: number;
  /** Column weight carried at the bottom of this length, kip (included in Pr). */
  selfWeight_kip: number;
  Pr_kip: number;
  Pc_kip: number | null;
  Pn_kip: number | null;
  ratio: number | null;
  passes: boolean;
  /** Governing combination for this length. */
  governing: string;
  strength: CompressionStrength | null;
}

/** AISC 360-16 E2 User Note: Lc/r preferably should not exceed 200 (taken as a limit when sizing). */
export const LC_OVER_R_PREFERRED_MAX = 200;

/** Lc/r of a shape at Lc (in.), about its weaker axis (the smaller of rx and ry; AISC 360-16 E2). */
export function slendernessE2(k: CompressionConstants, lcIn: number): number {
  return lcIn / Math.min(k.rxIn, k.ryIn);
}

export interface ColumnTierResult {
  tier: number;
  shape: string | null;
  weight_plf: number;
  locked: boolean;
  passes: boolean;
  /** Highest ratio over the tier's lengths. */
  ratio: number | null;
  /** The level of the length with the highest ratio. */
  governingLevel: string | null;
  /** Why no shape passes, when none does. */
  failure: string | null;
  /** The next lighter allowed shape and its ratio, when there is one (for the column sheet). */
  lighter: { shape: string; ratio: number } | null;
  /** The highest Lc/r of the tier's shape over its lengths (AISC 360-16 E2), null without a shape. */
  LcOverR: number | null;
}

export interface ColumnDesignResult {
  lengths: ColumnLengthResult[];
  tiers: ColumnTierResult[];
  weight_lb: number;
  passes: boolean;
}

const candidatesCache = new Map<string, CompressionConstants[]>();

/** Allowed shapes at Fy, lightest first (ties: shallower first, then label). */
export function columnCandidates(series: readonly string[], fyKsi: number): readonly CompressionConstants[] {
  const key = `${fyKsi}|${[...series].map((s) => s.toUpperCase()).sort().join(',')}`;
  let list = candidatesCache.get(key);
  if (!list) {
    const depths = new Set(series.map((s) => Number(s.toUpperCase().replace(/^W/, ''))));
    list = listWShapes()
      .filter((s) => depths.has(nominalDepthIn(s)))
      .map((s) => compressionConstantsFor(s.label, fyKsi)!)
      .sort((a, b) => a.weightPlf - b.weightPlf || a.shape.d_in - b.shape.d_in || (a.label < b.label ? -1 : a.label > b.label ? 1 : 0));
    if (candidatesCache.size > 64) candidatesCache.clear();
    candidatesCache.set(key, list);
  }
  return list;
}

/** Factors of every gravity combination with all four cases present, per method (hot path). */
const FACTORS = {
  LRFD: loadCombinations('LRFD', LOAD_CASES).map((c) => c.factors),
  ASD: loadCombinations('ASD', LOAD_CASES).map((c) => c.factors),
};

/**
 * The same value as columnRequiredAxialKip(...).Pr_kip without the combination's name: a
 * combination of an absent case contributes 0 for it, and a combination dropped for the cases
 * present is dominated by one kept, so the maximum is the same.
 */
function requiredAxialKip(method: DesignMethod, D: number, L: number, Lr: number, S: number): number {
  let best = 0;
  for (const f of FACTORS[method]) {
    const p = f.D * D + f.L * L + f.Lr * Lr + f.S * S;
    if (p > best) best = p;
  }
  return best;
}

interface TierEvaluation {
  ratio: number;
  passes: boolean;
  governingIndex: number;
}

/**
 * φc Pn (or Pn/Ωc) of each candidate at one Lc, filled as asked (NaN: not yet worked out).
 * Per candidate list (one per series and Fy), method and Lc: a building repeats one storey
 * height on every column, so each shape's strength at it is worked out once per process.
 */
const pcTables = new WeakMap<readonly CompressionConstants[], Map<string, Float64Array>>();

function pcTableFor(candidates: readonly CompressionConstants[], method: DesignMethod, lcIn: number): Float64Array {
  let byLength = pcTables.get(candidates);
  if (!byLength) pcTables.set(candidates, (byLength = new Map()));
  const key = method + lcIn;
  let table = byLength.get(key);
  if (!table) {
    if (byLength.size > 256) byLength.clear();
    table = new Float64Array(candidates.length).fill(Number.NaN);
    byLength.set(key, table);
  }
  return table;
}

/**
 * Ratio of one shape over a tier's lengths (indices top down), with weight above it `aboveKip`.
 * Returns the worst ratio; the shape passes when every length has Pr ≤ Pc. `at` is the shape's
 * index in `candidates` (its strengths are then read from the tables), or -1 for a locked shape.
 */
function evaluateTier(
  input: ColumnDesignInput, k: CompressionConstants, indices: readonly number[], aboveKip: number, selfWeight: boolean,
  candidates: readonly CompressionConstants[] = [], at = -1,
): TierEvaluation {
  let swKip = aboveKip;
  let worst = -1;
  let worstAt = indices[0];
  for (const i of indices) {
    const len = input.lengths[i];
    if (selfWeight) swKip += (k.weightPlf * len.Lc_ft) / 1000;
    const pr = requiredAxialKip(input.method, len.D_kip + swKip, len.L_kip, len.Lr_kip, len.S_kip);
    const lcIn = len.Lc_ft * IN_PER_FT;
    let pc: number;
    if (at < 0) pc = availableCompressionKip(k, lcIn, input.method);
    else {
      const table = pcTableFor(candidates, input.method, lcIn);
      pc = table[at];
      if (pc !== pc) pc = table[at] = availableCompressionKip(k, lcIn, input.method);
    }
    const ratio = pc > 0 ? pr / pc : Number.POSITIVE_INFINITY;
    if (ratio > worst) {
      worst = ratio;
      worstAt = i;
    }
  }
  return { ratio: worst, passes: worst <= 1, governingIndex: worstAt };
}

/** Size (or check) every tier of one column, top down. */
export function designColumn(input: ColumnDesignInput): ColumnDesignResult {
  const selfWeight = input.includeSelfWeight !== false;
  const candidates = columnCandidates(input.series, input.Fy_ksi);
  // Tier numbers top down, each with its length indices (zero-length pieces are not sized).
  const tierOrder: number[] = [];
  const indicesOf = new Map<number, number[]>();
  input.lengths.forEach((len, i) => {
    if (!(len.Lc_ft > 0)) return;
    let list = indicesOf.get(len.tier);
    if (!list) {
      indicesOf.set(len.tier, (list = []));
      tierOrder.push(len.tier);
    }
    list.push(i);
  });

  const shapeAt = new Map<number, CompressionConstants | null>();
  const tiers: ColumnTierResult[] = [];
  let aboveKip = 0;
  let minWeightPlf = 0;
  for (const tier of tierOrder) {
    const indices = indicesOf.get(tier)!;
    let longestIn = 0;
    for (const i of indices) longestIn = Math.max(longestIn, input.lengths[i].Lc_ft * IN_PER_FT);
    const tooSlender = (k: CompressionConstants) => slendernessE2(k, longestIn) > LC_OVER_R_PREFERRED_MAX;
    const lockedLabel = input.locked?.get(tier) ?? null;
    let chosen: CompressionConstants | null = null;
    let failure: string | null = null;
    let lighter: ColumnTierResult['lighter'] = null;
    let ev: TierEvaluation | null = null;
    if (lockedLabel) {
      chosen = compressionConstantsFor(lockedLabel, input.Fy_ksi) ?? null;
      if (!chosen) failure = `locked size ${lockedLabel} is not a W-shape in AISC Shapes Database v15.0`;
      else ev = evaluateTier(input, chosen, indices, aboveKip, selfWeight);
      if (ev && !ev.passes) failure = `locked size ${lockedLabel} reaches ratio ${ev.ratio.toFixed(3)}`;
    } else {
      let best: { k: CompressionConstants; ev: TierEvaluation } | null = null;
      let previous: { k: CompressionConstants; ev: TierEvaluation } | null = null;
      // Pr without this tier's own weight bounds Pr from below; φc Fy Ag (Lc = 0) bounds Pc from above.
      let prLowerKip = 0;
      for (const i of indices) {
        const len = input.lengths[i];
        prLowerKip = Math.max(prLowerKip, requiredAxialKip(input.method, len.D_kip + aboveKip, len.L_kip, len.Lr_kip, len.S_kip));
      }
      const squash = pcTableFor(candidates, input.method, 0);
      for (let c = 0; c < candidates.length; c++) {
        const k = candidates[c];
        if (!input.allowHeavierAbove && k.weightPlf < minWeightPlf) continue;
        if (tooSlender(k)) continue;
        let pcMax = squash[c];
        if (pcMax !== pcMax) pcMax = squash[c] = availableCompressionKip(k, 0, input.method);
        if (pcMax < prLowerKip) continue; // cannot pass at any length
        const e = evaluateTier(input, k, indices, aboveKip, selfWeight, candidates, c);
        if (e.passes) {
          chosen = k;
          ev = e;
          if (previous) lighter = { shape: previous.k.label, ratio: previous.ev.ratio };
          break;
        }
        previous = { k, ev: e };
        if (!best || e.ratio < best.ev.ratio) best = { k, ev: e };
      }
      let slenderOnly = false;
      if (!chosen) {
        // Nothing passed: evaluate every allowed shape to report the best ratio reached.
        for (let c = 0; c < candidates.length; c++) {
          const k = candidates[c];
          if (!input.allowHeavierAbove && k.weightPlf < minWeightPlf) continue;
          if (tooSlender(k)) continue;
          const e = evaluateTier(input, k, indices, aboveKip, selfWeight, candidates, c);
          if (!best || e.ratio < best.ev.ratio) best = { k, ev: e };
        }
      }
      if (!chosen && !best) {
        // Every allowed shape is over Lc/r 200 here: report the lightest that carries the load.
        for (let c = 0; c < candidates.length && !best; c++) {
          const k = candidates[c];
          if (!input.allowHeavierAbove && k.weightPlf < minWeightPlf) continue;
          const e = evaluateTier(input, k, indices, aboveKip, selfWeight, candidates, c);
          if (e.passes) best = { k, ev: { ...e, passes: false } };
        }
        slenderOnly = best !== null;
      }
      if (!chosen && best && slenderOnly) {
        chosen = best.k;
        ev = best.ev;
        failure = `no ${input.series.join('/')} shape has Lc/r ≤ ${LC_OVER_R_PREFERRED_MAX} over ${(longestIn / IN_PER_FT).toFixed(1)} ft (AISC 360-16 E2 User Note, taken as a limit); ${best.k.label} carries the load at Lc/r ${slendernessE2(best.k, longestIn).toFixed(0)}`;
      } else if (!chosen && best) {
        chosen = best.k;
        ev = best.ev;
        failure = `no ${input.series.join('/')} shape${minWeightPlf > 0 && !input.allowHeavierAbove ? ` of at least ${minWeightPlf} lb/ft (the tier above)` : ''} passes; best ratio ${best.ev.ratio.toFixed(3)} with ${best.k.label}`;
      } else if (!chosen) {
        failure = `no ${input.series.join('/')} shape is available`;
      }
      if (chosen && !input.allowHeavierAbove) minWeightPlf = Math.max(minWeightPlf, chosen.weightPlf);
    }
    shapeAt.set(tier, chosen);
    if (chosen && selfWeight) for (const i of indices) aboveKip += (chosen.weightPlf * input.lengths[i].Lc_ft) / 1000;
    tiers.push({
      tier,
      shape: chosen?.label ?? null,
      weight_plf: chosen?.weightPlf ?? 0,
      locked: lockedLabel !== null,
      passes: ev?.passes ?? false,
      ratio: ev?.ratio ?? null,
      governingLevel: ev ? input.lengths[ev.governingIndex].level : null,
      failure: ev?.passes ? null : failure,
      lighter,
      LcOverR: chosen ? slendernessE2(chosen, longestIn) : null,
    });
  }

  // The per-length results with their full working, top down.
  let swKip = 0;
  let weight_lb = 0;
  const lengths: ColumnLengthResult[] = input.lengths.map((len) => {
    const k = len.Lc_ft > 0 ? shapeAt.get(len.tier) ?? null : null;
    if (k) {
      weight_lb += k.weightPlf * len.Lc_ft;
      if (selfWeight) swKip += (k.weightPlf * len.Lc_ft) / 1000;
    }
    const pr = columnRequiredAxialKip(input.method, len.D_kip + swKip, len.L_kip, len.Lr_kip, len.S_kip);
    if (!k) {
      return { level: len.level, tier: len.tier, shape: null, Lc_ft: len.Lc_ft, selfWeight_kip: swKip, Pr_kip: pr.Pr_kip, Pc_kip: null, Pn_kip: null, ratio: null, passes: !(len.Lc_ft > 0), governing: pr.combination, strength: null };
    }
    const lcIn = len.Lc_ft * IN_PER_FT;
    const strength = compressionStrengthE1(k, lcIn, lcIn, input.method);
    const ratio = pr.Pr_kip / strength.pcKip;
    return {
      level: len.level, tier: len.tier, shape: k.label, Lc_ft: len.Lc_ft, selfWeight_kip: swKip,
      Pr_kip: pr.Pr_kip, Pc_kip: strength.pcKip, Pn_kip: strength.pnKip, ratio, passes: ratio <= 1,
      governing: pr.combination, strength,
    };
  });
  return { lengths, tiers, weight_lb, passes: tiers.every((t) => t.passes) };
}
