/**
 * `npm run bench:api`: the production server (its own process, NODE_ENV=production) on a
 * throw-away SQLite file seeded with the demo, loaded by 50 concurrent clients for 60 s over
 * loopback with a mix of what a team does: sign in, list schemes, read a design, read the
 * schedule, save a plan with a small edit, run a design, compare tonnage. Prints requests/s
 * and p50/p95/p99 per route, errors, and the server's resident memory after a warm-up and at
 * the end; then the verdict against the targets (0 errors; p95 ≤ 50 ms for reads, ≤ 250 ms
 * for a plan save of the demo building; memory within 20 % after warm-up).
 *
 * Bounded: a fixed number of clients, each with one request in flight; a fixed duration.
 * Each client writes to its own copy of the demo scheme (in its own project), so saves never
 * conflict; reads go to the shared demo project. The machine's cores are shared with the
 * load generator itself (and with anything else running), which the figures include.
 *
 * Options (environment): BENCH_CLIENTS (50), BENCH_DURATION_S (60), BENCH_WARMUP_S (10),
 * BENCH_THINK_MS (0: each client pauses 0.5–1.5 × this after each response; for a diagnosis only,
 * the targets are judged with no pause), BENCH_TSX=1 (the server under the TypeScript loader).
 *
 * Each client has one request in flight and no pause between requests, so by Little's law the
 * mean response time is CLIENTS / (requests per second): p95 ≤ 50 ms with 50 clients needs the
 * server to answer about 1,000 requests/s. `npx tsx tests/bench/api-cpu.bench.ts` gives the
 * server's CPU time per request per route, which does not depend on how busy the machine is.
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { signedInClient, startServerProcess } from '../support/server-process';

const CLIENTS = Number(process.env.BENCH_CLIENTS ?? 50);
const DURATION_S = Number(process.env.BENCH_DURATION_S ?? 60);
const WARMUP_S = Number(process.env.BENCH_WARMUP_S ?? 10);
/** Each client's pause after a response, ms: uniform over [0.5, 1.5] × BENCH_THINK_MS (0: none, a closed loop). */
const THINK_MS = Number(process.env.BENCH_THINK_MS ?? 0);
const PASSWORD = 'baywright-demo';
const ENGINEERS = ['engineer@example.com', 'owner@example.com'];

type Route = 'sign-in' | 'schemes list' | 'design read' | 'schedule' | 'plan save' | 'design run' | 'tonnage comparison';
const READS: Route[] = ['schemes list', 'design read', 'schedule', 'tonnage comparison'];

/** Share of each operation in the mix (per client request); sign-ins and design runs are rarer. */
const MIX: [Route, number][] = [
  ['schemes list', 24],
  ['design read', 22],
  ['schedule', 18],
  ['tonnage comparison', 14],
  ['plan save', 16],
  ['design run', 4],
  ['sign-in', 2],
];

interface Sample {
  ms: number;
  ok: boolean;
}

function rssMb(pid: number): number {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8');
  const kb = Number(/VmRSS:\s+(\d+)/.exec(status)?.[1] ?? NaN);
  return kb / 1024;
}

function percentile(sorted: number[], p: number): number {
  if (!sorted.length) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

function pickRoute(random: () => number): Route {
  const total = MIX.reduce((s, [, w]) => s + w, 0);
  let r = random() * total;
  for (const [route, w] of MIX) {
    if ((r -= w) < 0) return route;
  }
  return MIX[0][0];
}

/** A small deterministic generator so runs draw the same mix. */
function seeded(seed: number) {
  let s = seed >>> 0;
  return () => ((s = (s * 1664525 + 1013904223) >>> 0) / 2 ** 32);
}

async function main() {
  const tmp = mkdtempSync(join(tmpdir(), 'baywright-bench-'));
  const server = await startServerProcess({
    databaseUrl: `sqlite:${join(tmp, 'bench.sqlite')}`,
    env: { NODE_ENV: 'production', COOKIE_SECURE: 'false', RATE_LIMIT_RELAXED: 'true', UPLOAD_DIR: join(tmp, 'uploads') },
    timeoutMs: 300_000,
    // As `npm start` runs it (BENCH_TSX=1: server/index.ts under the TypeScript loader, for comparison).
    bundled: process.env.BENCH_TSX !== '1',
  });
  const pid = server.child.pid!;
  try {
    const admin = await signedInClient(server.url, 'engineer@example.com', PASSWORD);
    const demoProject = (await admin.call('GET', '/api/projects')).body.projects[0].id as string;
    const demoScheme = (await admin.call('GET', `/api/projects/${demoProject}/schemes`)).body.schemes[0].id as string;
    await admin.call('POST', `/api/schemes/${demoScheme}/design`);
    const demoPlan = (await admin.call('GET', `/api/schemes/${demoScheme}/export`)).body;
    const members = (demoPlan.members as unknown[]).length;

    // One project and scheme (a copy of the demo plan) per client, designed once.
    const clients: { api: Awaited<ReturnType<typeof signedInClient>>; email: string; schemeId: string; revision: number; edits: number }[] = [];
    for (let i = 0; i < CLIENTS; i++) {
      const api = await signedInClient(server.url, ENGINEERS[i % ENGINEERS.length], PASSWORD);
      const project = await api.call('POST', '/api/projects', { name: `Load client ${i + 1}` });
      const scheme = await api.call('POST', `/api/projects/${project.body.project.id}/schemes`, { name: 'Copy of the demo', plan: demoPlan });
      if (scheme.status !== 201) throw new Error(`scheme import gave ${scheme.status}: ${scheme.text}`);
      clients.push({ api, email: ENGINEERS[i % ENGINEERS.length], schemeId: scheme.body.scheme.id as string, revision: scheme.body.scheme.revision as number, edits: 0 });
    }

    const samples = new Map<Route, Sample[]>(MIX.map(([r]) => [r, []]));
    const failures: string[] = [];
    let recording = false;
    let stopAt = 0;

    const run = async (index: number) => {
      const c = clients[index];
      const random = seeded(index + 1);
      while (Date.now() < stopAt) {
        const route = pickRoute(random);
        const t0 = performance.now();
        let status = 0;
        let detail = '';
        try {
          if (route === 'sign-in') {
            const fresh = await signedInClient(server.url, c.email, PASSWORD);
            c.api = fresh;
            status = 200;
          } else if (route === 'schemes list') {
            status = (await c.api.call('GET', `/api/projects/${demoProject}/schemes`)).status;
          } else if (route === 'design read') {
            status = (await c.api.call('GET', `/api/schemes/${demoScheme}/design`)).status;
          } else if (route === 'schedule') {
            status = (await c.api.call('GET', `/api/schemes/${demoScheme}/schedule`)).status;
          } else if (route === 'tonnage comparison') {
            status = (await c.api.call('GET', `/api/projects/${demoProject}/comparison`)).status;
          } else if (route === 'plan save') {
            // A small edit: the first zone's superimposed dead load moves by 0.5 psf.
            c.edits += 1;
            const plan = structuredClone(demoPlan);
            plan.zones[0].superimposedDead_psf += (c.edits % 4) * 0.5;
            const res = await c.api.call('PUT', `/api/schemes/${c.schemeId}/plan`, { revision: c.revision, plan });
            status = res.status;
            if (status === 200) c.revision = res.body.revision;
            else detail = res.text.slice(0, 200);
          } else {
            status = (await c.api.call('POST', `/api/schemes/${c.schemeId}/design`)).status;
          }
        } catch (err) {
          detail = err instanceof Error ? err.message : String(err);
        }
        const ms = performance.now() - t0;
        const ok = status >= 200 && status < 300;
        if (recording) {
          samples.get(route)!.push({ ms, ok });
          if (!ok) failures.push(`${route}: ${status} ${detail}`);
        }
        if (THINK_MS > 0) await new Promise((r) => setTimeout(r, THINK_MS * (0.5 + random())));
      }
    };

    // Warm-up (not recorded), then memory, then the measured run.
    stopAt = Date.now() + WARMUP_S * 1000;
    await Promise.all(clients.map((_, i) => run(i)));
    const rssAfterWarmup = rssMb(pid);
    recording = true;
    const started = performance.now();
    stopAt = Date.now() + DURATION_S * 1000;
    await Promise.all(clients.map((_, i) => run(i)));
    const seconds = (performance.now() - started) / 1000;
    const rssAtEnd = rssMb(pid);

    const rows = MIX.map(([route]) => {
      const list = samples.get(route)!;
      const sorted = list.map((s) => s.ms).sort((a, b) => a - b);
      return {
        route,
        count: list.length,
        perS: list.length / seconds,
        p50: percentile(sorted, 50),
        p95: percentile(sorted, 95),
        p99: percentile(sorted, 99),
        max: sorted.at(-1) ?? NaN,
        errors: list.filter((s) => !s.ok).length,
      };
    });
    const total = rows.reduce((s, r) => s + r.count, 0);
    const errors = rows.reduce((s, r) => s + r.errors, 0);
    const f = (n: number) => (Number.isFinite(n) ? n.toFixed(1) : '—');

    const out: string[] = [];
    out.push(`bench:api — ${CLIENTS} clients${THINK_MS > 0 ? `, each pausing ${THINK_MS / 2}–${(THINK_MS * 3) / 2} ms after a response` : ', no pause between requests'}, ${DURATION_S} s after a ${WARMUP_S} s warm-up, demo building (${members} members per scheme), SQLite file, NODE_ENV=production, loopback`);
    out.push(`${'route'.padEnd(20)} ${'requests'.padStart(8)} ${'req/s'.padStart(8)} ${'p50 ms'.padStart(8)} ${'p95 ms'.padStart(8)} ${'p99 ms'.padStart(8)} ${'max ms'.padStart(8)} ${'errors'.padStart(7)}`);
    for (const r of rows) {
      out.push(`${r.route.padEnd(20)} ${String(r.count).padStart(8)} ${f(r.perS).padStart(8)} ${f(r.p50).padStart(8)} ${f(r.p95).padStart(8)} ${f(r.p99).padStart(8)} ${f(r.max).padStart(8)} ${String(r.errors).padStart(7)}`);
    }
    out.push(`${'all'.padEnd(20)} ${String(total).padStart(8)} ${f(total / seconds).padStart(8)}`);
    const growth = (rssAtEnd - rssAfterWarmup) / rssAfterWarmup;
    out.push(`server RSS: ${f(rssAfterWarmup)} MB after warm-up, ${f(rssAtEnd)} MB at the end (${(growth * 100).toFixed(1)} %)`);

    const verdict = (ok: boolean) => (ok ? 'PASS' : 'FAIL');
    const readP95 = Math.max(...rows.filter((r) => READS.includes(r.route)).map((r) => r.p95));
    const saveP95 = rows.find((r) => r.route === 'plan save')!.p95;
    out.push(`target 0 errors: ${errors} — ${verdict(errors === 0)}`);
    out.push(`target p95 ≤ 50 ms for reads: worst read p95 ${f(readP95)} ms — ${verdict(readP95 <= 50)}`);
    out.push(`target p95 ≤ 250 ms for a plan save: ${f(saveP95)} ms — ${verdict(saveP95 <= 250)}`);
    out.push(`target memory within 20 % after warm-up: ${(growth * 100).toFixed(1)} % — ${verdict(Math.abs(growth) <= 0.2)}`);
    if (failures.length) out.push(`first errors:\n  ${failures.slice(0, 5).join('\n  ')}`);
    console.log(out.join('\n'));
    process.exitCode = errors === 0 ? 0 : 1;
  } finally {
    await server.kill('SIGTERM');
    rmSync(tmp, { recursive: true, force: true });
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
