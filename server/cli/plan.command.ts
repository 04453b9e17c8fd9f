import { parsePlanFile } from '../../shared/schemas/plan.schema';
import { gravityLoadProblems } from '../../shared/schemas/plan-gravity-loads';
import { columnInputProblems } from '../../shared/schemas/plan-columns';
import { designScheme } from '../../shared/engine/index';
import { EXIT_DESIGN_FAILS, EXIT_OK, errorOutcome, readJsonArgument, type CommandOutcome } from './cli-io';

/**
 * `calc plan <file.json | ->`: a whole scheme (calc-interface.md). Exit 0 when every member
 * passes and there is no error-level problem; 1 when a member fails or the plan has problems
 * (unsupported ends, cycles, loads off the floor...); 2 when the file cannot be read as a plan.
 */
export function runPlanCommand(args: string[]): CommandOutcome {
  const groupIdentical = args.includes('--group');
  const file = args.find((a) => a !== '--group');
  const { plan, repairs, problems } = parsePlanFile(readJsonArgument(file));
  const fatal = problems.filter((p) => p.severity === 'error');
  if (plan) fatal.push(...gravityLoadProblems(plan), ...columnInputProblems(plan));
  if (!plan || fatal.length > 0) {
    return errorOutcome('invalid plan file', fatal.map((p) => p.message));
  }
  for (const r of repairs) process.stderr.write(`calc plan: repaired: ${r}\n`);
  const result = designScheme(plan, { groupIdentical });
  const allProblems = [...problems, ...result.problems];
  const ok = result.members.every((m) => m.passes) && !allProblems.some((p) => p.severity === 'error');
  return { json: { ...result, problems: allProblems, repairs }, exitCode: ok ? EXIT_OK : EXIT_DESIGN_FAILS };
}
