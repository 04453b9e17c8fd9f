import { designMember, MemberInputError } from '../../shared/engine/index';
import { parseMemberInput } from '../../shared/schemas/member.schema';
import { EXIT_DESIGN_FAILS, EXIT_OK, errorOutcome, readJsonArgument, type CommandOutcome } from './cli-io';

/** `calc member <file.json | ->`: one simple-span member, designed or checked. */
export function runMemberCommand(args: string[]): CommandOutcome {
  const parsed = parseMemberInput(readJsonArgument(args[0]));
  if (!parsed.ok) return errorOutcome('invalid member input', parsed.problems);
  try {
    const result = designMember(parsed.input);
    return { json: result, exitCode: result.passes ? EXIT_OK : EXIT_DESIGN_FAILS };
  } catch (e) {
    if (e instanceof MemberInputError) return errorOutcome(e.message, e.problems);
    throw e;
  }
}
