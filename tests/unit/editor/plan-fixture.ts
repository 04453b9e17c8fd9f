import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { parsePlanFile, type Plan } from '../../../shared/schemas/plan.schema';

/** The two-bay fixture plan (tests/fixtures/plans/two-bay.plan.json), parsed and repaired. */
export function twoBayPlan(): Plan {
  const raw = JSON.parse(readFileSync(resolve(__dirname, '../../fixtures/plans/two-bay.plan.json'), 'utf8'));
  const { plan, problems } = parsePlanFile(raw);
  if (!plan) throw new Error(`fixture did not parse: ${JSON.stringify(problems)}`);
  return plan;
}

/** A plan with a grid and nothing drawn. */
export function emptyGridPlan(): Plan {
  const plan = twoBayPlan();
  return { ...plan, columns: [], members: [], decks: [], pointLoads: [], lineLoads: [], openings: [] };
}
