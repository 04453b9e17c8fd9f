/**
 * The working of one gravity column, tier by tier, for the column's sheet (design-basis §8):
 * per length the factored axial load of every gravity combination (ASCE 7-16 §2.3.1 / §2.4.1)
 * with the column's own weight above the length's bottom as dead load, Lc from the level
 * elevations (K = 1.0), Lc/r, Fe (AISC 360-16 Eq. E3-4) and Fcr (Eq. E3-2 or E3-3 against
 * 4.71 sqrt(E/Fy)) about both axes, the effective area of E7 where an element is slender,
 * φc Pn or Pn/Ωc (E1) and the ratio; per tier the lighter allowed shapes tried and why each
 * fails. The same arithmetic as the sizing (sizing/column-design.ts): the Pr and Pc printed
 * here equal the design's.
 */
import { compressionConstantsFor, compressionStrengthE1, type CompressionStrength } from '../design/aisc360/chapter-e/e1';
import type { DesignMethod } from '../design/aisc360/resistance-factors';
import { loadCombinations, type LoadCase } from '../loads/combinations';
import { E_KSI, IN_PER_FT } from '../units/units.constants';
import { slendernessLimitE3 } from '../design/aisc360/chapter-e/e3.equations';
import { columnCandidates, slendernessE2, LC_OVER_R_PREFERRED_MAX } from './column-design';

export interface ColumnWorkingLengthInput {
  level: string;
  /** The level at the bottom of the length (null: elevation 0 ft). */
  bottomLevel?: string | null;
  Lc_ft: number;
  /** Tier number (1 = lowest); null where the length is not sized. */
  tier: number | null;
  D_kip: number;
  L_kip: number;
  Lr_kip: number;
  S_kip: number;
  /** Column self weight carried at the bottom of this length (kip), as the design counted it. */
  selfWeight_kip: number;
}

export interface ColumnWorkingInput {
  method: DesignMethod;
  Fy_ksi: number;
  series: readonly string[];
  allowHeavierAbove?: boolean;
  /** Lengths top down, as in the column stack. */
  lengths: readonly ColumnWorkingLengthInput[];
  /** The design's tiers (any order). */
  tiers: readonly { tier: number; shape: string | null; locked: boolean }[];
  /** How many of the next lighter shapes to show per tier (default 4). */
  lighterShown?: number;
}

export interface ColumnCombinationPr {
  name: string;
  clause: string;
  Pr_kip: number;
}

export interface ColumnWorkingLength {
  level: string;
  bottomLevel: string | null;
  Lc_ft: number;
  selfWeight_kip: number;
  /** Every gravity combination of the cases present, with D including the column's own weight. */
  combinations: ColumnCombinationPr[];
  Pr_kip: number;
  governing: string;
  strength: CompressionStrength;
  ratio: number;
  passes: boolean;
}

export interface ColumnLighterTry {
  shape: string;
  weight_plf: number;
  /** Worst ratio over the tier's lengths (with that shape's own weight), null when not evaluated. */
  ratio: number | null;
  /** Where it fails: the level of the worst length, null when it was ruled out before. */
  failsAt: string | null;
  reason: string;
}

export interface ColumnWorkingTier {
  tier: number;
  shape: string | null;
  locked: boolean;
  /** Top and bottom levels of the tier. */
  toLevel: string;
  fromLevel: string | null;
  lengths: ColumnWorkingLength[];
  ratio: number | null;
  governingLevel: string | null;
  passes: boolean;
  lighter: ColumnLighterTry[];
}

export interface ColumnWorking {
  method: DesignMethod;
  Fy_ksi: number;
  series: string[];
  /** 4.71 sqrt(E/Fy), the limit between Eq. E3-2 and Eq. E3-3. */
  e3Limit: number;
  /** Tiers top down. */
  tiers: ColumnWorkingTier[];
}

function presentCases(D: number, L: number, Lr: number, S: number): LoadCase[] {
  const out: LoadCase[] = [];
  if (D !== 0) out.push('D');
  if (L !== 0) out.push('L');
  if (Lr !== 0) out.push('Lr');
  if (S !== 0) out.push('S');
  return out.length ? out : ['D'];
}

/** Pr of every combination, largest first kept in clause order; the governing one is the largest. */
export function columnCombinations(method: DesignMethod, D: number, L: number, Lr: number, S: number): { list: ColumnCombinationPr[]; Pr_kip: number; governing: string } {
  const list = loadCombinations(method, presentCases(D, L, Lr, S)).map((c) => ({
    name: c.name,
    clause: c.clause,
    Pr_kip: 0 + c.factors.D * D + c.factors.L * L + c.factors.Lr * Lr + c.factors.S * S,
  }));
  let best = list[0];
  for (const c of list) if (c.Pr_kip > best.Pr_kip + 1e-12) best = c;
  return { list, Pr_kip: best?.Pr_kip ?? 0, governing: best?.name ?? (method === 'LRFD' ? '1.4D' : 'D') };
}

/** The working of one column (see the file comment). Throws nothing: unknown shapes yield an unsized tier. */
export function columnWorking(input: ColumnWorkingInput): ColumnWorking {
  const { method } = input;
  const shown = input.lighterShown ?? 4;
  const candidates = columnCandidates(input.series, input.Fy_ksi);
  const tierById = new Map(input.tiers.map((t) => [t.tier, t]));
  const order: number[] = [];
  const indicesOf = new Map<number, number[]>();
  input.lengths.forEach((len, i) => {
    if (len.tier === null || !(len.Lc_ft > 0)) return;
    let list = indicesOf.get(len.tier);
    if (!list) {
      indicesOf.set(len.tier, (list = []));
      order.push(len.tier);
    }
    list.push(i);
  });

  const tiers: ColumnWorkingTier[] = [];
  // Heaviest sized (unlocked) shape above: a tier below is never lighter (common practice).
  let minWeightPlf = 0;
  let minFrom: string | null = null;
  for (const tierNo of order) {
    const indices = indicesOf.get(tierNo)!;
    const t = tierById.get(tierNo);
    const k = t?.shape ? compressionConstantsFor(t.shape, input.Fy_ksi) : undefined;
    const first = indices[0];
    const aboveKip = first > 0 ? input.lengths[first - 1].selfWeight_kip : 0;
    const lengths: ColumnWorkingLength[] = [];
    // The tier's longest length, where Lc/r is highest (AISC 360-16 E2 User Note: ≤ 200, a limit when sizing).
    let longest = indices[0];
    for (const i of indices) if (input.lengths[i].Lc_ft > input.lengths[longest].Lc_ft) longest = i;
    const longestIn = input.lengths[longest].Lc_ft * IN_PER_FT;
    if (k) {
      for (const i of indices) {
        const len = input.lengths[i];
        const combos = columnCombinations(method, len.D_kip + len.selfWeight_kip, len.L_kip, len.Lr_kip, len.S_kip);
        const lcIn = len.Lc_ft * IN_PER_FT;
        const strength = compressionStrengthE1(k, lcIn, lcIn, method);
        const ratio = combos.Pr_kip / strength.pcKip;
        lengths.push({
          level: len.level, bottomLevel: len.bottomLevel ?? null, Lc_ft: len.Lc_ft, selfWeight_kip: len.selfWeight_kip,
          combinations: combos.list, Pr_kip: combos.Pr_kip, governing: combos.governing, strength, ratio, passes: ratio <= 1,
        });
      }
    }
    let worst: ColumnWorkingLength | null = null;
    for (const l of lengths) if (!worst || l.ratio > worst.ratio) worst = l;

    // The lighter shapes tried, nearest first, each with the arithmetic of the sizing.
    const lighter: ColumnLighterTry[] = [];
    if (k && !t?.locked) {
      // Candidates are lightest first: the ones sorted before the chosen shape were tried before it.
      const at = candidates.findIndex((c) => c.label === k.label);
      const lighterList = candidates.slice(0, at < 0 ? 0 : at).reverse();
      for (const c of lighterList.slice(0, shown)) {
        if (!input.allowHeavierAbove && c.weightPlf < minWeightPlf) {
          lighter.push({ shape: c.label, weight_plf: c.weightPlf, ratio: null, failsAt: null, reason: `lighter than the tier above (${minFrom}); a tier is never lighter than the one above it (common practice)` });
          continue;
        }
        const lcOverR = slendernessE2(c, longestIn);
        if (lcOverR > LC_OVER_R_PREFERRED_MAX) {
          lighter.push({ shape: c.label, weight_plf: c.weightPlf, ratio: null, failsAt: input.lengths[longest].level, reason: `Lc/r = ${lcOverR.toFixed(0)} > ${LC_OVER_R_PREFERRED_MAX} below ${input.lengths[longest].level} (AISC 360-16 E2 User Note, taken as a limit when sizing)` });
          continue;
        }
        let sw = aboveKip;
        let bad: { ratio: number; level: string; pr: number; pc: number } | null = null;
        for (const i of indices) {
          const len = input.lengths[i];
          sw += (c.weightPlf * len.Lc_ft) / 1000;
          const pr = columnCombinations(method, len.D_kip + sw, len.L_kip, len.Lr_kip, len.S_kip).Pr_kip;
          const lcIn = len.Lc_ft * IN_PER_FT;
          const pc = compressionStrengthE1(c, lcIn, lcIn, method).pcKip;
          const ratio = pc > 0 ? pr / pc : Number.POSITIVE_INFINITY;
          if (!bad || ratio > bad.ratio) bad = { ratio, level: len.level, pr, pc };
        }
        const cap = method === 'LRFD' ? 'φcPn' : 'Pn/Ωc';
        lighter.push(
          bad && bad.ratio > 1
            ? { shape: c.label, weight_plf: c.weightPlf, ratio: bad.ratio, failsAt: bad.level, reason: `Pr ${bad.pr.toFixed(1)} kip > ${cap} ${bad.pc.toFixed(1)} kip below ${bad.level}` }
            : { shape: c.label, weight_plf: c.weightPlf, ratio: bad?.ratio ?? null, failsAt: null, reason: 'passes on these loads but was not chosen (see the design problems)' },
        );
      }
    }
    if (k && !t?.locked && !input.allowHeavierAbove && k.weightPlf > minWeightPlf) {
      minWeightPlf = k.weightPlf;
      minFrom = k.label;
    }
    const bottomIndex = indices[indices.length - 1];
    tiers.push({
      tier: tierNo,
      shape: k?.label ?? t?.shape ?? null,
      locked: t?.locked ?? false,
      toLevel: input.lengths[first].level,
      fromLevel: input.lengths[bottomIndex].bottomLevel ?? null,
      lengths,
      ratio: worst?.ratio ?? null,
      governingLevel: worst?.level ?? null,
      // A sized shape over Lc/r 200 is the design's report that nothing fits within it; a locked one passes on strength.
      passes: lengths.length > 0 && lengths.every((l) => l.passes) && (t?.locked === true || !k || slendernessE2(k, longestIn) <= LC_OVER_R_PREFERRED_MAX),
      lighter,
    });
  }
  return {
    method,
    Fy_ksi: input.Fy_ksi,
    series: [...input.series],
    e3Limit: slendernessLimitE3(E_KSI, input.Fy_ksi),
    tiers,
  };
}
