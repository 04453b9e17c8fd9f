/**
 * `npm run bench:ab -- [base] [--pairs N]`: the engine's first run and `calc plan` of the 24-level
 * building (plan.bench.ts), measured against another commit (default HEAD~1) on this machine, as
 * ratios. This machine's speed drifts by ±15 % within minutes, more than most changes; runs of the
 * two builds alternate (A B, B A, …) so drift falls on both alike, and the figure is the median of
 * the per-pair differences. Each side runs from an esbuild bundle in a fresh process:
 *   engine: designScheme of the building, CPU (user + system) of the process from just before to just after;
 *   calc:   `calc plan` of the building to /dev/null, CPU of the whole process (start-up included);
 *   re-design: plan.bench.ts's one-member change on a 622-member level, median of 20 edits after 40 (one process a run).
 * The base is checked out into a temporary git worktree and removed afterwards; both sides use
 * this checkout's node_modules (so a base with other package versions is measured with these).
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('../..', import.meta.url));
const args = process.argv.slice(2);
const pairsAt = args.indexOf('--pairs');
const PAIRS = pairsAt >= 0 ? Number(args[pairsAt + 1]) : 10;
const base = args.find((a, i) => !a.startsWith('--') && args[i - 1] !== '--pairs') ?? 'HEAD~1';
if (!Number.isInteger(PAIRS) || PAIRS < 2) throw new Error('bench:ab: --pairs takes a whole number ≥ 2');

const git = (...a: string[]) => execFileSync('git', a, { cwd: root, encoding: 'utf8' }).trim();
const baseSha = git('rev-parse', '--verify', `${base}^{commit}`);
const headSha = git('rev-parse', 'HEAD');
const dirty = git('status', '--porcelain', '--untracked-files=no') !== '';

/** The harness both sides run: the same file, written into each tree (it imports that tree's engine). */
const HARNESS = `import { regularBuildingPlan } from './plan.bench';
import { designScheme } from '../../shared/engine/scheme/design-scheme.scheme';
const cpu = () => { const u = process.cpuUsage(); return (u.user + u.system) / 1000; };
if (process.argv[2] === 'redesign') {
  // plan.bench.ts's one-member re-design on a 622-member level: median CPU of 20 edits after 40.
  const level = regularBuildingPlan(1, 12, 10);
  level.levels[0].roof = false;
  level.decks = [{ id: 'd', level: level.levels[0].id, polygon: [[0, 0], [360, 0], [360, 300], [0, 300]], spanDirection: 'x', zone: 'office' }];
  const first = designScheme(level);
  const shapes = ['W18X40', 'W21X50', 'W16X31', 'W24X55', 'W18X35', 'W21X44'];
  const edit = (i) => {
    const changed = structuredClone(level);
    const target = changed.members.find((m) => m.kind === 'beam' && m.id.endsWith('B' + ((i * 7) % 49) + '-' + ((i * 3) % 10)));
    target.shape = shapes[i % shapes.length];
    const c0 = cpu();
    designScheme(changed, { previous: first, changedIds: [target.id] });
    return cpu() - c0;
  };
  for (let i = 0; i < 40; i++) edit(i);
  const runs = Array.from({ length: 20 }, (_, i) => edit(40 + i)).sort((a, b) => a - b);
  process.stdout.write(JSON.stringify({ cpuMs: (runs[9] + runs[10]) / 2 }) + '\\n');
} else {
  const building = regularBuildingPlan(24, 10, 8);
  const c0 = cpu();
  const r = designScheme(building);
  process.stdout.write(JSON.stringify({ cpuMs: cpu() - c0, members: r.members.length }) + '\\n');
}
`;

const outRoot = join(root, 'node_modules', '.cache', 'baywright-ab');
const work = mkdtempSync(join(tmpdir(), 'baywright-ab-'));
const planFile = join(work, 'building.plan.json');

async function bundle(tree: string, label: string): Promise<{ engine: string; calc: string }> {
  const esbuild = await import('esbuild');
  const harness = join(tree, 'tests', 'bench', '.ab-harness.ts');
  writeFileSync(harness, HARNESS);
  const outdir = join(outRoot, label);
  mkdirSync(outdir, { recursive: true });
  try {
    await esbuild.build({
      entryPoints: [{ out: 'engine', in: harness }, { out: 'calc', in: join(tree, 'server', 'cli', 'calc.ts') }],
      outdir,
      outExtension: { '.js': '.mjs' },
      bundle: true,
      platform: 'node',
      format: 'esm',
      target: 'node20',
      packages: 'external',
      logLevel: 'error',
      absWorkingDir: tree,
    });
  } finally {
    rmSync(harness, { force: true });
  }
  return { engine: join(outdir, 'engine.mjs'), calc: join(outdir, 'calc.mjs') };
}

/** CPU ms of one fresh process running the engine harness (its own reading, after module loading). */
function engineCpu(file: string, mode: 'first' | 'redesign' = 'first'): number {
  const r = spawnSync(process.execPath, [file, mode], { encoding: 'utf8', timeout: 120_000 });
  if (r.status !== 0) throw new Error(`bench:ab: ${file} failed: ${r.stderr.slice(0, 500)}`);
  return (JSON.parse(r.stdout.trim().split('\n').pop()!) as { cpuMs: number }).cpuMs;
}

/** CPU ms of a whole `calc plan` process (user + system of the child, from bash's `times`). */
function calcCpu(file: string): number {
  const r = spawnSync('bash', ['-c', `"${process.execPath}" "${file}" plan "${planFile}" > /dev/null; times`], { encoding: 'utf8', timeout: 120_000 });
  const lines = r.stdout.trim().split('\n');
  const m = /(\d+)m([\d.]+)s\s+(\d+)m([\d.]+)s/.exec(lines[lines.length - 1] ?? '');
  if (!m) throw new Error(`bench:ab: cannot read times from ${JSON.stringify(r.stdout)} ${r.stderr}`);
  return (Number(m[1]) * 60 + Number(m[2]) + Number(m[3]) * 60 + Number(m[4])) * 1000;
}

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};

function compare(name: string, measure: (f: string) => number, a: string, b: string): string {
  const A: number[] = [];
  const B: number[] = [];
  for (let i = 0; i < PAIRS; i++) {
    if (i % 2 === 0) { A.push(measure(a)); B.push(measure(b)); } else { B.push(measure(b)); A.push(measure(a)); }
  }
  const d = median(B.map((x, i) => x - A[i]));
  const ma = median(A);
  const digits = ma < 100 ? 1 : 0;
  return `  ${name.padEnd(34)} base ${ma.toFixed(digits).padStart(6)} ms   this ${median(B).toFixed(digits).padStart(6)} ms   change ${d >= 0 ? '+' : ''}${d.toFixed(digits)} ms (${((100 * d) / ma).toFixed(1)} %, ratio ${((ma + d) / ma).toFixed(3)})`;
}

const worktree = join(work, 'base');
try {
  const { regularBuildingPlan } = await import('./plan.bench');
  writeFileSync(planFile, JSON.stringify(regularBuildingPlan(24, 10, 8)));
  git('worktree', 'add', '--detach', worktree, baseSha);
  const a = await bundle(worktree, `base-${baseSha.slice(0, 10)}`);
  const b = await bundle(root, 'this');
  const lines = [
    `bench:ab — base ${baseSha.slice(0, 10)} (${base}) against this checkout (${headSha.slice(0, 10)}${dirty ? ' with uncommitted changes' : ''}); ${PAIRS} alternating pairs, CPU ms, medians`,
    compare('engine first run, 24-level building', engineCpu, a.engine, b.engine),
    compare('calc plan, 24-level building', calcCpu, a.calc, b.calc),
    compare('one-member re-design, 622 members', (f) => engineCpu(f, 'redesign'), a.engine, b.engine),
  ];
  process.stdout.write(`${lines.join('\n')}\n`);
} finally {
  try { git('worktree', 'remove', '--force', worktree); } catch { /* not made */ }
  rmSync(work, { recursive: true, force: true });
}
