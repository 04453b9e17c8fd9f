// `npm run seed`: applies migrations and the (idempotent) demo seed to DATABASE_URL.
import { ConfigError, loadConfig } from '../config';
import { connectDatabase } from './connection';
import { migrateToLatest } from './migrator';
import { DEMO_PASSWORD, DEMO_USERS, seedDemo } from './seed-demo';

async function main(): Promise<void> {
  const config = loadConfig();
  const db = await connectDatabase(config.databaseUrl);
  try {
    const applied = await migrateToLatest(db.sequelize);
    if (applied.length) console.log(`seed: applied migrations ${applied.join(', ')}`);
    const state = await seedDemo(db);
    console.log(`seed: demo firm ${state.firmId}, project ${state.projectId}`);
    console.log(
      `seed: sign in as ${DEMO_USERS.map((u) => u.email).join(', ')} with password "${DEMO_PASSWORD}"`,
    );
  } finally {
    await db.sequelize.close();
  }
}

main().catch((err) => {
  if (err instanceof ConfigError) console.error(err.message);
  else console.error('seed failed:', err);
  process.exit(1);
});
