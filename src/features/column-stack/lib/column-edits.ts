import type { Plan, PlanColumn } from '../../../../shared/schemas/plan.schema';

/** The column edits the Column stack offers (engineer and owner; the server enforces it). */
export type ColumnEdit =
  /** Splice levels for every column that sets none of its own; null: every N storeys. */
  | { kind: 'projectSplices'; levels: string[] | null }
  /** The allowed column series, e.g. ["W14"] or ["W12", "W14"]. */
  | { kind: 'series'; series: string[] }
  /** One column's splice levels; null: it follows the project's. */
  | { kind: 'columnSplices'; columnId: string; levels: string[] | null }
  /** Lock (or, with null, release) the tier holding the length below `level`; `tierLevels` are that tier's levels. */
  | { kind: 'tierShape'; columnId: string; level: string; tierLevels: string[]; shape: string | null };

function withColumn(plan: Plan, id: string, change: (c: PlanColumn) => PlanColumn): Plan {
  if (!plan.columns.some((c) => c.id === id)) throw new Error(`Column ${id} is not in this plan`);
  return { ...plan, columns: plan.columns.map((c) => (c.id === id ? change(c) : c)) };
}

/** Levels in the plan's elevation order (bottom first), unique. */
function ordered(plan: Plan, levels: readonly string[]): string[] {
  const elevation = new Map(plan.levels.map((l) => [l.id, l.elevation_ft]));
  return [...new Set(levels)].filter((l) => elevation.has(l)).sort((a, b) => elevation.get(a)! - elevation.get(b)!);
}

/** The plan after one column edit (pure: the input plan is not changed). */
export function applyColumnEdit(plan: Plan, edit: ColumnEdit): Plan {
  const basisColumns = plan.designBasis.columns ?? {};
  switch (edit.kind) {
    case 'projectSplices':
      return { ...plan, designBasis: { ...plan.designBasis, columns: { ...basisColumns, spliceLevels: edit.levels === null ? null : ordered(plan, edit.levels) } } };
    case 'series':
      if (edit.series.length === 0) throw new Error('Choose at least one column series');
      return { ...plan, designBasis: { ...plan.designBasis, columns: { ...basisColumns, series: [...new Set(edit.series)].sort((a, b) => Number(b.slice(1)) - Number(a.slice(1))) } } };
    case 'columnSplices':
      return withColumn(plan, edit.columnId, (c) => {
        const { spliceLevels: _drop, ...rest } = c;
        return edit.levels === null ? rest : { ...rest, spliceLevels: ordered(plan, edit.levels).filter((l) => c.levels.includes(l)) };
      });
    case 'tierShape':
      return withColumn(plan, edit.columnId, (c) => {
        const inTier = new Set([edit.level, ...edit.tierLevels]);
        const kept = (c.tierShapes ?? []).filter((t) => !inTier.has(t.level));
        const tierShapes = edit.shape ? [...kept, { level: edit.level, shape: edit.shape.trim().toUpperCase() }] : kept;
        const { tierShapes: _old, ...rest } = c;
        return tierShapes.length ? { ...rest, tierShapes } : rest;
      });
  }
}
