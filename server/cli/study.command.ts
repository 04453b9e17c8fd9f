import { parsePlanFile } from '../../shared/schemas/plan.schema';
import { gravityLoadProblems } from '../../shared/schemas/plan-gravity-loads';
import { parseStudySpec } from '../../shared/schemas/study.schema';
import { runStudy, StudyInputError } from '../../shared/engine/index';
import { EXIT_DESIGN_FAILS, EXIT_OK, errorOutcome, readJsonArgument, type CommandOutcome } from './cli-io';

/**
 * `calc study <file.json | ->`: framing options for a region (calc-interface.md, "calc study").
 * Input `{ plan, region, spacing_ft | beamCount, directions?, depthLimits_in?, Fy_ksi?, composite?, unitPrices? }`
 * (`composite`: [true, false] tries composite and bare steel framing, like both directions).
 * Exit 0 when at least one option passes; 1 when none does; 2 on bad input (a bad range, too
 * many options, a region the plan does not have), naming the field.
 */
export function runStudyCommand(args: string[]): CommandOutcome {
  const input = readJsonArgument(args[0]);
  const doc = (input ?? {}) as Record<string, unknown>;
  if (typeof input !== 'object' || input === null || Array.isArray(input)) return errorOutcome('invalid study request', ['input: must be a JSON object with plan, region and spacing_ft']);
  const { plan: planDoc, ...request } = doc;
  const problems: string[] = [];
  if (planDoc === undefined) problems.push('plan: give the plan file');
  const parsedPlan = planDoc === undefined ? null : parsePlanFile(planDoc);
  if (parsedPlan) {
    const fatal = parsedPlan.problems.filter((p) => p.severity === 'error');
    if (parsedPlan.plan) fatal.push(...gravityLoadProblems(parsedPlan.plan));
    problems.push(...fatal.map((p) => `plan: ${p.message}`));
    if (!parsedPlan.plan && fatal.length === 0) problems.push('plan: not a plan file');
  }
  const { spec, problems: specProblems } = parseStudySpec(request);
  problems.push(...specProblems);
  if (problems.length > 0 || !spec || !parsedPlan?.plan) return errorOutcome('invalid study request', problems);
  for (const r of parsedPlan.repairs) process.stderr.write(`calc study: repaired: ${r}\n`);
  try {
    const result = runStudy(parsedPlan.plan, spec, { onProgress: (done, total) => process.stderr.write(`calc study: option ${done} of ${total}\n`) });
    return { json: result, exitCode: result.options.some((o) => o.passes) ? EXIT_OK : EXIT_DESIGN_FAILS };
  } catch (e) {
    if (e instanceof StudyInputError) return errorOutcome('invalid study request', e.problems);
    throw e;
  }
}
