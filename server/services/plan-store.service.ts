import { createHash } from 'node:crypto';
import type { Model, ModelStatic, Transaction } from 'sequelize';
import {
  exportPlanFile,
  PLAN_FORMAT,
  type Plan,
  type PlanFileInput,
  type PlanMember,
} from '../../shared/schemas/plan.schema';
import { planProblem, type PlanProblem } from '../../shared/schemas/plan-problem.schema';
import { AppError } from '../errors/app-error';
import type { Db } from '../models/models';
import type { ColumnAttributes } from '../models/column.model';
import type { DeckAttributes } from '../models/deck.model';
import type { GridLineAttributes } from '../models/grid-line.model';
import type { LevelAttributes } from '../models/level.model';
import type { LineLoadAttributes } from '../models/line-load.model';
import type { MemberAttributes } from '../models/member.model';
import type { OpeningAttributes } from '../models/opening.model';
import type { PointLoadAttributes } from '../models/point-load.model';
import type { ZoneAttributes } from '../models/zone.model';
import type { SchemeAttributes, SchemeCreation } from '../models/scheme.model';

// The current plan of a scheme lives in the normalized element tables; this file turns a
// plan into rows and rows back into the same plan, and writes a plan together with its
// revision bump and revision snapshot in one transaction.

/** Who is calling: the firm scopes every read, the user signs every write. */
export interface SchemeActor {
  firmId: string;
  userId: string;
}

/** What scheme services take: the database and the caller (never req/res). */
export interface SchemeServiceContext {
  db: Db;
  actor: SchemeActor;
}

export type SchemeRow = Model<SchemeAttributes, SchemeCreation>;

/** A scheme of the caller's firm; another firm's scheme is "not found", never forbidden. */
export async function findOwnScheme(ctx: SchemeServiceContext, schemeId: string, transaction?: Transaction): Promise<SchemeRow> {
  const { models } = ctx.db;
  const scheme = await models.Scheme.findByPk(schemeId, { transaction });
  if (scheme) {
    const project = await models.Project.findOne({
      where: { id: scheme.getDataValue('projectId'), firmId: ctx.actor.firmId },
      attributes: ['id'],
      transaction,
    });
    if (project) return scheme;
  }
  throw AppError.notFound('Scheme');
}

export async function assertOwnProject(ctx: SchemeServiceContext, projectId: string): Promise<void> {
  const project = await ctx.db.models.Project.findOne({
    where: { id: projectId, firmId: ctx.actor.firmId },
    attributes: ['id'],
  });
  if (!project) throw AppError.notFound('Project');
}

// ---------------------------------------------------------------------------------------
// Storage limits: what the columns hold. Checked before writing so a long id is a clear
// 422 naming the element on every database, not a driver error.

const LIMITS = { id: 255, name: 200, label: 50, shape: 40, mark: 40 } as const;

export function storageProblems(plan: Plan): PlanProblem[] {
  const problems: PlanProblem[] = [];
  const check = (value: string | null | undefined, max: number, path: string, elementId?: string, what = 'text') => {
    if (value != null && value.length > max) {
      problems.push(
        planProblem('error', 'value-too-long', `${path}${elementId ? ` (id ${elementId.slice(0, 40)})` : ''}: ${what} is longer than ${max} characters`, {
          elementId,
          path,
        }),
      );
    }
  };
  const ids = (collection: string, items: { id?: string }[]) =>
    items.forEach((item, i) => check(item.id, LIMITS.id, `${collection}[${i}].id`, item.id, 'id'));
  ids('levels', plan.levels);
  ids('grids', plan.grids ?? []);
  ids('columns', plan.columns);
  ids('members', plan.members);
  ids('zones', plan.zones);
  ids('decks', plan.decks);
  ids('pointLoads', plan.pointLoads);
  ids('lineLoads', plan.lineLoads);
  ids('openings', plan.openings);
  plan.levels.forEach((l, i) => check(l.name, LIMITS.name, `levels[${i}].name`, l.id, 'name'));
  plan.zones.forEach((z, i) => check(z.name, LIMITS.name, `zones[${i}].name`, z.id, 'name'));
  (plan.grids ?? []).forEach((g, i) => check(g.label, LIMITS.label, `grids[${i}].label`, g.id, 'label'));
  plan.members.forEach((m, i) => {
    check(m.shape, LIMITS.shape, `members[${i}].shape`, m.id, 'shape');
    check(m.mark, LIMITS.mark, `members[${i}].mark`, m.id, 'mark');
  });
  return problems;
}

// ---------------------------------------------------------------------------------------
// Plan → rows

/** Member fields that are optional and may also be null: NULL in the column means absent
 *  unless the field is listed in null_fields. */
const MEMBER_OPTIONAL_NULLABLE = ['minDepth_in', 'allowedNominalDepths', 'Lb_override_ft', 'bracing', 'deflectionLimits', 'mark', 'composite', 'studs'] as const;

function memberRow(schemeId: string, m: PlanMember, position: number): Omit<MemberAttributes, 'id'> {
  const explicitNulls = MEMBER_OPTIONAL_NULLABLE.filter((k) => k in m && m[k] === null);
  return {
    schemeId,
    elementId: m.id,
    position,
    levelId: m.level,
    kind: m.kind,
    startXFt: m.start[0],
    startYFt: m.start[1],
    endXFt: m.end[0],
    endYFt: m.end[1],
    shape: m.shape,
    maxDepthIn: m.maxDepth_in,
    minDepthIn: m.minDepth_in ?? null,
    allowedNominalDepths: m.allowedNominalDepths ?? null,
    lbOverrideFt: m.Lb_override_ft ?? null,
    bracing: m.bracing ?? null,
    mark: m.mark ?? null,
    markLocked: m.markLocked ?? null,
    composite: m.composite ?? null,
    studs: m.studs ?? null,
    deflectionLimits: m.deflectionLimits ?? null,
    nullFields: explicitNulls.length > 0 ? explicitNulls.join(',') : null,
  };
}

const ELEMENT_MODELS = ['Level', 'GridLine', 'Column', 'Member', 'Zone', 'Deck', 'PointLoad', 'LineLoad', 'Opening'] as const;

type ElementModel = (typeof ELEMENT_MODELS)[number];

/** The element rows of a plan, per table, in the order they are written. */
export function planRows(schemeId: string, plan: Plan): Record<ElementModel, Record<string, unknown>[]> {
  const at = <T>(items: T[]) => items.map((item, position) => ({ item, position }));
  return {
    Level: at(plan.levels).map(({ item: l, position }) => ({
      schemeId, elementId: l.id, position, name: l.name, elevationFt: l.elevation_ft, roof: l.roof ?? null,
    })),
    GridLine: at(plan.grids ?? []).map(({ item: g, position }) => ({
      schemeId, elementId: g.id, position, axis: g.axis, label: g.label, offsetFt: g.offset_ft,
    })),
    Column: at(plan.columns).map(({ item: c, position }) => ({
      schemeId,
      elementId: c.id,
      position,
      xFt: c.x_ft,
      yFt: c.y_ft,
      levels: c.levels,
      shape: c.shape ?? null,
      spliceLevels: c.spliceLevels ?? null,
      tierShapes: c.tierShapes ?? null,
      nullFields: 'shape' in c && c.shape === null ? 'shape' : null,
    })),
    Member: plan.members.map((m, position) => memberRow(schemeId, m, position) as unknown as Record<string, unknown>),
    Zone: at(plan.zones).map(({ item: z, position }) => ({
      schemeId,
      elementId: z.id,
      position,
      name: z.name,
      deadPsf: z.dead_psf,
      superimposedDeadPsf: z.superimposedDead_psf,
      partitionPsf: z.partition_psf,
      livePsf: z.live_psf,
      liveReducible: z.liveReducible,
      roofLivePsf: z.roofLive_psf,
      snowPsf: z.snow_psf,
    })),
    Deck: at(plan.decks).map(({ item: d, position }) => ({
      schemeId, elementId: d.id, position, levelId: d.level, polygon: d.polygon, spanDirection: d.spanDirection, zoneId: d.zone, slab: d.slab ?? null,
    })),
    PointLoad: at(plan.pointLoads).map(({ item: p, position }) => ({
      schemeId,
      elementId: p.id,
      position,
      levelId: p.level,
      xFt: p.x_ft,
      yFt: p.y_ft,
      dKip: p.D_kip,
      lKip: p.L_kip,
      lrKip: p.Lr_kip ?? null,
      sKip: p.S_kip ?? null,
    })),
    LineLoad: at(plan.lineLoads).map(({ item: w, position }) => ({
      schemeId,
      elementId: w.id,
      position,
      levelId: w.level,
      startXFt: w.start[0],
      startYFt: w.start[1],
      endXFt: w.end[0],
      endYFt: w.end[1],
      dKlf: w.D_klf,
      lKlf: w.L_klf,
      lrKlf: w.Lr_klf ?? null,
      sKlf: w.S_klf ?? null,
    })),
    Opening: at(plan.openings).map(({ item: o, position }) => ({
      schemeId, elementId: o.id, position, levelId: o.level, polygon: o.polygon,
    })),
  };
}

/** A digest per table of the rows written, to tell which tables a save changes. */
type RowDigests = Record<ElementModel, string>;

function rowDigests(rows: Record<ElementModel, Record<string, unknown>[]>): RowDigests {
  const out = {} as RowDigests;
  for (const name of ELEMENT_MODELS) out[name] = createHash('sha1').update(JSON.stringify(rows[name])).digest('base64');
  return out;
}

/**
 * What this process last wrote for a scheme: the revision and a digest of each table's rows.
 * A revision's rows never change after it is committed (every write bumps the revision, and
 * the bump is compare-and-set on the revision the writer started from), so when a save starts
 * from the revision recorded here, a table whose rows digest the same already holds them and
 * is left alone: a small edit rewrites one table, not nine. Recorded only after the commit;
 * without a record (another process wrote, or after a restart) every table is rewritten.
 */
const WRITTEN_SCHEMES_KEPT = 2000;
const written = new Map<string, { revision: number; digests: RowDigests }>();

function recordWritten(schemeId: string, revision: number, digests: RowDigests): void {
  written.delete(schemeId);
  written.set(schemeId, { revision, digests });
  while (written.size > WRITTEN_SCHEMES_KEPT) written.delete(written.keys().next().value as string);
}

/**
 * Writes the plan's element rows (inside the caller's transaction): each table whose rows
 * differ from those of `fromRevision` (when this process knows them) is replaced. Returns the
 * digests of what the tables now hold.
 */
async function writePlanRows(db: Db, schemeId: string, plan: Plan, transaction: Transaction, fromRevision: number | null): Promise<RowDigests> {
  const { models } = db;
  const rows = planRows(schemeId, plan);
  const digests = rowDigests(rows);
  const known = fromRevision === null ? undefined : written.get(schemeId);
  const before = known && known.revision === fromRevision ? known.digests : null;
  for (const name of ELEMENT_MODELS) {
    if (before && before[name] === digests[name]) continue;
    const model = models[name] as unknown as ModelStatic<Model>;
    await model.destroy({ where: { schemeId }, transaction });
    if (rows[name].length > 0) await model.bulkCreate(rows[name], { transaction });
  }
  return digests;
}

/** Replaces the scheme's element rows with the plan's (inside the caller's transaction). */
export async function replacePlanRows(db: Db, schemeId: string, plan: Plan, transaction: Transaction): Promise<void> {
  written.delete(schemeId);
  await writePlanRows(db, schemeId, plan, transaction, null);
}

// ---------------------------------------------------------------------------------------
// Rows → plan

/** Sets key on target only when the stored value says it was present. */
function setOptional<T extends object, K extends string>(target: T, key: K, value: unknown, explicitNull = false): void {
  if (value !== null && value !== undefined) (target as Record<string, unknown>)[key] = value;
  else if (explicitNull) (target as Record<string, unknown>)[key] = null;
}

/** Rebuilds the scheme's plan file from its rows (the inverse of replacePlanRows). */
export async function readPlan(db: Db, scheme: SchemeAttributes, transaction?: Transaction): Promise<Plan> {
  const { models } = db;
  const q = { where: { schemeId: scheme.id }, order: [['position', 'ASC']] as [string, string][], raw: true, transaction };
  const [levels, grids, columns, members, zones, decks, pointLoads, lineLoads, openings] = await Promise.all([
    models.Level.findAll(q),
    models.GridLine.findAll(q),
    models.Column.findAll(q),
    models.Member.findAll(q),
    models.Zone.findAll(q),
    models.Deck.findAll(q),
    models.PointLoad.findAll(q),
    models.LineLoad.findAll(q),
    models.Opening.findAll(q),
  ]);
  // raw rows: JSON columns come back parsed on every dialect Sequelize supports except
  // SQLite raw queries, where they may be strings.
  const json = <T>(value: unknown): T => (typeof value === 'string' ? (JSON.parse(value) as T) : (value as T));
  const bool = (value: unknown): boolean | null => (value === null || value === undefined ? null : Boolean(value));
  const a = <T>(rows: unknown[]) => rows as T[];

  const plan: Plan = {
    format: PLAN_FORMAT,
    version: 2,
    name: scheme.name,
    designBasis: json(scheme.designBasis),
    levels: a<LevelAttributes>(levels).map((l) => {
      const level: Plan['levels'][number] = { id: l.elementId, name: l.name, elevation_ft: l.elevationFt };
      setOptional(level, 'roof', bool(l.roof));
      return level;
    }),
    columns: a<ColumnAttributes>(columns).map((c) => {
      const column: Plan['columns'][number] = { id: c.elementId, x_ft: c.xFt, y_ft: c.yFt, levels: json<string[]>(c.levels) };
      setOptional(column, 'shape', c.shape, (c.nullFields ?? '').split(',').includes('shape'));
      setOptional(column, 'spliceLevels', c.spliceLevels === null ? null : json(c.spliceLevels));
      setOptional(column, 'tierShapes', c.tierShapes == null ? null : json(c.tierShapes));
      return column;
    }),
    members: a<MemberAttributes>(members).map((r) => {
      const nulls = new Set((r.nullFields ?? '').split(',').filter(Boolean));
      const m: PlanMember = {
        id: r.elementId,
        level: r.levelId,
        kind: r.kind,
        start: [r.startXFt, r.startYFt],
        end: [r.endXFt, r.endYFt],
        shape: r.shape,
        maxDepth_in: r.maxDepthIn,
      };
      setOptional(m, 'minDepth_in', r.minDepthIn, nulls.has('minDepth_in'));
      setOptional(m, 'allowedNominalDepths', r.allowedNominalDepths === null ? null : json(r.allowedNominalDepths), nulls.has('allowedNominalDepths'));
      setOptional(m, 'Lb_override_ft', r.lbOverrideFt, nulls.has('Lb_override_ft'));
      setOptional(m, 'bracing', r.bracing === null ? null : json(r.bracing), nulls.has('bracing'));
      setOptional(m, 'deflectionLimits', r.deflectionLimits === null || r.deflectionLimits === undefined ? null : json(r.deflectionLimits), nulls.has('deflectionLimits'));
      setOptional(m, 'mark', r.mark, nulls.has('mark'));
      setOptional(m, 'markLocked', bool(r.markLocked));
      setOptional(m, 'composite', bool(r.composite), nulls.has('composite'));
      setOptional(m, 'studs', r.studs, nulls.has('studs'));
      return m;
    }),
    zones: a<ZoneAttributes>(zones).map((z) => ({
      id: z.elementId,
      name: z.name,
      dead_psf: z.deadPsf,
      superimposedDead_psf: z.superimposedDeadPsf,
      partition_psf: z.partitionPsf,
      live_psf: z.livePsf,
      liveReducible: Boolean(z.liveReducible),
      roofLive_psf: z.roofLivePsf,
      snow_psf: z.snowPsf,
    })),
    decks: a<DeckAttributes>(decks).map((d) => {
      const deck: Plan['decks'][number] = { id: d.elementId, level: d.levelId, polygon: json(d.polygon), spanDirection: d.spanDirection, zone: d.zoneId };
      setOptional(deck, 'slab', d.slab === null ? null : json(d.slab));
      return deck;
    }),
    pointLoads: a<PointLoadAttributes>(pointLoads).map((p) => {
      const load: Plan['pointLoads'][number] = { id: p.elementId, level: p.levelId, x_ft: p.xFt, y_ft: p.yFt, D_kip: p.dKip, L_kip: p.lKip };
      setOptional(load, 'Lr_kip', p.lrKip);
      setOptional(load, 'S_kip', p.sKip);
      return load;
    }),
    lineLoads: a<LineLoadAttributes>(lineLoads).map((w) => {
      const load: Plan['lineLoads'][number] = {
        id: w.elementId, level: w.levelId, start: [w.startXFt, w.startYFt], end: [w.endXFt, w.endYFt], D_klf: w.dKlf, L_klf: w.lKlf,
      };
      setOptional(load, 'Lr_klf', w.lrKlf);
      setOptional(load, 'S_klf', w.sKlf);
      return load;
    }),
    openings: a<OpeningAttributes>(openings).map((o) => ({ id: o.elementId, level: o.levelId, polygon: json(o.polygon) })),
  };
  if (scheme.hasGrids) {
    plan.grids = a<GridLineAttributes>(grids).map((g) => ({ id: g.elementId, axis: g.axis, label: g.label, offset_ft: g.offsetFt }));
  }
  return plan;
}

// ---------------------------------------------------------------------------------------
// Writing a revision

export interface CommitInput {
  plan: Plan;
  userId: string;
  note: string | null;
  /** The revision the writer started from; the write fails with 409 when it is not current. */
  expectedRevision: number;
}

export class RevisionConflict extends Error {
  constructor() {
    super('revision conflict');
    this.name = 'RevisionConflict';
  }
}

/**
 * Writes the plan as the scheme's next revision in one transaction: revision bump (compare
 * and set on the expected revision), element rows, revision snapshot. Any failure rolls
 * everything back, so the previously saved plan is never lost. Returns the new revision.
 */
export async function commitPlanRevision(db: Db, scheme: SchemeRow, input: CommitInput): Promise<number> {
  const schemeId = scheme.getDataValue('id');
  const next = input.expectedRevision + 1;
  const plan: Plan = { ...input.plan, name: scheme.getDataValue('name') };
  return db.sequelize.transaction(async (transaction) => {
    const [updated] = await db.models.Scheme.update(
      {
        revision: next,
        updatedBy: input.userId,
        designBasis: plan.designBasis,
        hasGrids: plan.grids !== undefined,
      },
      { where: { id: schemeId, revision: input.expectedRevision }, transaction },
    );
    if (updated !== 1) throw new RevisionConflict();
    const digests = await writePlanRows(db, schemeId, plan, transaction, input.expectedRevision);
    await db.models.PlanRevision.create(
      { schemeId, revision: next, plan: exportPlanFile(plan), note: input.note, userId: input.userId },
      { transaction },
    );
    return { next, digests };
  }).then(
    ({ next, digests }) => {
      recordWritten(schemeId, next, digests);
      return next;
    },
    (err: unknown) => {
      // What the tables hold after a failed write is whatever the rollback left: known no more.
      written.delete(schemeId);
      throw err;
    },
  );
}

/** Writes the first revision of a new scheme (row already created inside transaction). */
export async function writeInitialRevision(
  db: Db,
  schemeId: string,
  plan: Plan,
  userId: string,
  note: string | null,
  transaction: Transaction,
): Promise<void> {
  await replacePlanRows(db, schemeId, plan, transaction);
  await db.models.PlanRevision.create(
    { schemeId, revision: 1, plan: exportPlanFile(plan) as PlanFileInput, note, userId },
    { transaction },
  );
  // Not recorded as written: the caller's transaction may still roll back.
}
