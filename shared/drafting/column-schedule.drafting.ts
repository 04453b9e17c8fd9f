/**
 * The column schedule (design-basis §8): columns across, levels down (top first), each cell the
 * column length below that level with its size, tier, loads and check, and a splice mark where
 * a new tier starts at the floor below the length. Pure: reads a stored design and the plan.
 */
import type { Plan } from '../schemas/plan.schema';
import { gridIntersectionLabel } from './grid-location.drafting';
import { DEFAULT_COLUMN_SERIES, DEFAULT_STOREYS_PER_TIER } from '../engine/index';

export interface ColumnScheduleCell {
  shape: string | null;
  tier: number | null;
  Lc_ft: number;
  D_kip: number;
  L_kip: number;
  Pr_kip: number;
  Pc_kip: number | null;
  ratio: number | null;
  governing: string;
  /** A splice at the floor at the bottom of this length (a new tier starts here). */
  spliceBelow: boolean;
  passes: boolean;
  /** Roof live and snow carried (kip, unfactored), for the column's sheet. */
  Lr_kip: number;
  S_kip: number;
  /** Column self weight carried at the bottom of this length (kip, unfactored dead, in Pr). */
  selfWeight_kip: number;
  /** The level at the bottom of this length; null where it runs down to elevation 0 ft. */
  bottomLevel: string | null;
}

/** One tier of a column: the piece between splices. */
export interface ColumnScheduleTier {
  tier: number;
  shape: string | null;
  locked: boolean;
  /** Highest ratio over the tier's lengths and the level of that length. */
  ratio: number | null;
  governingLevel: string | null;
  /** Governing combination at the governing length. */
  governing: string;
  passes: boolean;
  failure: string | null;
  toLevel: string;
  fromLevel: string | null;
  weight_lb: number;
}

export interface ColumnScheduleColumn {
  id: string;
  /** Grid intersection (e.g. "B-2") where the column stands on one, else its id. */
  mark: string;
  weight_lb: number;
  locked: string | null;
  /** One cell per schedule level (top first); null where the column does not reach it. */
  cells: (ColumnScheduleCell | null)[];
  /** Tiers top down (absent from a design stored before tiers were kept). */
  tiers: ColumnScheduleTier[];
  /** The column's levels (plan order) and the splice levels the design used. */
  levelIds: string[];
  spliceLevels: string[];
  /** The column's own splice levels (null: it follows the project's or every N storeys). */
  ownSpliceLevels: string[] | null;
  /** Locked tier sizes of the plan file (columns[].tierShapes). */
  tierShapes: { level: string; shape: string }[];
}

/** The column settings the design used (designBasis.columns with its defaults). */
export interface ColumnScheduleSettings {
  method: 'LRFD' | 'ASD';
  Fy_ksi: number;
  series: string[];
  storeysPerTier: number;
  allowHeavierAbove: boolean;
  /** Splice levels for all columns (null: every N storeys). */
  spliceLevels: string[] | null;
}

export interface ColumnSchedule {
  levels: { id: string; name: string; elevation_ft: number }[];
  columns: ColumnScheduleColumn[];
  columnWeight_lb: number;
  settings: ColumnScheduleSettings;
}

/** The design fields the schedule reads (the stored `calc plan` output). */
export interface ColumnScheduleDesignInput {
  columns?: {
    id: string;
    weight_lb?: number;
    locked?: string | null;
    levels: { level: string; shape?: string | null; tier?: number | null; Lc_ft?: number; D_kip: number; L_kip: number; Lr_kip?: number; S_kip?: number; selfWeight_kip?: number; Pr_kip: number; Pc_kip?: number | null; ratio?: number | null; governing?: string; combination?: string; spliceBelow?: boolean; passes?: boolean }[];
    tiers?: { tier: number; shape: string | null; locked: boolean; ratio: number | null; governingLevel: string | null; passes: boolean; failure: string | null; toLevel: string; fromLevel: string | null; weight_lb: number }[];
    spliceLevels?: string[];
  }[];
  totals?: { columnWeight_lb?: number };
}



export function buildColumnSchedule(design: ColumnScheduleDesignInput, plan: Pick<Plan, 'levels' | 'columns' | 'grids'> & { designBasis?: Plan['designBasis'] }): ColumnSchedule {
  const levels = [...plan.levels].sort((a, b) => b.elevation_ft - a.elevation_ft).map((l) => ({ id: l.id, name: l.name, elevation_ft: l.elevation_ft }));
  const position = new Map(plan.columns.map((c) => [c.id, c]));
  const columns = (design.columns ?? []).map((c): ColumnScheduleColumn => {
    const at = position.get(c.id);
    const byLevel = new Map(c.levels.map((l) => [l.level, l]));
    const lowest = c.tiers?.find((t) => t.tier === 1) ?? null;
    const bottomOf = (i: number): string | null => (i + 1 < c.levels.length ? c.levels[i + 1].level : lowest?.fromLevel ?? null);
    const indexOf = new Map(c.levels.map((l, i) => [l.level, i]));
    const tiers = (c.tiers ?? []).map((t): ColumnScheduleTier => {
      const g = t.governingLevel ? byLevel.get(t.governingLevel) : undefined;
      return {
        tier: t.tier, shape: t.shape, locked: t.locked, ratio: t.ratio, governingLevel: t.governingLevel, governing: g?.governing ?? g?.combination ?? '',
        passes: t.passes, failure: t.failure, toLevel: t.toLevel, fromLevel: t.fromLevel, weight_lb: t.weight_lb,
      };
    });
    return {
      id: c.id,
      mark: (at && gridIntersectionLabel(at.x_ft, at.y_ft, plan.grids)) || c.id,
      weight_lb: c.weight_lb ?? 0,
      locked: c.locked ?? null,
      cells: levels.map((lv) => {
        const l = byLevel.get(lv.id);
        if (!l) return null;
        return {
          shape: l.shape ?? null, tier: l.tier ?? null, Lc_ft: l.Lc_ft ?? 0, D_kip: l.D_kip, L_kip: l.L_kip, Pr_kip: l.Pr_kip,
          Pc_kip: l.Pc_kip ?? null, ratio: l.ratio ?? null, governing: l.governing ?? l.combination ?? '', spliceBelow: Boolean(l.spliceBelow), passes: l.passes ?? false,
          Lr_kip: l.Lr_kip ?? 0, S_kip: l.S_kip ?? 0, selfWeight_kip: l.selfWeight_kip ?? 0, bottomLevel: bottomOf(indexOf.get(lv.id)!),
        };
      }),
      tiers,
      levelIds: at?.levels ?? c.levels.map((l) => l.level),
      spliceLevels: c.spliceLevels ?? [],
      ownSpliceLevels: at?.spliceLevels ?? null,
      tierShapes: (at?.tierShapes ?? []).map((t) => ({ level: t.level, shape: t.shape })),
    };
  });
  const basis = plan.designBasis;
  const cs = basis?.columns ?? {};
  const settings: ColumnScheduleSettings = {
    method: basis?.method ?? 'LRFD',
    Fy_ksi: basis?.Fy_ksi ?? 50,
    series: [...(cs.series ?? DEFAULT_COLUMN_SERIES)],
    storeysPerTier: cs.storeysPerTier ?? DEFAULT_STOREYS_PER_TIER,
    allowHeavierAbove: cs.allowHeavierAbove ?? false,
    spliceLevels: cs.spliceLevels ?? null,
  };
  return { levels, columns, columnWeight_lb: design.totals?.columnWeight_lb ?? columns.reduce((a, c) => a + c.weight_lb, 0), settings };
}
