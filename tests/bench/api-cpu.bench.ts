/**
 * `npx tsx tests/bench/api-cpu.bench.ts`: the server's own CPU time per request, per route of
 * the `bench:api` mix. The production server (its own process, as `bench:api` starts it) gets
 * one request at a time, so each figure is what one request of that route costs the server
 * (user + system time of its process from /proc, worker threads included), free of the
 * queueing that 50 concurrent clients add and of how busy the shared machine is. Wall time is
 * printed beside it for reference only.
 *
 * Options (environment): CPU_REPEAT (1: multiplies each route's request count),
 * CPU_PROF_DIR (when set, the server runs with --cpu-prof and writes its profile there on exit).
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { signedInClient, startServerProcess } from '../support/server-process';

const PASSWORD = 'baywright-demo';
const REPEAT = Number(process.env.CPU_REPEAT ?? 1);
const TICKS_PER_S = 100; // USER_HZ on Linux

/** User + system CPU of a process (all its threads), ms. */
function cpuMs(pid: number): number {
  const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
  const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
  // After the command name: state is field 3, utime field 14, stime field 15 (proc(5)).
  return ((Number(fields[11]) + Number(fields[12])) * 1000) / TICKS_PER_S;
}

async function main() {
  const tmp = mkdtempSync(join(tmpdir(), 'baywright-cpu-'));
  const profDir = process.env.CPU_PROF_DIR;
  const server = await startServerProcess({
    databaseUrl: `sqlite:${join(tmp, 'cpu.sqlite')}`,
    env: { NODE_ENV: 'production', COOKIE_SECURE: 'false', RATE_LIMIT_RELAXED: 'true', UPLOAD_DIR: join(tmp, 'uploads') },
    timeoutMs: 300_000,
    // As `npm start` runs it (BENCH_TSX=1: server/index.ts under the TypeScript loader, for comparison).
    bundled: process.env.BENCH_TSX !== '1',
    ...(profDir ? { nodeArgs: ['--cpu-prof', '--cpu-prof-dir', profDir] } : {}),
  });
  const pid = server.child.pid!;
  try {
    const api = await signedInClient(server.url, 'engineer@example.com', PASSWORD);
    const demoProject = (await api.call('GET', '/api/projects')).body.projects[0].id as string;
    const demoScheme = (await api.call('GET', `/api/projects/${demoProject}/schemes`)).body.schemes[0].id as string;
    await api.call('POST', `/api/schemes/${demoScheme}/design`);
    const demoPlan = (await api.call('GET', `/api/schemes/${demoScheme}/export`)).body;
    const project = await api.call('POST', '/api/projects', { name: 'CPU client' });
    const scheme = await api.call('POST', `/api/projects/${project.body.project.id}/schemes`, { name: 'Copy of the demo', plan: demoPlan });
    const own = scheme.body.scheme.id as string;
    let revision = scheme.body.scheme.revision as number;
    let edits = 0;
    await api.call('POST', `/api/schemes/${own}/design`);

    const routes: [string, number, () => Promise<number>][] = [
      ['sign-in', 6, async () => ((await signedInClient(server.url, 'engineer@example.com', PASSWORD)) ? 200 : 0)],
      ['schemes list', 60, async () => (await api.call('GET', `/api/projects/${demoProject}/schemes`)).status],
      ['design read', 30, async () => (await api.call('GET', `/api/schemes/${demoScheme}/design`)).status],
      ['schedule', 30, async () => (await api.call('GET', `/api/schemes/${demoScheme}/schedule`)).status],
      ['tonnage comparison', 30, async () => (await api.call('GET', `/api/projects/${demoProject}/comparison`)).status],
      [
        'plan save',
        30,
        async () => {
          edits += 1;
          const plan = structuredClone(demoPlan);
          plan.zones[0].superimposedDead_psf += (edits % 4) * 0.5;
          const res = await api.call('PUT', `/api/schemes/${own}/plan`, { revision, plan });
          if (res.status === 200) revision = res.body.revision;
          return res.status;
        },
      ],
      ['design run', 4, async () => (await api.call('POST', `/api/schemes/${own}/design`)).status],
    ];

    const lines = [`server CPU per request (user + system of the server process, one request at a time), ${new Date().toISOString()}`];
    lines.push(`${'route'.padEnd(20)} ${'requests'.padStart(8)} ${'CPU ms/req'.padStart(11)} ${'wall ms/req'.padStart(12)}`);
    for (const [name, count, call] of routes) {
      // One unmeasured request first (caches, JIT), then the measured ones.
      await call();
      const n = count * REPEAT;
      const c0 = cpuMs(pid);
      const t0 = performance.now();
      for (let i = 0; i < n; i++) {
        const status = await call();
        if (status < 200 || status >= 300) throw new Error(`${name} answered ${status}`);
      }
      const wall = (performance.now() - t0) / n;
      const cpu = (cpuMs(pid) - c0) / n;
      lines.push(`${name.padEnd(20)} ${String(n).padStart(8)} ${cpu.toFixed(2).padStart(11)} ${wall.toFixed(2).padStart(12)}`);
    }
    console.log(lines.join('\n'));
  } finally {
    await server.kill('SIGTERM');
    rmSync(tmp, { recursive: true, force: true });
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
