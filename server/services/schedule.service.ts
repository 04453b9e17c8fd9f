import type { SchemeResult } from '../../shared/engine/index';
import { SCHEME_CAUTION } from '../../shared/engine/index';
import { scheduleBasis, scheduleMarkRows, scheduleRows, type ScheduleBasis, type ScheduleRow } from '../../shared/drafting/schedule.drafting';
import { SCHEDULE_MARK_CSV_COLUMNS, scheduleCsv } from '../../shared/drafting/schedule-csv.drafting';
import type { Plan, PlanProblem } from '../../shared/schemas/plan.schema';
import { findOwnScheme, readPlan, type SchemeServiceContext } from './plan-store.service';
import { getSchemeDesign } from './scheme-design.service';
import { fileSlug } from './schemes.service';

// The member schedule of a scheme: its current design (designed first when stale) read
// against the plan it was computed from.

export const COMPOSITE_NOTE = 'Camber and studs: composite design is not in Baywright yet, so these columns stay empty.';

export interface ScheduleView {
  scheme: { id: string; projectId: string; name: string; revision: number };
  design: { revision: number; designedAt: string };
  basis: ScheduleBasis;
  levels: { id: string; name: string; elevation_ft: number }[];
  rows: ScheduleRow[];
  problems: PlanProblem[];
  caution: string;
  compositeNote: string;
}

export interface SchemeDrafting {
  scheme: { id: string; projectId: string; name: string; revision: number };
  plan: Plan;
  design: SchemeResult & { revision: number; designedAt: string };
}

/** The scheme, its plan and a current design (designing it first when stale). */
export async function loadSchemeDrafting(ctx: SchemeServiceContext, schemeId: string): Promise<SchemeDrafting> {
  const view = await getSchemeDesign(ctx, schemeId, { designIfStale: true });
  const row = await findOwnScheme(ctx, schemeId);
  const attrs = row.get({ plain: true });
  const plan = await readPlan(ctx.db, attrs);
  return {
    scheme: { id: attrs.id, projectId: attrs.projectId, name: attrs.name, revision: attrs.revision },
    plan,
    design: view as unknown as SchemeResult & { revision: number; designedAt: string },
  };
}

export async function getSchedule(ctx: SchemeServiceContext, schemeId: string): Promise<ScheduleView> {
  const { scheme, plan, design } = await loadSchemeDrafting(ctx, schemeId);
  return {
    scheme,
    design: { revision: design.revision, designedAt: design.designedAt },
    basis: scheduleBasis(design.method === 'ASD' ? 'ASD' : 'LRFD'),
    levels: plan.levels.map((l) => ({ id: l.id, name: l.name, elevation_ft: l.elevation_ft })),
    rows: scheduleRows(design, plan),
    problems: design.problems ?? [],
    caution: design.caution ?? SCHEME_CAUTION,
    compositeNote: COMPOSITE_NOTE,
  };
}

/** GET …/schedule.csv: the schedule's rows, one per member (or one per mark with `by: 'mark'`). */
export async function getScheduleCsv(
  ctx: SchemeServiceContext,
  schemeId: string,
  by: 'member' | 'mark' = 'member',
): Promise<{ filename: string; csv: string; caution: string }> {
  const schedule = await getSchedule(ctx, schemeId);
  return {
    filename: `${fileSlug(schedule.scheme.name)}-schedule${by === 'mark' ? '-by-mark' : ''}-r${schedule.scheme.revision}.csv`,
    csv: by === 'mark' ? scheduleCsv(scheduleMarkRows(schedule.rows), SCHEDULE_MARK_CSV_COLUMNS) : scheduleCsv(schedule.rows),
    caution: schedule.caution,
  };
}
