import { parsePlanFile } from '../../shared/schemas/plan.schema';
import { gravityLoadProblems } from '../../shared/schemas/plan-gravity-loads';
import { columnInputProblems } from '../../shared/schemas/plan-columns';
import { designScheme } from '../../shared/engine/index';
import { CliInputError, EXIT_DESIGN_FAILS, EXIT_OK, errorOutcome, readJsonArgument, type CommandOutcome } from './cli-io';
import { planOutput, type PlanOutputView } from './plan-output';

const PLAN_FLAGS = ['--group', '--summary', '--detail'];

/**
 * `calc plan [--group] [--summary | --detail] <file.json | ->`: a whole scheme (calc-interface.md).
 * Exit 0 when every member passes and there is no error-level problem; 1 when a member fails or
 * the plan has problems (unsupported ends, cycles, loads off the floor...); 2 when the file cannot
 * be read as a plan. The default document carries every calc-interface field; `--detail` adds each
 * member's sizing record and loads, `--summary` keeps the figures a schedule needs.
 */
export function runPlanCommand(args: string[]): CommandOutcome {
  const unknown = args.filter((a) => a.startsWith('--') && !PLAN_FLAGS.includes(a));
  if (unknown.length > 0) throw new CliInputError('unknown option', unknown.map((a) => `option ${a}: calc plan takes ${PLAN_FLAGS.join(', ')} (and --pretty)`));
  if (args.includes('--summary') && args.includes('--detail')) throw new CliInputError('conflicting options', ['option --summary: give --summary or --detail, not both']);
  const view: PlanOutputView = args.includes('--summary') ? 'summary' : args.includes('--detail') ? 'detail' : 'default';
  const groupIdentical = args.includes('--group');
  const file = args.find((a) => !PLAN_FLAGS.includes(a));
  const { plan, repairs, problems } = parsePlanFile(readJsonArgument(file));
  const fatal = problems.filter((p) => p.severity === 'error');
  if (plan) fatal.push(...gravityLoadProblems(plan), ...columnInputProblems(plan));
  if (!plan || fatal.length > 0) {
    return errorOutcome('invalid plan file', fatal.map((p) => p.message));
  }
  for (const r of repairs) process.stderr.write(`calc plan: repaired: ${r}\n`);
  // Only --detail prints each member's load list, so only --detail has the engine build it.
  const result = designScheme(plan, { groupIdentical, memberLoads: view === 'detail' });
  const allProblems = [...problems, ...result.problems];
  const ok = result.members.every((m) => m.passes) && !allProblems.some((p) => p.severity === 'error');
  // calc-interface.md "Additions": planOutput writes studs, camber_in and percentComposite on every member (null where not composite).
  return { json: planOutput({ ...result, problems: allProblems, repairs }, view), exitCode: ok ? EXIT_OK : EXIT_DESIGN_FAILS };
}
