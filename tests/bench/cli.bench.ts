/**
 * Command-line benchmarks: `npm run -s calc` as an engineer runs it (npm, the launcher, the
 * bundle), stdout to /dev/null (a pipe or file: compact JSON). CPU is the children's user +
 * system time reported by the shell's `times` (wall time on this shared machine waits for a
 * core); each figure is the least of three runs.
 * 1. start-up: `calc member` on the example member (nearly all of it is start-up) — no target,
 *    printed against the TypeScript loader it replaced.
 * 2. `calc plan` of the 24-level building, less the start-up — target ≤ 1 s.
 * 3. the same without npm, as shipped and with V8's default optimisation budget (the bundle run
 *    directly, without the launcher's CALC_V8_FLAGS) — no target; what that setting buys.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { regularBuildingPlan } from './plan.bench';
import { CALC_V8_FLAGS } from '../../server/cli/calc-v8-flags.mjs';

export const TARGET_CLI_PLAN_BEYOND_STARTUP_MS = 1000;

const root = fileURLToPath(new URL('../..', import.meta.url));

/** Children's CPU ms of one shell command (bash `times`, second line: children user and system). */
function childCpuMs(command: string): number {
  const r = spawnSync('bash', ['-c', `${command} > /dev/null; times`], { cwd: root, encoding: 'utf8', timeout: 300_000 });
  const lines = r.stdout.trim().split('\n');
  const m = /(\d+)m([\d.]+)s\s+(\d+)m([\d.]+)s/.exec(lines[lines.length - 1] ?? '');
  if (!m) throw new Error(`cli bench: cannot read times from ${JSON.stringify(r.stdout)} ${r.stderr}`);
  return (Number(m[1]) * 60 + Number(m[2]) + Number(m[3]) * 60 + Number(m[4])) * 1000;
}

const least = (command: string, runs = 3) => Math.min(...Array.from({ length: runs }, () => childCpuMs(command)));

export function runCliBench(): void {
  const dir = mkdtempSync(join(tmpdir(), 'baywright-cli-bench-'));
  const file = join(dir, 'building.plan.json');
  writeFileSync(file, JSON.stringify(regularBuildingPlan(24, 10, 8)));
  const member = 'tests/fixtures/members/example-member.json';
  least(`npm run -s calc -- member ${member}`, 1); // builds the bundle if a source changed
  const startup = least(`npm run -s calc -- member ${member}`);
  const tsxStartup = least(`npx tsx server/cli/calc.ts member ${member}`);
  const plan = least(`npm run -s calc -- plan ${file}`);
  const summary = least(`npm run -s calc -- plan --summary ${file}`, 1);
  const shipped = least(`node server/cli/calc-launch.mjs plan ${file}`);
  const v8Defaults = least(`node node_modules/.cache/baywright-calc/calc.mjs plan ${file}`);
  spawnSync('bash', ['-c', `npm run -s calc -- plan ${file} > ${join(dir, 'out.json')}`], { cwd: root });
  const bytes = statSync(join(dir, 'out.json')).size;
  const beyond = plan - startup;
  process.stdout.write(
    `calc (npm run -s calc, CPU of the processes, least of 3):\n` +
      `  start-up (calc member, example): ${startup.toFixed(0)} ms (no target; the TypeScript loader took ${tsxStartup.toFixed(0)} ms)\n` +
      `  calc plan, 24-level building: ${plan.toFixed(0)} ms, ${(bytes / 1e6).toFixed(1)} MB compact; beyond start-up ${beyond.toFixed(0)} ms; target ≤ ${TARGET_CLI_PLAN_BEYOND_STARTUP_MS} ms: ${beyond <= TARGET_CLI_PLAN_BEYOND_STARTUP_MS ? 'PASS' : 'FAIL'}\n` +
      `  calc plan --summary: ${summary.toFixed(0)} ms (one run, no target)\n` +
      `  calc plan without npm: as shipped (${CALC_V8_FLAGS}) ${shipped.toFixed(0)} ms; with V8's default budget ${v8Defaults.toFixed(0)} ms (no target)\n`,
  );
}
