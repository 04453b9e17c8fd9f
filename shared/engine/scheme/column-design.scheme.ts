/**
 * Gravity columns of a scheme (design-basis §8, calc-interface "Additions"): the column stack
 * of the takedown, cut into lengths between the column's levels (Lc = storey height, K = 1.0
 * for pinned gravity columns), grouped into tiers by splice levels, each tier sized or checked
 * by AISC 360-16 Chapter E (sizing/column-design.ts).
 *
 * A length runs from its level down to the next lower level of the column; the lowest length
 * runs down to the highest plan level below it (a column that starts on framing) or, when no
 * level lies below, to elevation 0 ft. A level passed without framing lengthens the piece
 * (no brace there: the conservative reading).
 */
import type { Plan, PlanColumn } from '../../schemas/plan.schema';
import { planProblem, type PlanProblem } from '../../schemas/plan-problem.schema';
import type { ColumnTakedown } from '../takedown/column-stack.takedown';
import { assignTiers, spliceLevelsOf, DEFAULT_STOREYS_PER_TIER, type TierLength } from '../sizing/column-tiers';
import { designColumn, DEFAULT_COLUMN_SERIES, LC_OVER_R_PREFERRED_MAX, type ColumnDesignResult, type ColumnTierResult } from '../sizing/column-design';
import { normalizeShapeLabel } from '../../catalog/w-shapes.catalog';

export interface ColumnLength extends TierLength {
  Lc_ft: number;
}

/** Lengths of a column, top down, for its stack levels (already sorted top down). */
export function columnLengths(plan: Plan, levelsTopDown: readonly string[]): ColumnLength[] {
  const elevation = new Map(plan.levels.map((l) => [l.id, l.elevation_ft]));
  const planLevelsDown = [...plan.levels].sort((a, b) => b.elevation_ft - a.elevation_ft);
  return levelsTopDown.map((level, i) => {
    const top = elevation.get(level)!;
    let bottomLevel: string | null = i + 1 < levelsTopDown.length ? levelsTopDown[i + 1] : null;
    if (bottomLevel === null) bottomLevel = planLevelsDown.find((l) => l.elevation_ft < top)?.id ?? null;
    const bottom = bottomLevel === null ? 0 : elevation.get(bottomLevel)!;
    return { level, bottomLevel, Lc_ft: Math.max(0, top - bottom) };
  });
}

/** Splice levels for one column: its own, else the project's (those it can use), else null (every N storeys). */
export function effectiveSpliceLevels(plan: Plan, column: PlanColumn): string[] | null {
  if (column.spliceLevels) return column.spliceLevels;
  const project = plan.designBasis.columns?.spliceLevels;
  return project ? project.filter((l) => column.levels.includes(l)) : null;
}

export interface SchemeColumnDesign {
  design: ColumnDesignResult;
  lengths: ColumnLength[];
  spliceLevels: string[];
  locked: string | null;
}

/**
 * Column designs by their exact input (designColumn is a pure function of it): columns with
 * the same lengths, tiers and loads share one design, and a re-design after an edit designs
 * again only the columns whose loads changed. The key holds every input number in its
 * shortest round-trip text, so two inputs share a design only when they are equal. The
 * results are read, never mutated, by schemeColumns. Bounded: cleared when it grows past
 * COLUMN_MEMO_LIMIT entries.
 */
const columnMemo = new Map<string, ColumnDesignResult>();
const COLUMN_MEMO_LIMIT = 1024;

function memoisedColumnDesign(input: Parameters<typeof designColumn>[0]): ColumnDesignResult {
  // Every input of designColumn is in the key: the locked size of each tier included.
  let key = `${input.method}|${input.Fy_ksi}|${input.series.join(',')}|${input.allowHeavierAbove ? 1 : 0}|`;
  for (const [tier, shape] of input.locked ?? []) key += `${tier}=${shape ?? ''};`;
  for (const l of input.lengths) key += `|${l.level}\u0000${l.Lc_ft},${l.tier},${l.D_kip},${l.L_kip},${l.Lr_kip},${l.S_kip}`;
  let design = columnMemo.get(key);
  if (!design) {
    design = designColumn(input);
    if (columnMemo.size >= COLUMN_MEMO_LIMIT) columnMemo.clear();
    columnMemo.set(key, design);
  }
  return design;
}

/** Design every column of the stack; problems name the column. */
export function designSchemeColumns(plan: Plan, stack: readonly ColumnTakedown[]): { columns: Map<string, SchemeColumnDesign>; problems: PlanProblem[] } {
  const settings = plan.designBasis.columns ?? {};
  const series = settings.series ?? DEFAULT_COLUMN_SERIES;
  const storeys = settings.storeysPerTier ?? DEFAULT_STOREYS_PER_TIER;
  const byId = new Map(plan.columns.map((c) => [c.id, c]));
  const columns = new Map<string, SchemeColumnDesign>();
  const problems: PlanProblem[] = [];
  for (const c of stack) {
    const column = byId.get(c.id);
    if (!column) continue;
    if (c.levels.length === 0) {
      problems.push(planProblem('error', 'column-no-levels', `Column ${c.id}: has no levels, so it carries nothing and is not sized`, { elementId: c.id }));
      continue;
    }
    const lengths = columnLengths(plan, c.levels.map((l) => l.level));
    const tiers = assignTiers(lengths, effectiveSpliceLevels(plan, column), storeys);
    const lockedShape = column.shape && column.shape.trim() !== '' ? normalizeShapeLabel(column.shape) : null;
    const locked = new Map<number, string | null>();
    if (lockedShape) for (const t of tiers) locked.set(t, lockedShape);
    // A locked tier size (columns[].tierShapes) locks the tier holding the length below its level;
    // it takes precedence over the column's size. Two locks in one tier: the later entry is kept.
    for (const t of column.tierShapes ?? []) {
      const i = c.levels.findIndex((l) => l.level === t.level);
      if (i >= 0 && t.shape.trim() !== '') locked.set(tiers[i], normalizeShapeLabel(t.shape));
    }
    const input = {
      method: plan.designBasis.method,
      Fy_ksi: plan.designBasis.Fy_ksi,
      series,
      allowHeavierAbove: settings.allowHeavierAbove ?? false,
      locked,
      lengths: c.levels.map((l, i) => ({ level: l.level, Lc_ft: lengths[i].Lc_ft, tier: tiers[i], D_kip: l.D_kip, L_kip: l.L_kip, Lr_kip: l.Lr_kip, S_kip: l.S_kip })),
    };
    const design = memoisedColumnDesign(input);
    for (const t of design.tiers) {
      if (!t.passes) problems.push(planProblem('error', 'column-fails', `Column ${c.id}: tier ${t.tier}${tierSpan(design, t)} — ${t.failure ?? 'does not pass'}`, { elementId: c.id }));
      else if (t.locked && t.LcOverR !== null && t.LcOverR > LC_OVER_R_PREFERRED_MAX) {
        problems.push(planProblem('warning', 'column-slender', `Column ${c.id}: tier ${t.tier}${tierSpan(design, t)} — locked size ${t.shape} has Lc/r = ${t.LcOverR.toFixed(0)}, over the ${LC_OVER_R_PREFERRED_MAX} that AISC 360-16 E2 (User Note) prefers; a size chosen by Baywright keeps within it`, { elementId: c.id }));
      }
    }
    columns.set(c.id, { design, lengths, spliceLevels: spliceLevelsOf(lengths, tiers), locked: lockedShape });
  }
  return { columns, problems };
}

/** " (L2 to L3)": the levels at the bottom and top of a tier. */
function tierSpan(design: ColumnDesignResult, t: ColumnTierResult): string {
  const of = design.lengths.filter((l) => l.tier === t.tier);
  return of.length ? ` (up to ${of[0].level})` : '';
}

/** One entry of `columns[].levels[]` in the scheme result: the length below that level. */
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
  /** Factored axial load on this length, including column self weight above its bottom (governing combination). */
  Pr_kip: number;
  /** Governing combination of the stack loads alone (without column self weight). */
  combination: string;
  /** The stack's factored load without column self weight. */
  stackPr_kip: number;
  shape: string | null;
  /** Tier number, 1 = lowest; null for a length that is not sized (no length below the level). */
  tier: number | null;
  Lc_ft: number;
  /** Column self weight carried at the bottom of this length (unfactored dead, kip). */
  selfWeight_kip: number;
  /** φc Pn (LRFD) or Pn/Ωc (ASD). */
  Pc_kip: number | null;
  Pn_kip: number | null;
  ratio: number | null;
  passes: boolean;
  /** Governing combination of the column check. */
  governing: string;
  limitState: string | null;
  clause: string | null;
  equation: string | null;
  Fcr_ksi: number | null;
  /** Lc/r about the governing axis. */
  slenderness: number | null;
  /** True where a splice sits at the bottom of this length (a new tier starts here). */
  spliceBelow: boolean;
}

export interface SchemeColumnTier extends Omit<ColumnTierResult, 'LcOverR'> {
  /** Bottom and top levels of the tier. */
  fromLevel: string | null;
  toLevel: string;
  length_ft: number;
  weight_lb: number;
}

export interface SchemeColumn {
  id: string;
  x_ft: number;
  y_ft: number;
  levels: SchemeColumnLevel[];
  tiers: SchemeColumnTier[];
  spliceLevels: string[];
  locked: string | null;
  weight_lb: number;
  passes: boolean;
}

export interface SchemeColumnTotals {
  columnWeight_lb: number;
  /** Column pieces: one per tier (a shipping piece between splices). */
  columnPieces: number;
  /** Column weight by level: the lengths below each level. */
  byLevel: Map<string, { weight_lb: number; pieces: number }>;
}

/** The scheme's `columns` and column totals from the takedown's stack. */
export function schemeColumns(plan: Plan, stack: readonly ColumnTakedown[]): { columns: SchemeColumn[]; totals: SchemeColumnTotals; problems: PlanProblem[] } {
  const { columns: designs, problems } = designSchemeColumns(plan, stack);
  const byId = new Map(plan.columns.map((c) => [c.id, c]));
  const totals: SchemeColumnTotals = { columnWeight_lb: 0, columnPieces: 0, byLevel: new Map() };
  const columns = stack.map((c): SchemeColumn => {
    const pc = byId.get(c.id);
    const d = designs.get(c.id);
    const levels = c.levels.map((l, i): SchemeColumnLevel => {
      const r = d?.design.lengths[i];
      const len = d?.lengths[i];
      const s = r?.strength ?? null;
      const gov = s ? (s.governingAxis === 'x' ? s.x : s.y) : null;
      const sized = Boolean(r && r.shape);
      const nextBelow = d?.design.lengths[i + 1];
      return {
        level: l.level,
        D_kip: l.D_kip,
        L_kip: l.L_kip,
        Lr_kip: l.Lr_kip,
        S_kip: l.S_kip,
        Lunreduced_kip: l.Lunreduced_kip,
        tributaryArea_ft2: l.reducibleArea_ft2 > 0 ? l.reducibleArea_ft2 : l.tributaryArea_ft2,
        KLL: l.KLL,
        liveReductionFactor: l.liveReductionFactor,
        Pr_kip: r ? r.Pr_kip : l.Pr_kip,
        combination: l.combination,
        stackPr_kip: l.Pr_kip,
        shape: r?.shape ?? null,
        tier: sized ? r!.tier : null,
        Lc_ft: len?.Lc_ft ?? 0,
        selfWeight_kip: r?.selfWeight_kip ?? 0,
        Pc_kip: r?.Pc_kip ?? null,
        Pn_kip: r?.Pn_kip ?? null,
        ratio: r?.ratio ?? null,
        passes: r ? r.passes : false,
        governing: r?.governing ?? l.combination,
        limitState: s?.limitState ?? null,
        clause: s?.clause ?? null,
        equation: s?.equation ?? null,
        Fcr_ksi: gov?.fcrKsi ?? null,
        slenderness: gov?.slenderness ?? null,
        spliceBelow: Boolean(r && nextBelow && nextBelow.tier !== r.tier && len?.bottomLevel),
      };
    });
    const tiers: SchemeColumnTier[] = (d?.design.tiers ?? []).map((t) => {
      const of = levels.filter((l) => l.tier === t.tier);
      const bottomIndex = levels.indexOf(of[of.length - 1]);
      const length_ft = of.reduce((a, l) => a + l.Lc_ft, 0);
      // Written out in ColumnTierResult's key order (a spread literal was slow on this path).
      return {
        tier: t.tier, shape: t.shape, weight_plf: t.weight_plf, locked: t.locked, passes: t.passes, ratio: t.ratio,
        governingLevel: t.governingLevel, failure: t.failure, lighter: t.lighter,
        toLevel: of[0].level, fromLevel: d!.lengths[bottomIndex].bottomLevel, length_ft, weight_lb: t.weight_plf * length_ft,
      };
    });
    for (const l of levels) {
      if (!l.shape) continue;
      const w = (tiers.find((t) => t.tier === l.tier)?.weight_plf ?? 0) * l.Lc_ft;
      let b = totals.byLevel.get(l.level);
      if (!b) totals.byLevel.set(l.level, (b = { weight_lb: 0, pieces: 0 }));
      b.weight_lb += w;
    }
    // A tier's piece is counted at the level of its lowest length.
    for (const t of tiers) {
      const of = levels.filter((l) => l.tier === t.tier);
      const b = totals.byLevel.get(of[of.length - 1].level);
      if (b) b.pieces++;
    }
    const weight_lb = d?.design.weight_lb ?? 0;
    totals.columnWeight_lb += weight_lb;
    totals.columnPieces += tiers.length;
    return {
      id: c.id,
      x_ft: pc?.x_ft ?? 0,
      y_ft: pc?.y_ft ?? 0,
      levels,
      tiers,
      spliceLevels: d?.spliceLevels ?? [],
      locked: d?.locked ?? null,
      weight_lb,
      passes: d ? d.design.passes : false,
    };
  });
  return { columns, totals, problems };
}
