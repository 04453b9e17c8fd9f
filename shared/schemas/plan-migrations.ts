/**
 * Ordered migrations of the plan file. Each migration takes a document at version `from`
 * and returns one at `from + 1`. Append new steps and bump CURRENT_PLAN_VERSION; never edit
 * a step that has shipped (its defaults are written out here, not imported, so they stay
 * what version 2 said they were).
 */
import { planProblem, type PlanProblem } from './plan-problem.schema';

export const CURRENT_PLAN_VERSION = 2;

export interface PlanMigration {
  from: number;
  /** One sentence for the repairs list, e.g. "version 1 → 2: deck zone split into zones[]". */
  describe: string;
  migrate: (document: Record<string, unknown>) => Record<string, unknown>;
}

const isObject = (v: unknown): v is Record<string, unknown> => v !== null && typeof v === 'object' && !Array.isArray(v);

/**
 * Version 1 → 2 (calc-interface.md "Additions for composite beams and columns"):
 * designBasis.composite with the published defaults and enabled: false (a version 1 plan was
 * designed bare steel and stays so until the engineer turns composite on). The member and
 * column additions (members[].composite, members[].studs, columns[].shape) default to null,
 * and an absent field reads as null, so the migration leaves them absent: a version 1 plan's
 * members and columns come out exactly as they were. decks[].slab and columns[].spliceLevels
 * are optional and stay absent. A composite object already present is kept.
 */
export const migrateV1ToV2: PlanMigration = {
  from: 1,
  describe: 'composite settings added with composite off (members follow them, studs designed, columns sized)',
  migrate: (document) => {
    const designBasis = document.designBasis;
    if (isObject(designBasis) && designBasis.composite === undefined) {
      designBasis.composite = {
        enabled: false,
        studDiameter_in: 0.75,
        studFu_ksi: 65,
        minPercentComposite: 0.25,
        constructionLive_psf: 20,
        shored: false,
        camber: true,
      };
    }
    return document;
  },
};

export const PLAN_MIGRATIONS: readonly PlanMigration[] = [migrateV1ToV2];

export type MigrationOutcome =
  | { ok: true; document: Record<string, unknown>; applied: string[] }
  | { ok: false; problem: PlanProblem };

/** Run the migrations from the document's version up to `targetVersion`, in order. */
export function migratePlanDocument(
  json: unknown,
  migrations: readonly PlanMigration[] = PLAN_MIGRATIONS,
  targetVersion: number = CURRENT_PLAN_VERSION,
): MigrationOutcome {
  if (json === null || typeof json !== 'object' || Array.isArray(json)) {
    return { ok: false, problem: planProblem('error', 'plan-not-object', 'The plan file must be a JSON object', { path: '(file)' }) };
  }
  let document = json as Record<string, unknown>;
  if (document.format !== 'baywright-plan') {
    return {
      ok: false,
      problem: planProblem('error', 'plan-format', `format: expected "baywright-plan", got ${JSON.stringify(document.format)}`, { path: 'format' }),
    };
  }
  const fileVersion = document.version;
  if (typeof fileVersion !== 'number' || !Number.isInteger(fileVersion) || fileVersion < 0) {
    return {
      ok: false,
      problem: planProblem('error', 'plan-version', `version: expected a whole number, got ${JSON.stringify(fileVersion)}`, { path: 'version' }),
    };
  }
  let version: number = fileVersion;
  if (version > targetVersion) {
    return {
      ok: false,
      problem: planProblem('error', 'plan-version-newer', `version: this file is version ${version}; this Baywright reads up to version ${targetVersion}`, { path: 'version' }),
    };
  }
  const applied: string[] = [];
  const ordered = [...migrations].sort((a, b) => a.from - b.from);
  while (version < targetVersion) {
    const step = ordered.find((m) => m.from === version);
    if (!step) {
      return { ok: false, problem: planProblem('error', 'plan-version-gap', `version: no migration from version ${version}`, { path: 'version' }) };
    }
    document = { ...step.migrate(structuredClone(document)), version: version + 1 };
    applied.push(`Migrated from version ${version} to ${version + 1}: ${step.describe}`);
    version = version + 1;
  }
  return { ok: true, document, applied };
}
