import { buildColumnSchedule, type ColumnSchedule } from '../../shared/drafting/column-schedule.drafting';
import type { SchemeResult } from '../../shared/engine/index';
import { SCHEME_CAUTION } from '../../shared/engine/index';
import { scheduleBasis, scheduleMarkRows, scheduleRows, type ScheduleBasis, type ScheduleRow } from '../../shared/drafting/schedule.drafting';
import { SCHEDULE_MARK_CSV_COLUMNS, scheduleCsv } from '../../shared/drafting/schedule-csv.drafting';
import type { Plan, PlanProblem } from '../../shared/schemas/plan.schema';
import { readPlan, type SchemeServiceContext } from './plan-store.service';
import { currentSchemeDesign, type CurrentDesign } from './scheme-design.service';
import { jsonBody, JsonBodyCache, type JsonBody } from './json-body-cache';
import { fileSlug } from './schemes.service';

// The member schedule of a scheme: its current design (designed first when stale) read
// against the plan it was computed from.

/** Said above the schedule when no member of the design is composite (the camber and studs columns are then empty). */
export const COMPOSITE_NOTE = 'Camber and studs: no member of this scheme is designed composite (composite design is off in its design basis, or no deck has a slab build-up), so these columns stay empty.';

export interface ScheduleView {
  scheme: { id: string; projectId: string; name: string; revision: number };
  design: { revision: number; designedAt: string };
  basis: ScheduleBasis;
  levels: { id: string; name: string; elevation_ft: number }[];
  rows: ScheduleRow[];
  problems: PlanProblem[];
  caution: string;
  /** COMPOSITE_NOTE when no member is composite, else null. */
  compositeNote: string | null;
  columnSchedule: ColumnSchedule;
}

export interface SchemeDrafting {
  scheme: { id: string; projectId: string; name: string; revision: number };
  plan: Plan;
  design: SchemeResult & { revision: number; designedAt: string };
}

/** The scheme, its plan and a current design (designing it first when stale). */
export async function loadSchemeDrafting(ctx: SchemeServiceContext, schemeId: string): Promise<SchemeDrafting> {
  return draftingOf(ctx, await currentSchemeDesign(ctx, schemeId, { designIfStale: true }));
}

async function draftingOf(ctx: SchemeServiceContext, current: CurrentDesign): Promise<SchemeDrafting> {
  const attrs = current.scheme;
  const [view, plan] = await Promise.all([current.view(), readPlan(ctx.db, attrs)]);
  return {
    scheme: { id: attrs.id, projectId: attrs.projectId, name: attrs.name, revision: attrs.revision },
    plan,
    design: view as unknown as SchemeResult & { revision: number; designedAt: string },
  };
}

function scheduleView({ scheme, plan, design }: SchemeDrafting): ScheduleView {
  return {
    scheme,
    design: { revision: design.revision, designedAt: design.designedAt },
    basis: scheduleBasis(design.method === 'ASD' ? 'ASD' : 'LRFD'),
    levels: plan.levels.map((l) => ({ id: l.id, name: l.name, elevation_ft: l.elevation_ft })),
    rows: scheduleRows(design, plan),
    problems: design.problems ?? [],
    caution: design.caution ?? SCHEME_CAUTION,
    compositeNote: design.members.some((m) => m.studs != null || m.camber_in != null) ? null : COMPOSITE_NOTE,
    columnSchedule: buildColumnSchedule(design, plan),
  };
}

export async function getSchedule(ctx: SchemeServiceContext, schemeId: string): Promise<ScheduleView> {
  return scheduleView(await loadSchemeDrafting(ctx, schemeId));
}

/**
 * Schedules as response bodies, by what they are made of: the design run, the plan revision
 * (the element rows change only with it) and the scheme's name and project. A new design run,
 * a save, a mark edit (a save with its own run) or a rename each make a new key; old ones fall
 * out least recently used first.
 */
const scheduleBodies = new JsonBodyCache<string>(32, 24 * 1024 * 1024);

/** GET …/schedule as the response body: built and serialised once per run and revision. */
export async function getScheduleBody(ctx: SchemeServiceContext, schemeId: string): Promise<JsonBody> {
  const current = await currentSchemeDesign(ctx, schemeId, { designIfStale: true });
  const s = current.scheme;
  const key = JSON.stringify([current.runId, s.id, s.revision, s.projectId, s.name]);
  return scheduleBodies.get(key) ?? scheduleBodies.set(key, jsonBody(scheduleView(await draftingOf(ctx, current))));
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
