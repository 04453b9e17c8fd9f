// `npm run test:api:pg`: the whole API suite a second time, on PostgreSQL. Starts a throw-away
// cluster (tests/support/pg-cluster.ts), runs `vitest run --project api` with TEST_PG_URL set
// (each test app gets its own fresh database), and stops the cluster however the run ends.
// Extra arguments go to vitest (e.g. a test file). Without PostgreSQL's server binaries the
// pass is skipped with a notice, except under CI=true, where that is a failure.
import { spawn } from 'node:child_process';
import { connectDatabase } from '../../server/db/connection';
import { migrateToLatest } from '../../server/db/migrator';
import { seedDemo } from '../../server/db/seed-demo';
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

// The template every test app is copied from: migrated and seeded once.
const TEMPLATE = 'bw_template';
const pg = (await import('pg')).default;
const admin = new pg.Client({ connectionString: cluster.adminUrl });
await admin.connect();
await admin.query(`CREATE DATABASE ${TEMPLATE}`);
await admin.end();
const templateUrl = new URL(cluster.adminUrl);
templateUrl.pathname = `/${TEMPLATE}`;
const templateDb = await connectDatabase(templateUrl.toString());
await migrateToLatest(templateDb.sequelize);
await seedDemo(templateDb);
await templateDb.sequelize.close();

const child = spawn(
  process.execPath,
  // Longer limits than on SQLite: each test app also creates a database over a socket.
  ['node_modules/vitest/vitest.mjs', 'run', '--project', 'api', '--hookTimeout', '60000', '--testTimeout', '60000', ...process.argv.slice(2)],
  { stdio: 'inherit', env: { ...process.env, TEST_PG_URL: cluster.adminUrl, TEST_PG_TEMPLATE: TEMPLATE } },
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
