/**
 * Ordered migrations of the plan file. Each migration takes a document at version `from`
 * and returns one at `from + 1`. Version 1 is current, so the list is empty today; when
 * version 2 comes, append { from: 1, describe, migrate } and bump CURRENT_PLAN_VERSION.
 */
import { planProblem, type PlanProblem } from './plan-problem.schema';

export const CURRENT_PLAN_VERSION = 1;

export interface PlanMigration {
  from: number;
  /** One sentence for the repairs list, e.g. "version 1 → 2: deck zone split into zones[]". */
  describe: string;
  migrate: (document: Record<string, unknown>) => Record<string, unknown>;
}

export const PLAN_MIGRATIONS: readonly PlanMigration[] = [];

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
