import type { Model } from 'sequelize';
import { exportPlanFile } from '../../shared/schemas/plan.schema';
import { parseStudySpec, type StudySpec } from '../../shared/schemas/study.schema';
import { applyStudyOption, regionBays, studyOptionSpecs, type StudyOptionResult, type StudyResult } from '../../shared/engine/index';
import { AppError } from '../errors/app-error';
import type { BayStudyAttributes, BayStudyCreation } from '../models/bay-study.model';
import { findOwnScheme, readPlan, type SchemeServiceContext } from './plan-store.service';
import { designSchemeNow } from './scheme-design.service';
import { createScheme, type SchemeDetail } from './schemes.service';
import { getUnitPrices } from './unit-prices.service';
import { designPool } from './design-runs/design-pool';

// Bay studies of a scheme: the scheme's current plan through the study engine
// (shared/engine/study), priced with the firm's unit prices, kept against the revision.

type BayStudyRow = Model<BayStudyAttributes, BayStudyCreation>;

export interface BayStudySummary {
  id: string;
  schemeId: string;
  revision: number;
  /** True when the scheme has been saved since the study ran. */
  stale: boolean;
  level: string;
  optionCount: number;
  passing: number;
  lightestId: string | null;
  createdAt: string;
}

export type BayStudyView = BayStudySummary & { request: StudySpec; result: StudyResult };

const plain = <T>(v: unknown): T => (typeof v === 'string' ? JSON.parse(v) : v) as T;

function toSummary(row: BayStudyRow, schemeRevision: number): BayStudySummary {
  const r = row.get({ plain: true });
  const result = plain<StudyResult>(r.result);
  return {
    id: r.id,
    schemeId: r.schemeId,
    revision: r.revision,
    stale: r.revision !== schemeRevision,
    level: result.level,
    optionCount: r.optionCount,
    passing: result.options.filter((o) => o.passes).length,
    lightestId: result.options.find((o) => o.lightest)?.id ?? null,
    createdAt: new Date(r.createdAt).toISOString(),
  };
}

function toView(row: BayStudyRow, schemeRevision: number): BayStudyView {
  const r = row.get({ plain: true });
  return { ...toSummary(row, schemeRevision), request: plain<StudySpec>(r.request), result: plain<StudyResult>(r.result) };
}

/** The request's problems as a 422 naming each field (`fields` keyed by the field path). */
function studyInputError(problems: string[]): AppError {
  const fields: Record<string, string> = {};
  for (const p of problems) {
    const at = p.indexOf(': ');
    const key = at > 0 ? p.slice(0, at) : 'study';
    fields[key] ??= at > 0 ? p.slice(at + 2) : p;
  }
  return new AppError(422, 'study_invalid', `The study cannot run: ${problems[0]}${problems.length > 1 ? ` (and ${problems.length - 1} more)` : ''}.`, {
    fields,
    details: { problems },
  });
}

/** POST /api/schemes/:id/studies: runs the study on the scheme's current plan and keeps it. */
export async function runSchemeStudy(ctx: SchemeServiceContext, schemeId: string, body: Record<string, unknown>): Promise<BayStudyView> {
  const scheme = await findOwnScheme(ctx, schemeId);
  const attrs = scheme.get({ plain: true });
  if (body.revision !== undefined && body.revision !== attrs.revision) {
    throw new AppError(409, 'revision_conflict', `The scheme is at revision ${attrs.revision}, not ${String(body.revision)}: save the plan (or reload it) and run the study again.`, {
      fields: { revision: `the scheme is at revision ${attrs.revision}` },
    });
  }
  const { revision: _r, unitPrices: _p, ...request } = body;
  const prices = (await getUnitPrices(ctx, ctx.actor.firmId)).prices;
  // The firm's unit prices price the study; a request cannot bring its own.
  const { spec, problems } = parseStudySpec({
    ...request,
    unitPrices: prices ? { steel_usd_per_ton: prices.steel_usd_per_ton, connection_usd_each: prices.connection_usd_each } : null,
  });
  if (!spec) throw studyInputError(problems);
  const plan = await readPlan(ctx.db, attrs);
  const region = regionBays(plan, spec.region);
  if (region.problems.length > 0) throw studyInputError(region.problems);
  // In a design worker, off the request thread and within the design time and memory budget.
  const result = await designPool().runStudy(plan, spec);
  const row = await ctx.db.models.BayStudy.create({
    schemeId,
    revision: attrs.revision,
    request: spec as unknown as Record<string, unknown>,
    result: JSON.parse(JSON.stringify(result)) as Record<string, unknown>,
    optionCount: result.options.length,
    userId: ctx.actor.userId,
  });
  return toView(row, attrs.revision);
}

export async function listSchemeStudies(ctx: SchemeServiceContext, schemeId: string): Promise<BayStudySummary[]> {
  const scheme = await findOwnScheme(ctx, schemeId);
  const rows = await ctx.db.models.BayStudy.findAll({ where: { schemeId }, order: [['createdAt', 'DESC']], limit: 100 });
  return rows.map((r) => toSummary(r, scheme.getDataValue('revision')));
}

async function findStudy(ctx: SchemeServiceContext, schemeId: string, studyId: string): Promise<{ row: BayStudyRow; revision: number }> {
  const scheme = await findOwnScheme(ctx, schemeId);
  const row = await ctx.db.models.BayStudy.findOne({ where: { id: studyId, schemeId } });
  if (!row) throw AppError.notFound('Study');
  return { row, revision: scheme.getDataValue('revision') };
}

export async function getSchemeStudy(ctx: SchemeServiceContext, schemeId: string, studyId: string): Promise<BayStudyView> {
  const { row, revision } = await findStudy(ctx, schemeId, studyId);
  return toView(row, revision);
}

/**
 * POST /api/schemes/:id/studies/:studyId/schemes: a new scheme in the same project, a clone
 * of the current plan with the option applied, designed at once so it shows on Tonnage.
 * The plan must still be the revision the study ran on (409 study_stale otherwise).
 */
export async function makeSchemeFromOption(
  ctx: SchemeServiceContext,
  schemeId: string,
  studyId: string,
  input: { optionId: string; name?: string },
): Promise<{ scheme: SchemeDetail; option: StudyOptionResult }> {
  const { row, revision } = await findStudy(ctx, schemeId, studyId);
  const study = toView(row, revision);
  if (study.stale) throw new AppError(409, 'study_stale', `The scheme has been saved since this study ran (revision ${study.revision}, now ${revision}): run the study again.`);
  const index = study.result.options.findIndex((o) => o.id === input.optionId);
  if (index < 0) throw new AppError(422, 'option_unknown', `The study has no option "${input.optionId}".`, { fields: { optionId: 'not an option of this study' } });
  const option = study.result.options[index];
  if (option.error) throw new AppError(422, 'option_infeasible', `Option ${option.id} could not be laid out: ${option.error}`, { fields: { optionId: option.error } });
  const source = (await findOwnScheme(ctx, schemeId)).get({ plain: true });
  const plan = await readPlan(ctx.db, source);
  const { bays } = regionBays(plan, study.request.region);
  const applied = applyStudyOption(plan, study.request.region.level, bays, studyOptionSpecs(study.request)[index]);
  if (!applied.ok) throw new AppError(422, 'option_infeasible', applied.error, { fields: { optionId: applied.error } });
  const name = (input.name ?? `${source.name} – ${describeOption(option)}`).slice(0, 200);
  const { repairs: _r, problems: _p, ...scheme } = await createScheme(ctx, source.projectId, { name, plan: exportPlanFile({ ...applied.plan, name }) });
  await designSchemeNow(ctx, scheme.id, { trigger: 'requested' });
  return { scheme, option };
}

/** "beams y @ 10 ft, d ≤ 18 in, Fy 50, composite" — the option in a scheme name. */
export function describeOption(o: StudyOptionResult): string {
  const layout = o.beamCount !== null ? `${o.beamCount} beams ${o.direction}` : `beams ${o.direction} @ ${o.spacing_ft} ft`;
  const composite = o.composite === true ? 'composite' : o.composite === false ? 'bare steel' : null;
  return [layout, o.depthLimit_in !== null ? `d ≤ ${o.depthLimit_in} in` : null, `Fy ${o.Fy_ksi}`, composite].filter(Boolean).join(', ');
}
