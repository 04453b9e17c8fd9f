import type { WhereOptions } from 'sequelize';
import { summarizeRevision } from '../../shared/drafting/revision-summary.drafting';
import { buildFramingTopology, deckOverlapProblems } from '../../shared/engine/index';
import {
  DEFAULT_COMPOSITE_SETTINGS,
  exportPlanFile,
  parsePlanFile,
  PLAN_FORMAT,
  type Plan,
  type PlanDesignBasis,
  type PlanFileInput,
  type PlanProblem,
} from '../../shared/schemas/plan.schema';
import { gravityLoadProblems } from '../../shared/schemas/plan-gravity-loads';
import { columnInputProblems } from '../../shared/schemas/plan-columns';
import { mergePlans, type MergeConflict } from '../../shared/schemas/plan-merge';
import { describeChanges, elementName, sideWords } from '../../shared/drafting/plan-changes.drafting';
import { AppError } from '../errors/app-error';
import type { SchemeAttributes, SchemeStatus } from '../models/scheme.model';
import type { SchemePatchInput } from '../schemas/scheme.schema';
import {
  assertOwnProject,
  commitPlanRevision,
  findOwnScheme,
  readPlan,
  RevisionConflict,
  storageProblems,
  writeInitialRevision,
  type SchemeRow,
  type SchemeServiceContext,
} from './plan-store.service';
import { recordSchemeAudit, SCHEME_AUDIT_ACTIONS } from './scheme-audit.service';
import { latestDesignRuns, storeDesignRun, toDesignSummary, type DesignSummary } from './scheme-design.service';
import { unpackDesignResult } from './design-run-storage';

export type { SchemeServiceContext } from './plan-store.service';

/** The design basis of a new scheme (design-basis.md §1, §5; IBC Table 1604.3 floor limits). */
export const DEFAULT_DESIGN_BASIS: PlanDesignBasis = {
  method: 'LRFD',
  Fy_ksi: 50,
  liveLoadReduction: true,
  deflectionLimits: { live: 360, total: 240 },
  // Composite design is the normal case for beams under concrete on deck (design-basis §6);
  // members of a deck without a slab build-up stay bare steel and say so.
  composite: { ...DEFAULT_COMPOSITE_SETTINGS, enabled: true },
};

/** A new scheme: one level, no framing yet. */
export function emptyPlan(name: string): Plan {
  return {
    format: PLAN_FORMAT,
    version: 2,
    name,
    designBasis: structuredClone(DEFAULT_DESIGN_BASIS),
    grids: [],
    levels: [{ id: 'L2', name: 'Level 2', elevation_ft: 14 }],
    columns: [],
    members: [],
    zones: [],
    decks: [],
    pointLoads: [],
    lineLoads: [],
    openings: [],
  };
}

export interface PersonRef {
  id: string;
  name: string;
}

export interface SchemeSummary {
  id: string;
  projectId: string;
  name: string;
  status: SchemeStatus;
  archived: boolean;
  revision: number;
  designBasis: PlanDesignBasis;
  createdBy: PersonRef | null;
  updatedBy: PersonRef | null;
  createdAt: string;
  updatedAt: string;
  /** The latest design run, or null when never designed. */
  design: DesignSummary | null;
  /** True when there is no design of the current revision (never designed, or saved since). */
  designStale: boolean;
}

export interface SchemeDetail extends SchemeSummary {
  plan: PlanFileInput;
}

async function peopleByIds(ctx: SchemeServiceContext, ids: (string | null)[]): Promise<Map<string, PersonRef>> {
  const wanted = [...new Set(ids.filter((id): id is string => typeof id === 'string'))];
  const out = new Map<string, PersonRef>();
  if (wanted.length === 0) return out;
  const users = await ctx.db.models.User.findAll({ where: { id: wanted }, attributes: ['id', 'name'] });
  for (const u of users) out.set(u.getDataValue('id'), { id: u.getDataValue('id'), name: u.getDataValue('name') });
  return out;
}

async function toSummaries(ctx: SchemeServiceContext, rows: SchemeAttributes[]): Promise<SchemeSummary[]> {
  const people = await peopleByIds(ctx, rows.flatMap((r) => [r.createdBy, r.updatedBy]));
  const runs = await latestDesignRuns(ctx.db, rows.map((r) => r.id));
  return rows.map((s) => {
    const run = runs.get(s.id);
    const design = run ? toDesignSummary(run, s.revision) : null;
    return {
      id: s.id,
      projectId: s.projectId,
      name: s.name,
      status: s.status,
      archived: Boolean(s.archived),
      revision: s.revision,
      designBasis: typeof s.designBasis === 'string' ? JSON.parse(s.designBasis) : s.designBasis,
      createdBy: s.createdBy ? (people.get(s.createdBy) ?? null) : null,
      updatedBy: s.updatedBy ? (people.get(s.updatedBy) ?? null) : null,
      createdAt: new Date(s.createdAt).toISOString(),
      updatedAt: new Date(s.updatedAt).toISOString(),
      design,
      designStale: design === null || design.stale,
    };
  });
}

async function toDetail(ctx: SchemeServiceContext, row: SchemeRow): Promise<SchemeDetail> {
  const attrs = row.get({ plain: true });
  const [summary] = await toSummaries(ctx, [attrs]);
  const plan = await readPlan(ctx.db, attrs);
  return { ...summary, plan: exportPlanFile(plan) };
}

/** Each problem's path and message, as the error body's `fields` (the first message per path). */
function problemFields(problems: readonly PlanProblem[]): Record<string, string> | undefined {
  const fields: Record<string, string> = {};
  for (const p of problems) if (p.path && !(p.path in fields)) fields[p.path] = p.message;
  return Object.keys(fields).length ? fields : undefined;
}

/** Reads a plan document through migrations, zod and repair; 422 plan_invalid naming each element. */
export function acceptPlan(
  document: unknown,
  options: { checkGravityLoads: boolean } = { checkGravityLoads: true },
): { plan: Plan; repairs: string[]; warnings: PlanProblem[] } {
  const { plan, repairs, problems } = parsePlanFile(document);
  const errors = problems.filter((p) => p.severity === 'error');
  if (plan) errors.push(...storageProblems(plan));
  if (plan && options.checkGravityLoads) errors.push(...gravityLoadProblems(plan), ...columnInputProblems(plan));
  if (!plan || errors.length > 0) {
    const first = errors[0]?.message ?? 'the file is not a plan';
    throw new AppError(
      422,
      'plan_invalid',
      `The plan cannot be saved: ${first}${errors.length > 1 ? ` (and ${errors.length - 1} more)` : ''}.`,
      { details: { problems: errors, repairs }, fields: problemFields(errors) },
    );
  }
  return { plan, repairs, warnings: problems.filter((p) => p.severity !== 'error') };
}

/**
 * Problems of a saved plan that do not stop it being saved: a drawing in progress is
 * legitimately incomplete (a member end that lands on nothing yet, a zero-length member,
 * a support cycle). They are reported with the save and again by the design.
 */
function topologyProblems(plan: Plan): PlanProblem[] {
  try {
    return [...buildFramingTopology(plan).problems, ...deckOverlapProblems(plan)];
  } catch {
    return [];
  }
}

// ---------------------------------------------------------------------------------------

export async function listSchemes(
  ctx: SchemeServiceContext,
  projectId: string,
  options: { archived: 'include' | 'exclude' | 'only' } = { archived: 'include' },
): Promise<SchemeSummary[]> {
  await assertOwnProject(ctx, projectId);
  const where: WhereOptions<SchemeAttributes> =
    options.archived === 'include'
      ? { projectId }
      : { projectId, archived: options.archived === 'only' };
  const rows = await ctx.db.models.Scheme.findAll({ where, order: [['createdAt', 'ASC'], ['name', 'ASC']] });
  return toSummaries(ctx, rows.map((r) => r.get({ plain: true })));
}

export async function getScheme(ctx: SchemeServiceContext, schemeId: string): Promise<SchemeDetail> {
  return toDetail(ctx, await findOwnScheme(ctx, schemeId));
}

/** Creates a scheme with an empty plan ({name}) or from an imported plan file ({name?, plan}). */
export async function createScheme(
  ctx: SchemeServiceContext,
  projectId: string,
  input: { name?: string; plan?: unknown },
): Promise<SchemeDetail & { repairs: string[]; problems: PlanProblem[] }> {
  await assertOwnProject(ctx, projectId);
  let plan: Plan;
  let repairs: string[] = [];
  let warnings: PlanProblem[] = [];
  if (input.plan !== undefined) {
    ({ plan, repairs, warnings } = acceptPlan(input.plan));
  } else {
    plan = emptyPlan(input.name ?? 'Scheme');
  }
  const name = (input.name ?? plan.name.trim()).slice(0, 200) || 'Imported scheme';
  plan = { ...plan, name };
  const imported = input.plan !== undefined;
  const row = await insertScheme(ctx, projectId, plan, imported ? 'Imported from a plan file' : 'New scheme');
  await recordSchemeAudit(ctx, {
    action: imported ? SCHEME_AUDIT_ACTIONS.imported : SCHEME_AUDIT_ACTIONS.created,
    schemeId: row.getDataValue('id'),
    schemeName: name,
    projectId,
    detail: imported ? { revision: 1, repairs: repairs.length } : { revision: 1 },
  });
  const detail = await toDetail(ctx, row);
  return { ...detail, repairs, problems: [...warnings, ...topologyProblems(plan)] };
}

async function insertScheme(ctx: SchemeServiceContext, projectId: string, plan: Plan, note: string): Promise<SchemeRow> {
  const { db, actor } = ctx;
  return db.sequelize.transaction(async (transaction) => {
    const row = await db.models.Scheme.create(
      {
        projectId,
        name: plan.name,
        designBasis: plan.designBasis,
        hasGrids: plan.grids !== undefined,
        revision: 1,
        createdBy: actor.userId,
        updatedBy: actor.userId,
      },
      { transaction },
    );
    await writeInitialRevision(db, row.getDataValue('id'), plan, actor.userId, note, transaction);
    return row;
  });
}

export interface RevisionConflictCurrent {
  revision: number;
  plan: PlanFileInput;
  updatedBy: PersonRef | null;
  updatedAt: string;
}

/** What a save based on an older revision took in from the saves made since (200 with `merged`). */
export interface SaveMerge {
  /** The revision the save started from. */
  basedOn: number;
  /** The revision it was merged with, and who saved the revisions in between. */
  mergedWith: number;
  by: string[];
  /** One line per element taken in from their saves, named as people name them (marks, grid locations, level names). */
  changes: string[];
  /** The plan as saved: theirs and mine together. */
  plan: PlanFileInput;
}

export interface SaveConflictItem {
  kind: MergeConflict['kind'];
  id: string;
  /** "beam 2B1 at B–C / 2" */
  label: string;
  mine: string;
  theirs: string;
}

/** A save's plan with the scheme's own name (the plan name is the scheme's; renaming is not a plan edit). */
const named = (plan: Plan, name: string): Plan => ({ ...plan, name });

async function savedBetween(ctx: SchemeServiceContext, schemeId: string, after: number, upTo: number): Promise<string[]> {
  const rows = await ctx.db.models.PlanRevision.findAll({ where: { schemeId }, attributes: ['revision', 'userId'], order: [['revision', 'ASC']] });
  const ids = rows.filter((r) => r.getDataValue('revision') > after && r.getDataValue('revision') <= upTo).map((r) => r.getDataValue('userId'));
  const people = await peopleByIds(ctx, ids);
  return [...new Set(ids.map((id) => (id ? (people.get(id)?.name ?? 'someone else') : 'someone else')))];
}

/** What their saves changed that this save did not also do the same way. */
function theirsOnly(base: Plan, mine: Plan, theirs: Plan): string[] {
  const same = new Set(describeChanges(base, mine));
  return describeChanges(base, theirs).filter((line) => !same.has(line));
}

type MergeAttempt =
  | { kind: 'merged'; plan: Plan; current: Plan; currentRevision: number; base: Plan }
  | { kind: 'conflict'; error: AppError };

/**
 * A save based on revision `basedOn` when the scheme has moved on: a three-way merge on
 * element ids (shared/schemas/plan-merge) of the base revision's snapshot, this save and the
 * current plan. Elements only one side changed are taken from that side; elements both
 * changed differently are a 409 naming each one as people name it, with the current plan.
 */
async function mergeWithCurrent(ctx: SchemeServiceContext, scheme: SchemeRow, basedOn: number, mine: Plan): Promise<MergeAttempt> {
  const schemeId = scheme.getDataValue('id');
  const attrs = scheme.get({ plain: true });
  const name = attrs.name;
  const snapshot = basedOn < attrs.revision ? await ctx.db.models.PlanRevision.findOne({ where: { schemeId, revision: basedOn } }) : null;
  if (!snapshot) return { kind: 'conflict', error: await conflictError(ctx, schemeId, basedOn, [], null) };
  const raw = snapshot.getDataValue('plan');
  const parsedBase = parsePlanFile(typeof raw === 'string' ? JSON.parse(raw) : raw).plan;
  if (!parsedBase) return { kind: 'conflict', error: await conflictError(ctx, schemeId, basedOn, [], null) };
  const base = named(parsedBase, name);
  const current = named(await readPlan(ctx.db, attrs), name);
  const { plan, conflicts } = mergePlans(base, named(mine, name), current);
  if (conflicts.length > 0) {
    const items = conflicts.map((c) => ({
      kind: c.kind,
      id: c.id,
      label: elementName(c.kind, c.id, [current, mine, base]),
      mine: sideWords(c, base, mine),
      theirs: sideWords(c, base, current),
    }));
    return { kind: 'conflict', error: await conflictError(ctx, schemeId, basedOn, items, null) };
  }
  // The merge must itself be a plan that can be saved (their removed level under my new beam is not).
  try {
    acceptPlan(exportPlanFile(plan));
  } catch (err) {
    if (!(err instanceof AppError)) throw err;
    return { kind: 'conflict', error: await conflictError(ctx, schemeId, basedOn, [], err.message.replace(/^The plan cannot be saved: /, '')) };
  }
  return { kind: 'merged', plan, current, currentRevision: attrs.revision, base };
}

async function conflictError(
  ctx: SchemeServiceContext,
  schemeId: string,
  yourRevision: number,
  conflicts: SaveConflictItem[] = [],
  mergeProblem: string | null = null,
): Promise<AppError> {
  const detail = await getScheme(ctx, schemeId);
  const current: RevisionConflictCurrent = {
    revision: detail.revision,
    plan: detail.plan,
    updatedBy: detail.updatedBy,
    updatedAt: detail.updatedAt,
  };
  const who = current.updatedBy?.name ?? 'someone else';
  const shown = conflicts.slice(0, 5).map((c) => c.label);
  const what = conflicts.length
    ? ` and changed ${conflicts.length === 1 ? 'an element' : `${conflicts.length} elements`} you also changed: ${shown.join('; ')}${conflicts.length > shown.length ? ` and ${conflicts.length - shown.length} more` : ''}. Your other changes merge with theirs; choose whose version to keep for ${conflicts.length === 1 ? 'it' : 'each'} and save again.`
    : mergeProblem
      ? `; your changes and theirs cannot be merged as they stand (${mergeProblem}). Your changes were not saved; choose whose plan to keep.`
      : '. Your changes were not saved; merge them into the current plan and save again.';
  return new AppError(
    409,
    'revision_conflict',
    `This scheme was saved by ${who} since revision ${yourRevision} (it is now at revision ${current.revision})${what}`,
    { details: { current, conflicts, ...(mergeProblem ? { mergeProblem } : {}) } },
  );
}

/**
 * PUT /api/schemes/:id/plan. Saves the plan as the next revision when `revision` is the
 * current one. A save based on an older revision is merged with the saves made since
 * (three-way on element ids): when no element was changed by both, the merge is saved as a
 * new revision and the answer carries `merged` (what was taken in from the others and the
 * plan as saved); otherwise 409 revision_conflict names each element both changed, with the
 * current plan, and nothing is written. Plans that cannot be read or repaired are refused
 * (422); topology problems are saved and reported.
 */
export async function saveSchemePlan(
  ctx: SchemeServiceContext,
  schemeId: string,
  input: { revision: number; plan: unknown; note: string | null },
): Promise<{ revision: number; repairs: string[]; problems: PlanProblem[]; merged?: SaveMerge }> {
  let scheme = await findOwnScheme(ctx, schemeId);
  const { plan, repairs, warnings } = acceptPlan(input.plan);
  // A save that races another is merged with it; a few rounds at most, then it is a conflict.
  for (let round = 0; round < 4; round++) {
    const currentRevision = scheme.getDataValue('revision');
    let toWrite = plan;
    let merge: SaveMerge | undefined;
    if (input.revision !== currentRevision) {
      const attempt = await mergeWithCurrent(ctx, scheme, input.revision, plan);
      if (attempt.kind === 'conflict') throw attempt.error;
      toWrite = attempt.plan;
      merge = {
        basedOn: input.revision,
        mergedWith: currentRevision,
        by: await savedBetween(ctx, schemeId, input.revision, currentRevision),
        changes: theirsOnly(attempt.base, named(plan, attempt.base.name), attempt.current),
        plan: exportPlanFile(attempt.plan),
      };
      // Nothing of mine is left to write (I changed nothing they had not): their revision stands.
      if (JSON.stringify(exportPlanFile(attempt.plan)) === JSON.stringify(exportPlanFile(attempt.current))) {
        return { revision: currentRevision, repairs, problems: [...warnings, ...topologyProblems(attempt.plan)], merged: merge };
      }
    }
    try {
      const revision = await commitPlanRevision(ctx.db, scheme, {
        plan: toWrite,
        userId: ctx.actor.userId,
        note: input.note ?? (merge ? `Merged with revision ${merge.mergedWith}` : null),
        expectedRevision: currentRevision,
      });
      await recordSchemeAudit(ctx, {
        action: SCHEME_AUDIT_ACTIONS.planRevised,
        schemeId,
        schemeName: scheme.getDataValue('name'),
        projectId: scheme.getDataValue('projectId'),
        detail: {
          revision,
          previousRevision: currentRevision,
          ...(merge ? { basedOn: input.revision, merged: true } : {}),
          ...(input.note ? { note: input.note } : {}),
        },
      });
      return { revision, repairs, problems: [...warnings, ...topologyProblems(toWrite)], ...(merge ? { merged: merge } : {}) };
    } catch (err) {
      if (!(err instanceof RevisionConflict)) throw err;
      scheme = await findOwnScheme(ctx, schemeId);
    }
  }
  throw await conflictError(ctx, schemeId, input.revision);
}

export async function exportScheme(
  ctx: SchemeServiceContext,
  schemeId: string,
): Promise<{ filename: string; plan: PlanFileInput }> {
  const scheme = await findOwnScheme(ctx, schemeId);
  const attrs = scheme.get({ plain: true });
  const plan = exportPlanFile(await readPlan(ctx.db, attrs));
  return { filename: `${fileSlug(attrs.name)}.plan.json`, plan };
}

/** ASCII file name from a scheme name ("Scheme A — beams at 10 ft" → "scheme-a-beams-at-10-ft"). */
export function fileSlug(name: string): string {
  const slug = name
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 80)
    .replace(/-+$/, '');
  return slug || 'scheme';
}

/** A copy of the scheme (plan at revision 1) with a copy of its latest design. */
export async function cloneScheme(
  ctx: SchemeServiceContext,
  schemeId: string,
  input: { name?: string },
): Promise<SchemeDetail> {
  const source = await findOwnScheme(ctx, schemeId);
  const src = source.get({ plain: true });
  const plan = await readPlan(ctx.db, src);
  const name = input.name ?? `${src.name} (copy)`.slice(0, 200);
  const note = `Cloned from "${src.name}" revision ${src.revision}`;
  const run = await ctx.db.models.DesignRun.findOne({
    where: { schemeId },
    order: [['createdAt', 'DESC'], ['revision', 'DESC']],
  });
  const row = await ctx.db.sequelize.transaction(async (transaction) => {
    const created = await ctx.db.models.Scheme.create(
      {
        projectId: src.projectId,
        name,
        designBasis: plan.designBasis,
        hasGrids: plan.grids !== undefined,
        revision: 1,
        createdBy: ctx.actor.userId,
        updatedBy: ctx.actor.userId,
      },
      { transaction },
    );
    const newId = created.getDataValue('id');
    await writeInitialRevision(ctx.db, newId, { ...plan, name }, ctx.actor.userId, note, transaction);
    if (run) {
      const r = run.get({ plain: true });
      // The copy is current when the source's design was; a stale design stays stale (revision 0).
      const result = unpackDesignResult(r.result);
      await storeDesignRun(
        ctx.db,
        { schemeId: newId, revision: r.revision === src.revision ? 1 : 0, result: { ...result, name }, userId: ctx.actor.userId },
        transaction,
      );
    }
    return created;
  });
  await recordSchemeAudit(ctx, {
    action: SCHEME_AUDIT_ACTIONS.cloned,
    schemeId: row.getDataValue('id'),
    schemeName: name,
    projectId: src.projectId,
    detail: {
      revision: 1,
      sourceSchemeId: schemeId,
      source: src.name,
      sourceRevision: src.revision,
      designCopied: run !== null,
    },
  });
  return toDetail(ctx, row);
}

/** Rename or archive; neither changes the plan revision. */
export async function updateScheme(
  ctx: SchemeServiceContext,
  schemeId: string,
  patch: SchemePatchInput,
): Promise<SchemeSummary> {
  const scheme = await findOwnScheme(ctx, schemeId);
  const changes: Partial<SchemeAttributes> = { updatedBy: ctx.actor.userId };
  if (patch.name !== undefined) changes.name = patch.name;
  if (patch.archived !== undefined) changes.archived = patch.archived;
  // A copy: get({ plain: true }) may hand back the live dataValues that update() changes.
  const before = { ...scheme.get({ plain: true }) };
  await scheme.update(changes);
  const about = { schemeId, projectId: before.projectId };
  if (patch.name !== undefined && patch.name !== before.name) {
    await recordSchemeAudit(ctx, {
      ...about,
      action: SCHEME_AUDIT_ACTIONS.renamed,
      schemeName: patch.name,
      detail: { from: before.name, to: patch.name },
    });
  }
  if (patch.archived !== undefined && patch.archived !== Boolean(before.archived)) {
    await recordSchemeAudit(ctx, {
      ...about,
      action: patch.archived ? SCHEME_AUDIT_ACTIONS.archived : SCHEME_AUDIT_ACTIONS.unarchived,
      schemeName: scheme.getDataValue('name'),
    });
  }
  const [summary] = await toSummaries(ctx, [scheme.get({ plain: true })]);
  return summary;
}

export async function deleteScheme(ctx: SchemeServiceContext, schemeId: string): Promise<void> {
  const scheme = await findOwnScheme(ctx, schemeId);
  const { name, projectId, revision } = scheme.get({ plain: true });
  // Element rows, revisions and design runs go with it (ON DELETE CASCADE, 0003).
  await scheme.destroy();
  await recordSchemeAudit(ctx, {
    action: SCHEME_AUDIT_ACTIONS.deleted,
    schemeId,
    schemeName: name,
    projectId,
    detail: { revision },
  });
}

export interface RevisionEntry {
  revision: number;
  userId: string | null;
  userName: string | null;
  createdAt: string;
  note: string | null;
  /** What this revision changed against the one before it, in marks and grid words (null when the one before is gone). */
  summary: string | null;
  current: boolean;
}

export async function listRevisions(ctx: SchemeServiceContext, schemeId: string): Promise<RevisionEntry[]> {
  const scheme = await findOwnScheme(ctx, schemeId);
  const current = scheme.getDataValue('revision');
  const rows = await ctx.db.models.PlanRevision.findAll({
    where: { schemeId },
    attributes: ['revision', 'userId', 'createdAt', 'note', 'plan'],
    order: [['revision', 'DESC']],
  });
  const people = await peopleByIds(ctx, rows.map((r) => r.getDataValue('userId')));
  const planOf = (i: number): Record<string, unknown> | null => {
    if (i >= rows.length) return null;
    const p = rows[i].getDataValue('plan') as unknown;
    return (typeof p === 'string' ? JSON.parse(p) : p) as Record<string, unknown>;
  };
  return rows.map((r, i) => {
    const userId = r.getDataValue('userId');
    // What this revision changed against the one before it (the next row, revisions run newest first).
    const before = i + 1 < rows.length && rows[i + 1].getDataValue('revision') === r.getDataValue('revision') - 1 ? planOf(i + 1) : null;
    const summary = before === null && r.getDataValue('revision') !== 1 ? null : summarizeRevision(before, planOf(i)!);
    return {
      summary,
      revision: r.getDataValue('revision'),
      userId,
      userName: userId ? (people.get(userId)?.name ?? null) : null,
      createdAt: new Date(r.getDataValue('createdAt')).toISOString(),
      note: r.getDataValue('note'),
      current: r.getDataValue('revision') === current,
    };
  });
}

/** Restore = a new revision whose plan equals the old one (nothing in between is lost). */
export async function restoreRevision(
  ctx: SchemeServiceContext,
  schemeId: string,
  revision: number,
): Promise<SchemeDetail & { restoredFrom: number }> {
  const scheme = await findOwnScheme(ctx, schemeId);
  const old = await ctx.db.models.PlanRevision.findOne({ where: { schemeId, revision } });
  if (!old) throw AppError.notFound(`Revision ${revision}`);
  const snapshot = old.getDataValue('plan');
  // Snapshots written by an older Baywright pass the plan file's migrations first.
  // A kept revision is restored as it was saved, even from before the gravity-load rule.
  const { plan } = acceptPlan(typeof snapshot === 'string' ? JSON.parse(snapshot) : snapshot, { checkGravityLoads: false });
  const expectedRevision = scheme.getDataValue('revision');
  try {
    const next = await commitPlanRevision(ctx.db, scheme, {
      plan,
      userId: ctx.actor.userId,
      note: `Restored revision ${revision}`,
      expectedRevision,
    });
    await recordSchemeAudit(ctx, {
      action: SCHEME_AUDIT_ACTIONS.planRestored,
      schemeId,
      schemeName: scheme.getDataValue('name'),
      projectId: scheme.getDataValue('projectId'),
      detail: { revision: next, restoredFrom: revision, previousRevision: expectedRevision },
    });
  } catch (err) {
    if (err instanceof RevisionConflict) throw await conflictError(ctx, schemeId, expectedRevision);
    throw err;
  }
  return { ...(await getScheme(ctx, schemeId)), restoredFrom: revision };
}
