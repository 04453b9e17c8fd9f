import type { CommandOutcome } from './cli-io';
import { runMemberCommand } from './member.command';
import { runPlanCommand } from './plan.command';
import { runStudyCommand } from './study.command';

/** Subcommand → handler. Add a subcommand by adding one entry. */
export const CALC_COMMANDS: Record<string, (args: string[]) => CommandOutcome | Promise<CommandOutcome>> = {
  member: runMemberCommand,
  plan: runPlanCommand,
  study: runStudyCommand,
};
