import { Op, type Model, type Transaction } from 'sequelize';
import type { SchemeResult } from '../../shared/engine/index';
import type { Plan } from '../../shared/schemas/plan.schema';
import { AppError } from '../errors/app-error';
import { designPool } from './design-runs/design-pool';
import type { DesignRunAttributes, DesignRunCreation } from '../models/design-run.model';
import type { Db } from '../models/models';
import { findOwnScheme, readPlan, type SchemeServiceContext } from './plan-store.service';
import { recordSchemeAudit, SCHEME_AUDIT_ACTIONS } from './scheme-audit.service';
import { designRunsKept, packDesignResult, PRUNED_RESULT, unpackDesignResult } from './design-run-storage';

// Design runs: the scheme's current plan through the engine (designScheme, the `calc plan`
// output), stored against the revision it was computed from. A run is stale when the
// scheme has been saved since. Results are stored packed (design-run-storage.ts) and only the
// newest DESIGN_RUNS_KEPT runs per scheme keep theirs; older runs keep their summary columns.

type DesignRunRow = Model<DesignRunAttributes, DesignRunCreation>;

/** The calc plan output (calc-interface.md) plus where it came from. */
export type SchemeDesignView = Record<string, unknown> & {
  /** Plan revision the design was computed from. */
  revision: number;
  designedAt: string;
  /** True when the scheme has been saved since (revision differs). */
  stale: boolean;
};

/** What lists show without reading the whole result. */
export interface DesignSummary {
  revision: number;
  designedAt: string;
  stale: boolean;
  steelWeight_lb: number;
  pieces: number;
  floorArea_ft2: number;
  /** lb/ft² of floor; 0 when the plan has no deck area. */
  steel_psf: number;
  failingMembers: number;
  problemCount: number;
}

export function toDesignSummary(run: DesignRunAttributes, schemeRevision: number): DesignSummary {
  return {
    revision: run.revision,
    designedAt: new Date(run.createdAt).toISOString(),
    stale: run.revision !== schemeRevision,
    steelWeight_lb: run.steelWeightLb,
    pieces: run.pieces,
    floorArea_ft2: run.floorAreaFt2,
    steel_psf: run.floorAreaFt2 > 0 ? run.steelWeightLb / run.floorAreaFt2 : 0,
    failingMembers: run.failingMembers,
    problemCount: run.problemCount,
  };
}

function toDesignView(run: DesignRunRow, schemeRevision: number): SchemeDesignView {
  const r = run.get({ plain: true });
  const result = unpackDesignResult(r.result);
  return {
    ...result,
    revision: r.revision,
    designedAt: new Date(r.createdAt).toISOString(),
    stale: r.revision !== schemeRevision,
  };
}

/** The latest run of each scheme (by time, then revision). */
export async function latestDesignRuns(db: Db, schemeIds: string[]): Promise<Map<string, DesignRunAttributes>> {
  const out = new Map<string, DesignRunAttributes>();
  if (schemeIds.length === 0) return out;
  const rows = await db.models.DesignRun.findAll({
    where: { schemeId: schemeIds },
    attributes: { exclude: ['result'] },
    order: [['createdAt', 'DESC'], ['revision', 'DESC']],
  });
  for (const row of rows) {
    const run = row.get({ plain: true });
    if (!out.has(run.schemeId)) out.set(run.schemeId, run);
  }
  return out;
}

async function latestRun(db: Db, schemeId: string, transaction?: Transaction): Promise<DesignRunRow | null> {
  return db.models.DesignRun.findOne({
    where: { schemeId },
    order: [['createdAt', 'DESC'], ['revision', 'DESC']],
    transaction,
  });
}

/**
 * Runs the engine on a plan in a design worker (off the request thread, within the time and
 * memory budget); an engine failure or a run over budget is a clear 422, never a 500.
 */
export function runEngine(plan: Plan): Promise<SchemeResult> {
  return designPool().run(plan);
}

/** Stores a design result against a revision; returns the stored row. */
export async function storeDesignRun(
  db: Db,
  input: { schemeId: string; revision: number; result: SchemeResult | Record<string, unknown>; userId: string | null },
  transaction?: Transaction,
): Promise<DesignRunRow> {
  // Plain JSON (drops the engine's non-enumerable design cache), each distinct sizing record once.
  const packed = packDesignResult(input.result);
  const result = packed.result as unknown as SchemeResult;
  const row = await db.models.DesignRun.create(
    {
      schemeId: input.schemeId,
      revision: input.revision,
      result: packed as unknown as Record<string, unknown>,
      steelWeightLb: result.totals?.steelWeight_lb ?? 0,
      pieces: result.totals?.pieces ?? 0,
      floorAreaFt2: result.totals?.floorArea_ft2 ?? 0,
      failingMembers: (result.members ?? []).filter((m) => !m.passes).length,
      problemCount: (result.problems ?? []).length,
      userId: input.userId,
    },
    { transaction },
  );
  await pruneDesignResults(db, input.schemeId, transaction);
  return row;
}

/**
 * Drops the stored result of every run of the scheme but the newest `designRunsKept` (latest
 * first, as latestRun orders them). The rows stay with their summary columns, which the
 * activity feed lists; nothing reads an older run's result.
 */
async function pruneDesignResults(db: Db, schemeId: string, transaction?: Transaction): Promise<void> {
  const older = await db.models.DesignRun.findAll({
    where: { schemeId },
    attributes: ['id'],
    order: [['createdAt', 'DESC'], ['revision', 'DESC']],
    offset: designRunsKept(db.sequelize),
    transaction,
  });
  if (older.length === 0) return;
  await db.models.DesignRun.update(
    { result: PRUNED_RESULT as unknown as Record<string, unknown> },
    { where: { id: { [Op.in]: older.map((r) => r.getDataValue('id')) } }, transaction },
  );
}

/**
 * Why a design ran, for the audit log: asked for (POST /design), because a stale or missing
 * design was read (schedule, tonnage, marks), or by the demo seed.
 */
export type DesignTrigger = 'requested' | 'on_read' | 'seed';

/** POST /api/schemes/:id/design: designs the current plan and stores the run. */
export async function designSchemeNow(
  ctx: SchemeServiceContext,
  schemeId: string,
  options: { trigger?: DesignTrigger } = {},
): Promise<SchemeDesignView> {
  const scheme = await findOwnScheme(ctx, schemeId);
  const attrs = scheme.get({ plain: true });
  const plan = await readPlan(ctx.db, attrs);
  const result = await runEngine(plan);
  const run = await storeDesignRun(ctx.db, {
    schemeId,
    revision: attrs.revision,
    result,
    userId: ctx.actor.userId,
  });
  const stored = run.get({ plain: true });
  await recordSchemeAudit(ctx, {
    action: SCHEME_AUDIT_ACTIONS.designRun,
    schemeId,
    schemeName: attrs.name,
    projectId: attrs.projectId,
    detail: {
      revision: attrs.revision,
      designRunId: stored.id,
      trigger: options.trigger ?? 'requested',
      steelWeight_lb: stored.steelWeightLb,
      pieces: stored.pieces,
      failingMembers: stored.failingMembers,
    },
  });
  // The scheme may have been saved while the engine ran: compare with the revision now.
  const now = await ctx.db.models.Scheme.findByPk(schemeId, { attributes: ['revision'] });
  return toDesignView(run, now?.getDataValue('revision') ?? attrs.revision);
}

/** GET /api/schemes/:id/design: the latest stored run (404 not_designed when none). */
export async function getLatestDesign(ctx: SchemeServiceContext, schemeId: string): Promise<SchemeDesignView> {
  return getSchemeDesign(ctx, schemeId, { designIfStale: false });
}

/**
 * The design other features read (schedule, tonnage): the latest run, designed first when
 * there is none or it is stale and `designIfStale` is set. Without it a stale run is
 * returned as is (stale: true) and a scheme never designed is 404 not_designed.
 */
export async function getSchemeDesign(
  ctx: SchemeServiceContext,
  schemeId: string,
  options: { designIfStale: boolean },
): Promise<SchemeDesignView> {
  const scheme = await findOwnScheme(ctx, schemeId);
  const revision = scheme.getDataValue('revision');
  const run = await latestRun(ctx.db, schemeId);
  if (run && (run.getDataValue('revision') === revision || !options.designIfStale)) {
    return toDesignView(run, revision);
  }
  if (!options.designIfStale) {
    throw new AppError(404, 'not_designed', 'This scheme has not been designed yet.');
  }
  return designSchemeNow(ctx, schemeId, { trigger: 'on_read' });
}
