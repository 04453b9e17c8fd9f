import { readFileSync } from 'node:fs';

/** Exit codes of `npm run -s calc` (calc-interface.md). */
export const EXIT_OK = 0;
export const EXIT_DESIGN_FAILS = 1;
export const EXIT_BAD_INPUT = 2;

export interface CommandOutcome { json: unknown; exitCode: number }

export class CliInputError extends Error {
  constructor(message: string, readonly problems: string[]) { super(message); }
}

export const errorOutcome = (message: string, problems: string[]): CommandOutcome => ({
  json: { error: { message, problems } }, exitCode: EXIT_BAD_INPUT,
});

/** Reads the JSON document named by the argument: a file path, or "-" for standard input. */
export function readJsonArgument(arg: string | undefined): unknown {
  if (!arg) throw new CliInputError('missing input', ['input: give a JSON file path or "-" for standard input']);
  let text: string;
  try {
    text = readFileSync(arg === '-' ? 0 : arg, 'utf8');
  } catch (e) {
    throw new CliInputError('cannot read input', [`input: cannot read "${arg}" (${(e as NodeJS.ErrnoException).code ?? 'error'})`]);
  }
  try {
    return JSON.parse(text);
  } catch (e) {
    throw new CliInputError('input is not valid JSON', [`input: not valid JSON (${(e as Error).message})`]);
  }
}
