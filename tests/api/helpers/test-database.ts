import { randomBytes } from 'node:crypto';
import pg from 'pg';

// Which database the API tests run on. Unset: a fresh in-memory SQLite database per app.
// TEST_PG_URL=postgres://…/postgres (an admin connection to a throw-away cluster, see
// tests/support/run-api-on-postgres.ts): a fresh PostgreSQL database per app, dropped on close.

export const TEST_PG_URL = process.env.TEST_PG_URL || undefined;
export const testDialect: 'sqlite' | 'postgres' = TEST_PG_URL ? 'postgres' : 'sqlite';

export interface TestDatabase {
  url: string;
  drop(): Promise<void>;
}

async function withAdmin<T>(fn: (client: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: TEST_PG_URL });
  await client.connect();
  try {
    return await fn(client);
  } finally {
    await client.end();
  }
}

/** A new, empty database on the test dialect. */
export async function freshTestDatabase(): Promise<TestDatabase> {
  if (!TEST_PG_URL) return { url: 'sqlite::memory:', drop: async () => {} };
  const name = `bw_test_${process.pid}_${randomBytes(6).toString('hex')}`;
  await withAdmin((c) => c.query(`CREATE DATABASE ${name}`));
  const url = new URL(TEST_PG_URL);
  url.pathname = `/${name}`;
  return {
    url: url.toString(),
    drop: () => withAdmin((c) => c.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`)).then(() => undefined),
  };
}
