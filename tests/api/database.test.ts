import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { QueryTypes } from 'sequelize';
import { afterAll, describe, expect, it } from 'vitest';
import { connectDatabase, sqliteColumnInfoOf } from '../../server/db/connection';
import { createMigrator, migrateToLatest, MIGRATION_NAMES } from '../../server/db/migrator';
import { DEMO_USERS, seedDemo } from '../../server/db/seed-demo';
import { createTestApp } from './helpers/test-app';
import { freshTestDatabase, testDialect } from './helpers/test-database';

const tmp = mkdtempSync(join(tmpdir(), 'baywright-db-'));
afterAll(() => rmSync(tmp, { recursive: true, force: true }));

/** A fresh, empty database on the dialect under test (SQLite in memory, or PostgreSQL), dropped after. */
async function withFreshDb(fn: (db: Awaited<ReturnType<typeof connectDatabase>>) => Promise<void>): Promise<void> {
  const target = await freshTestDatabase({ empty: true });
  const db = await connectDatabase(target.url);
  try {
    await fn(db);
  } finally {
    await db.sequelize.close();
    await target.drop();
  }
}

describe(`database (${testDialect}): migrations and demo seed`, () => {
  it('when migrations run twice, then the second run applies nothing and every one is recorded', async () => {
    await withFreshDb(async (db) => {
      // Every migration in the migrator's list, in its numbered order, each recorded once.
      expect(MIGRATION_NAMES.slice(0, 9)).toEqual(['0001-accounts', '0002-projects', '0003-schemes-plans', '0004-team-mail-audit', '0005-underlays', '0006-scheme-status-prices', '0007-plan-v2-composite-columns', '0008-underlay-pdf-pages', '0009-bay-studies']);
      expect(MIGRATION_NAMES.map((n) => n.slice(0, 4))).toEqual(MIGRATION_NAMES.map((_, i) => String(i + 1).padStart(4, '0')));
      expect(await migrateToLatest(db.sequelize)).toEqual(MIGRATION_NAMES);
      expect(await migrateToLatest(db.sequelize)).toEqual([]);
      const executed = await createMigrator(db.sequelize).executed();
      expect(executed.map((m) => m.name)).toEqual(MIGRATION_NAMES);
    });
  });

  it('when migrations are rolled all the way down and up again, then the schema comes back', async () => {
    await withFreshDb(async (db) => {
      await migrateToLatest(db.sequelize);
      await createMigrator(db.sequelize).down({ to: 0 });
      const tables = await db.sequelize.getQueryInterface().showAllTables();
      expect(tables.filter((n) => n !== 'schema_migrations')).toEqual([]);
      await migrateToLatest(db.sequelize);
      expect(await seedDemo(db)).toMatchObject({ firmId: expect.any(String) });
    });
  });

  it.runIf(testDialect === 'sqlite')('when the same table is read again, then its column types come from memory, the rows read the same, and a schema change makes the next read ask SQLite again', async () => {
    await withFreshDb(async (db) => {
      await migrateToLatest(db.sequelize);
      await seedDemo(db);
      const cache = sqliteColumnInfoOf(db.sequelize)!;
      expect(cache).toBeDefined();
      const read = async () => (await db.models.User.findAll({ order: [['email', 'ASC']] })).map((u) => u.get({ plain: true }));
      const first = await read();
      const hits0 = cache.hits;
      const second = await read();
      expect(cache.hits).toBe(hits0 + 1);
      expect(second).toEqual(first);
      // Types still parse: dates come back as dates, as on the first read (driver asked SQLite then).
      expect(second[0].createdAt).toBeInstanceOf(Date);
      // A schema change (ALTER) forgets every table's types: the next read asks SQLite, the one after is from memory again.
      await db.sequelize.query('ALTER TABLE users ADD COLUMN probe_note TEXT');
      const hits1 = cache.hits;
      expect(await read()).toEqual(first);
      expect(cache.hits).toBe(hits1);
      await read();
      expect(cache.hits).toBe(hits1 + 1);
    });
  });

  it('when the demo seed runs twice, then nothing is duplicated', async () => {
    await withFreshDb(async (db) => {
      await migrateToLatest(db.sequelize);
      const first = await seedDemo(db);
      const second = await seedDemo(db);
      expect(second).toEqual(first);
      const { Firm, User, Membership, Project } = db.models;
      expect(await Firm.count()).toBe(1);
      expect(await User.count()).toBe(DEMO_USERS.length);
      expect(await Membership.count()).toBe(4);
      expect(await Project.count()).toBe(1);
      const roles = (await Membership.findAll()).map((m) => m.getDataValue('role')).sort();
      expect(roles).toEqual(['drafter', 'engineer', 'manager', 'owner']);
    });
  });

  it.skipIf(testDialect !== 'sqlite')('when the database is a file in a missing folder, then the folder is created, WAL and foreign keys are on', async () => {
    const file = join(tmp, 'nested', 'bw.sqlite');
    const db = await connectDatabase(`sqlite:${file}`);
    try {
      await migrateToLatest(db.sequelize);
      const journal = await db.sequelize.query<{ journal_mode: string }>('PRAGMA journal_mode', {
        type: QueryTypes.SELECT,
      });
      expect(journal).toEqual([{ journal_mode: 'wal' }]);
      const fk = await db.sequelize.query<{ foreign_keys: number }>('PRAGMA foreign_keys', {
        type: QueryTypes.SELECT,
      });
      expect(fk).toEqual([{ foreign_keys: 1 }]);
      // A project for a firm that does not exist is refused by the foreign key.
      await expect(
        db.models.Project.create({ firmId: '00000000-0000-4000-8000-000000000000', name: 'Orphan' }),
      ).rejects.toThrow(/FOREIGN KEY/);
    } finally {
      await db.sequelize.close();
    }
  });
});

describe('file database end to end', () => {
  it.skipIf(testDialect !== 'sqlite')('when the app runs on a SQLite file, then sign-up (a transaction), sign-in and a project round trip work', async () => {
    const t = await createTestApp({ databaseUrl: `sqlite:${join(tmp, 'app.sqlite')}` });
    try {
      // createTestApp signed every demo role in and signed the other firm up.
      const created = await t.agents.engineer.post('/api/projects').send({ name: 'File-backed' });
      expect(created.status).toBe(201);
      const listed = await t.agents.manager.get('/api/projects');
      expect(listed.body.projects.map((p: { name: string }) => p.name)).toContain('File-backed');
      expect(t.serverErrors).toEqual([]);
    } finally {
      await t.close();
    }
  });
});

describe('unexpected failures', () => {
  it('when the database fails under a route, then 500 with the generic body and the error is logged', async () => {
    const t = await createTestApp();
    try {
      await t.ctx.db.sequelize.getQueryInterface().dropTable('projects', { cascade: true });
      const res = await t.agents.owner.get('/api/projects');
      expect(res.status).toBe(500);
      expect(res.body).toEqual({
        error: { code: 'internal', message: 'Something went wrong on our side. Please try again.' },
      });
      expect(t.serverErrors).toHaveLength(1);
      // SQLite: 'no such table: projects'; PostgreSQL: 'relation "projects" does not exist'.
      expect(String(t.serverErrors[0])).toMatch(/no such table|relation "projects" does not exist/);
    } finally {
      await t.close();
    }
  });
});
