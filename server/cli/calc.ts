/**
 * `npm run -s calc -- <subcommand> [--pretty] <file.json | ->`: prints one JSON document on stdout
 * and nothing else there (messages go to stderr). Exit 0 pass, 1 design does not pass, 2 bad input.
 * The document is compact when stdout is not a terminal (a pipe or a file), indented on a
 * terminal or with `--pretty`, and written in pieces (json-stream.ts).
 */
import { CALC_COMMANDS } from './calc-commands';
import { writeJsonDocument } from './json-stream';
import { CliInputError, EXIT_BAD_INPUT, errorOutcome, type CommandOutcome } from './cli-io';

async function main(argv: string[]): Promise<CommandOutcome> {
  const [sub, ...rest] = argv;
  const handler = sub === undefined ? undefined : Object.hasOwn(CALC_COMMANDS, sub) ? CALC_COMMANDS[sub] : undefined;
  if (!handler) {
    const known = Object.keys(CALC_COMMANDS).join(', ');
    return errorOutcome(`unknown subcommand "${sub ?? ''}"`, [`subcommand: must be one of ${known}`]);
  }
  try {
    return await handler(rest);
  } catch (e) {
    if (e instanceof CliInputError) return errorOutcome(e.message, e.problems);
    process.stderr.write(`calc: ${(e as Error).stack ?? String(e)}\n`);
    return errorOutcome('internal error', [`input: the engine could not process it (${(e as Error).message})`]);
  }
}

const argv = process.argv.slice(2);
const pretty = argv.includes('--pretty') || process.stdout.isTTY === true;
const write = (chunk: string) => void process.stdout.write(chunk);
// A reader that stops early (`| head`) closes the pipe: stop quietly, as a command line tool does,
// with the exit code already set, rather than print a stack trace for the write that failed.
process.stdout.on('error', (e: NodeJS.ErrnoException) => {
  if (e.code !== 'EPIPE') throw e;
  process.exit();
});

main(argv.filter((a) => a !== '--pretty')).then((outcome) => {
  writeJsonDocument(outcome.json, write, pretty ? 2 : 0);
  process.exitCode = outcome.exitCode;
}, (e: unknown) => {
  process.stderr.write(`calc: ${String(e)}\n`);
  process.stdout.write(`${JSON.stringify({ error: { message: 'internal error', problems: [] } })}\n`);
  process.exitCode = EXIT_BAD_INPUT;
});
