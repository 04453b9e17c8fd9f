// `npm run test:api:pg`: the whole API suite a second time, on PostgreSQL. Starts a throw-away
// cluster (tests/support/pg-cluster.ts), runs `vitest run --project api` with TEST_PG_URL set
// (each test app gets its own fresh database), and stops the cluster however the run ends.
// Extra arguments go to vitest (e.g. a test file). Without PostgreSQL's server binaries the
// pass is skipped with a notice, except under CI=true, where that is a failure.
import { spawn } from 'node:child_process';
import { findPgBinDir, startPgCluster } from './pg-cluster';

const binDir = findPgBinDir();
if (!binDir) {
  const message = 'test:api:pg: PostgreSQL server binaries (initdb, pg_ctl) not found; install Debian\'s "postgresql" package';
  if (process.env.CI === 'true') {
    console.error(`${message}. CI must run the PostgreSQL pass.`);
    process.exit(1);
  }
  console.warn(`${message}. Skipping the PostgreSQL pass.`);
  process.exit(0);
}

const cluster = await startPgCluster(binDir);
console.log(`test:api:pg: PostgreSQL cluster on 127.0.0.1:${cluster.port} (${binDir})`);
const stop = () => {
  try {
    cluster.stop();
  } catch (err) {
    console.error('test:api:pg: could not stop the cluster:', err);
  }
};
process.on('exit', stop);

const child = spawn(
  process.execPath,
  ['node_modules/vitest/vitest.mjs', 'run', '--project', 'api', ...process.argv.slice(2)],
  { stdio: 'inherit', env: { ...process.env, TEST_PG_URL: cluster.adminUrl } },
);
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.on(signal, () => {
    child.kill(signal);
  });
}
child.on('exit', (code, signal) => {
  stop();
  process.exit(code ?? (signal ? 1 : 0));
});
