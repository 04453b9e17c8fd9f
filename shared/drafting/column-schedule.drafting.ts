/**
 * The column schedule (design-basis §8): columns across, levels down (top first), each cell the
 * column length below that level with its size, tier, loads and check, and a splice mark where
 * a new tier starts at the floor below the length. Pure: reads a stored design and the plan.
 */
import type { Plan } from '../schemas/plan.schema';
import { gridIntersectionLabel } from './grid-location.drafting';

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
}

export interface ColumnScheduleColumn {
  id: string;
  /** Grid intersection (e.g. "B-2") where the column stands on one, else its id. */
  mark: string;
  weight_lb: number;
  locked: string | null;
  /** One cell per schedule level (top first); null where the column does not reach it. */
  cells: (ColumnScheduleCell | null)[];
}

export interface ColumnSchedule {
  levels: { id: string; name: string; elevation_ft: number }[];
  columns: ColumnScheduleColumn[];
  columnWeight_lb: number;
}

/** The design fields the schedule reads (the stored `calc plan` output). */
export interface ColumnScheduleDesignInput {
  columns?: {
    id: string;
    weight_lb?: number;
    locked?: string | null;
    levels: { level: string; shape?: string | null; tier?: number | null; Lc_ft?: number; D_kip: number; L_kip: number; Pr_kip: number; Pc_kip?: number | null; ratio?: number | null; governing?: string; combination?: string; spliceBelow?: boolean; passes?: boolean }[];
  }[];
  totals?: { columnWeight_lb?: number };
}

export function buildColumnSchedule(design: ColumnScheduleDesignInput, plan: Pick<Plan, 'levels' | 'columns' | 'grids'>): ColumnSchedule {
  const levels = [...plan.levels].sort((a, b) => b.elevation_ft - a.elevation_ft).map((l) => ({ id: l.id, name: l.name, elevation_ft: l.elevation_ft }));
  const position = new Map(plan.columns.map((c) => [c.id, c]));
  const columns = (design.columns ?? []).map((c): ColumnScheduleColumn => {
    const at = position.get(c.id);
    const byLevel = new Map(c.levels.map((l) => [l.level, l]));
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
        };
      }),
    };
  });
  return { levels, columns, columnWeight_lb: design.totals?.columnWeight_lb ?? columns.reduce((a, c) => a + c.weight_lb, 0) };
}
