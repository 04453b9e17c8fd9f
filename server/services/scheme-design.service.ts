import { Op, type Model, type Transaction } from 'sequelize';
import type { SchemeResult } from '../../shared/engine/index';
import type { Plan } from '../../shared/schemas/plan.schema';
import { AppError } from '../errors/app-error';
import { designPool } from './design-runs/design-pool';
import type { StoredDesign } from './design-runs/design.worker';
import { jsonBody, jsonBodyFromBytes, JsonBodyCache, type JsonBody } from './json-body-cache';
import type { DesignRunAttributes, DesignRunCreation } from '../models/design-run.model';
import type { SchemeAttributes } from '../models/scheme.model';
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

/** A stored run without its result (lists and lookups never parse the result to find it). */
type RunMeta = Omit<DesignRunAttributes, 'result'>;

/**
 * Parsed results of stored runs, by run id: a run never changes once stored, and its result
 * (about 1 MB of JSON for the demo building) costs more to read and parse than everything
 * else a design read does. A few, most recently used first; deep-frozen, because every reader
 * shares the one copy (a reader that changed it would throw, not corrupt the others).
 */
const RESULT_CACHE_SIZE = 4;
const resultCache = new Map<string, Record<string, unknown>>();

/**
 * Design views as response bodies (about 1.7 MB of JSON for the demo building), by run and
 * staleness: a run never changes, so its view is serialised once, not per read.
 */
const viewBodies = new JsonBodyCache<string>(8, 24 * 1024 * 1024);
const bodyKey = (runId: string, stale: boolean) => `${runId}:${stale ? 'stale' : 'current'}`;

function deepFreeze<T>(value: T): T {
  if (value && typeof value === 'object' && !Object.isFrozen(value)) {
    Object.freeze(value);
    for (const child of Object.values(value as Record<string, unknown>)) deepFreeze(child);
  }
  return value;
}

function remember(id: string, result: Record<string, unknown>): Record<string, unknown> {
  resultCache.delete(id);
  resultCache.set(id, deepFreeze(result));
  while (resultCache.size > RESULT_CACHE_SIZE) resultCache.delete(resultCache.keys().next().value as string);
  return result;
}

async function resultOf(db: Db, runId: string, transaction?: Transaction): Promise<Record<string, unknown>> {
  const cached = resultCache.get(runId);
  if (cached) return remember(runId, cached);
  const row = await db.models.DesignRun.findByPk(runId, { attributes: ['id', 'result'], transaction });
  if (!row) throw AppError.notFound('Design');
  const raw = row.getDataValue('result') as unknown;
  return remember(runId, unpackDesignResult(raw));
}

function toDesignView(run: RunMeta, result: Record<string, unknown>, schemeRevision: number): SchemeDesignView {
  return {
    ...result,
    revision: run.revision,
    designedAt: new Date(run.createdAt).toISOString(),
    stale: run.revision !== schemeRevision,
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

async function latestRun(db: Db, schemeId: string, transaction?: Transaction): Promise<RunMeta | null> {
  const row = await db.models.DesignRun.findOne({
    where: { schemeId },
    attributes: { exclude: ['result'] },
    order: [['createdAt', 'DESC'], ['revision', 'DESC']],
    transaction,
  });
  return row ? (row.get({ plain: true }) as RunMeta) : null;
}

/**
 * Runs the engine on a plan in a design worker (off the request thread, within the time and
 * memory budget); an engine failure or a run over budget is a clear 422, never a 500. The
 * worker hands back the result packed for storage and as JSON bytes, so the request thread
 * neither serialises nor packs it.
 */
export function runEngine(plan: Plan, schemeId?: string): Promise<StoredDesign> {
  return designPool().run(plan, schemeId);
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

/** A design run just stored: its row without the result, the scheme's revision now, and the result as kept. */
interface FreshRun {
  meta: RunMeta;
  schemeRevision: number;
  stored: StoredDesign;
}

/**
 * Designs in flight, by scheme and revision: a request for a design that is already being
 * computed (several people opening the schedule of a scheme just saved, a second click on
 * Design) waits for that run instead of starting the same one again.
 */
const inFlight = new Map<string, Promise<FreshRun>>();

async function designAndStore(ctx: SchemeServiceContext, schemeId: string, trigger: DesignTrigger): Promise<FreshRun> {
  const scheme = await findOwnScheme(ctx, schemeId);
  const attrs = scheme.get({ plain: true });
  const key = `${schemeId}:${attrs.revision}`;
  const running = inFlight.get(key);
  if (running) return running;
  const run = (async (): Promise<FreshRun> => {
    const plan = await readPlan(ctx.db, attrs);
    const stored = await runEngine(plan, schemeId);
    const row = await storeDesignRun(ctx.db, {
      schemeId,
      revision: attrs.revision,
      result: stored.packed as unknown as Record<string, unknown>,
      userId: ctx.actor.userId,
    });
    const { result: _packed, ...meta } = row.get({ plain: true });
    await recordSchemeAudit(ctx, {
      action: SCHEME_AUDIT_ACTIONS.designRun,
      schemeId,
      schemeName: attrs.name,
      projectId: attrs.projectId,
      detail: {
        revision: attrs.revision,
        designRunId: meta.id,
        trigger,
        steelWeight_lb: meta.steelWeightLb,
        pieces: meta.pieces,
        failingMembers: meta.failingMembers,
      },
    });
    // The scheme may have been saved while the engine ran: compare with the revision now.
    const now = await ctx.db.models.Scheme.findByPk(schemeId, { attributes: ['revision'] });
    return { meta, schemeRevision: now?.getDataValue('revision') ?? attrs.revision, stored };
  })();
  inFlight.set(key, run);
  try {
    return await run;
  } finally {
    if (inFlight.get(key) === run) inFlight.delete(key);
  }
}

/** The design view of a fresh run as a body: the worker's JSON of the result with the run's fields appended. */
function freshBody(fresh: FreshRun): JsonBody {
  const { meta, schemeRevision, stored } = fresh;
  const stale = meta.revision !== schemeRevision;
  const key = bodyKey(meta.id, stale);
  const cached = viewBodies.get(key);
  if (cached) return cached;
  const fields = { revision: meta.revision, designedAt: new Date(meta.createdAt).toISOString(), stale };
  const top = stored.packed.result;
  const json = Buffer.from(stored.json.buffer, stored.json.byteOffset, stored.json.byteLength);
  // {...result, revision, designedAt, stale} serialises as the result's text with the three
  // fields appended, unless the result already has one of them (then it keeps its place).
  if (Object.keys(fields).some((k) => k in top) || json.length < 2 || json[json.length - 1] !== 0x7d) {
    return viewBodies.set(key, jsonBody(toDesignView(meta, resultFromPacked(meta.id, stored), schemeRevision)));
  }
  const tail = JSON.stringify(fields).slice(1);
  const bytes = Buffer.concat([json.subarray(0, json.length - 1), Buffer.from(json.length === 2 ? tail : `,${tail}`, 'utf8')]);
  return viewBodies.set(key, jsonBodyFromBytes(bytes));
}

/** The result of a fresh run as readers share it (unpacked once, kept with the other parsed results). */
function resultFromPacked(runId: string, stored: StoredDesign): Record<string, unknown> {
  return resultCache.get(runId) ?? remember(runId, unpackDesignResult(stored.packed));
}

/** POST /api/schemes/:id/design: designs the current plan and stores the run. */
export async function designSchemeNow(
  ctx: SchemeServiceContext,
  schemeId: string,
  options: { trigger?: DesignTrigger } = {},
): Promise<SchemeDesignView> {
  const fresh = await designAndStore(ctx, schemeId, options.trigger ?? 'requested');
  return toDesignView(fresh.meta, resultFromPacked(fresh.meta.id, fresh.stored), fresh.schemeRevision);
}

/** POST /api/schemes/:id/design as the response body (the same bytes res.json would send of designSchemeNow's view). */
export async function designSchemeNowBody(ctx: SchemeServiceContext, schemeId: string): Promise<JsonBody> {
  return freshBody(await designAndStore(ctx, schemeId, 'requested'));
}

/** GET /api/schemes/:id/design as the response body, serialised once per run (and staleness). */
export async function getLatestDesignBody(ctx: SchemeServiceContext, schemeId: string): Promise<JsonBody> {
  const scheme = await findOwnScheme(ctx, schemeId);
  const revision = scheme.getDataValue('revision');
  const run = await latestRun(ctx.db, schemeId);
  if (!run) throw new AppError(404, 'not_designed', 'This scheme has not been designed yet.');
  const key = bodyKey(run.id, run.revision !== revision);
  return viewBodies.get(key) ?? viewBodies.set(key, jsonBody(toDesignView(run, await resultOf(ctx.db, run.id), revision)));
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
  return (await currentSchemeDesign(ctx, schemeId, options)).view();
}

/**
 * The run getSchemeDesign reads, without reading its result yet: features that keep what they
 * derive from a run (schedule, tonnage) look their copy up by `runId` first and only ask for
 * the view when they have none. `scheme` is the scheme as it stands after any design.
 */
export interface CurrentDesign {
  scheme: SchemeAttributes;
  runId: string;
  /** The revision the run was computed from. */
  revision: number;
  view(): Promise<SchemeDesignView>;
}

export async function currentSchemeDesign(
  ctx: SchemeServiceContext,
  schemeId: string,
  options: { designIfStale: boolean },
): Promise<CurrentDesign> {
  const scheme = (await findOwnScheme(ctx, schemeId)).get({ plain: true });
  const run = await latestRun(ctx.db, schemeId);
  if (run && (run.revision === scheme.revision || !options.designIfStale)) {
    return { scheme, runId: run.id, revision: run.revision, view: async () => toDesignView(run, await resultOf(ctx.db, run.id), scheme.revision) };
  }
  if (!options.designIfStale) {
    throw new AppError(404, 'not_designed', 'This scheme has not been designed yet.');
  }
  const fresh = await designAndStore(ctx, schemeId, 'on_read');
  const now = (await findOwnScheme(ctx, schemeId)).get({ plain: true });
  return {
    scheme: now,
    runId: fresh.meta.id,
    revision: fresh.meta.revision,
    view: async () => toDesignView(fresh.meta, resultFromPacked(fresh.meta.id, fresh.stored), fresh.schemeRevision),
  };
}
