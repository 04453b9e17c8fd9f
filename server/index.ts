// Production / `npm start` entry: validate env, migrate, seed an empty database, build and
// serve the client, listen.
import { ConfigError, loadConfig, type Config } from './config';
import { createApp, getAppContext } from './app';
import { connectDatabase } from './db/connection';
import { migrateToLatest } from './db/migrator';
import { isDatabaseEmpty, seedDemo } from './db/seed-demo';
import { buildClient, DEFAULT_CLIENT_DIR, hasClientBuild } from './static-client';

const log = (line: string) => console.log(`[baywright] ${line}`);

async function resolveClientDir(config: Config): Promise<string | null> {
  if (hasClientBuild(DEFAULT_CLIENT_DIR)) return DEFAULT_CLIENT_DIR;
  if (config.nodeEnv !== 'production') {
    log('client: no dist/ build; API only (in development run `npx vite` for the client on :5173)');
    return null;
  }
  const built = await buildClient(DEFAULT_CLIENT_DIR, log);
  if (!built) {
    log('client: build unavailable, serving the API only (the web pages will 404)');
    return null;
  }
  return DEFAULT_CLIENT_DIR;
}

async function main(): Promise<void> {
  let config: Config;
  try {
    config = loadConfig();
  } catch (err) {
    if (err instanceof ConfigError) {
      console.error(err.message);
      process.exit(1);
    }
    throw err;
  }

  const db = await connectDatabase(config.databaseUrl);
  const applied = await migrateToLatest(db.sequelize);
  if (applied.length) log(`database: applied migrations ${applied.join(', ')}`);
  if (config.seedDemo && (await isDatabaseEmpty(db))) {
    await seedDemo(db);
    log('database: empty, seeded the demo firm (owner@example.com etc., password baywright-demo)');
  }

  const clientDir = await resolveClientDir(config);
  const app = createApp({ sequelize: db.sequelize, models: db.models, config, clientDir });
  // Express 5 passes listen errors (e.g. EADDRINUSE) to the callback.
  const server = app.listen(config.port, (err?: Error) => {
    if (err) {
      console.error(`[baywright] cannot listen on port ${config.port}: ${err.message}`);
      process.exit(1);
    }
    log(`listening on http://localhost:${config.port} (${config.nodeEnv})`);
  });

  // Keep idle connections open longer than a reverse proxy's usual 60 s idle timeout, so the
  // server never closes a kept-alive connection just as the proxy (or a client) reuses it,
  // which the client sees as a reset request (common practice for Node behind a proxy).
  server.keepAliveTimeout = 65_000;
  server.headersTimeout = 66_000;

  // Expired sessions are refused anyway; this only keeps the table small.
  const sweep = setInterval(() => {
    getAppContext(app).lucia.deleteExpiredSessions().catch((err) => console.error(err));
  }, 60 * 60 * 1000);
  sweep.unref();

  const shutdown = () => {
    log('shutting down');
    clearInterval(sweep);
    server.close(() => {
      void db.sequelize.close().finally(() => process.exit(0));
    });
    setTimeout(() => process.exit(0), 5000).unref();
  };
  process.on('SIGTERM', shutdown);
  process.on('SIGINT', shutdown);
}

main().catch((err) => {
  console.error('[baywright] failed to start:', err);
  process.exit(1);
});
