import { AsyncLocalStorage } from 'node:async_hooks';
import { mkdirSync } from 'node:fs';
import { dirname } from 'node:path';
import { Sequelize, Transaction } from 'sequelize';
import { defineModels, type Db } from '../models/models';
import { serializeSqliteTransactions } from './sqlite-serial';

export type DatabaseTarget =
  | { dialect: 'sqlite'; storage: string; inMemory: boolean }
  | { dialect: 'postgres'; url: string };

export function parseDatabaseUrl(url: string): DatabaseTarget {
  if (url.startsWith('sqlite:')) {
    const storage = url.slice('sqlite:'.length).replace(/^\/\/(?=\.|\/)/, '');
    const inMemory = storage === ':memory:' || storage === '';
    return { dialect: 'sqlite', storage: inMemory ? ':memory:' : storage, inMemory };
  }
  if (/^postgres(ql)?:\/\//.test(url)) return { dialect: 'postgres', url };
  throw new Error(`Unsupported DATABASE_URL: ${url}`);
}

/** How long a SQLite statement waits for another connection's write lock before failing. */
export const SQLITE_BUSY_TIMEOUT_MS = 10_000;

/**
 * SQLite allows one writer at a time, and Sequelize's sqlite driver shares one connection for
 * an in-memory database (so two open transactions would interleave their BEGIN/COMMIT) and
 * opens one connection per transaction for a file (so a second writer fails at once with
 * SQLITE_BUSY). Three things make concurrent requests behave as they do on PostgreSQL:
 * transactions run one after another in this process (a queue), they start IMMEDIATE (the
 * write lock is taken at BEGIN, so a transaction never fails half way on a stale snapshot),
 * and every connection waits for the lock instead of failing (busy timeout).
 */
function hardenSqlite(sequelize: Sequelize): void {
  type ConnectionManager = { getConnection(options?: unknown): Promise<{ configure(option: 'busyTimeout', ms: number): void }> };
  const manager = (sequelize as unknown as { connectionManager: ConnectionManager }).connectionManager;
  const getConnection = manager.getConnection.bind(manager);
  const configured = new WeakSet<object>();
  const columnInfo = new SqliteColumnInfoCache();
  columnInfoCaches.set(sequelize, columnInfo);
  manager.getConnection = async (options?: unknown) => {
    const connection = await getConnection(options);
    if (!configured.has(connection)) {
      connection.configure('busyTimeout', SQLITE_BUSY_TIMEOUT_MS);
      columnInfo.attach(connection as unknown as SqliteConnection);
      configured.add(connection);
    }
    return connection;
  };

  const original = sequelize.transaction.bind(sequelize) as (options?: unknown, fn?: unknown) => Promise<unknown>;
  const inside = new AsyncLocalStorage<true>();
  let tail: Promise<unknown> = Promise.resolve();
  const queued = (options?: unknown, fn?: unknown): Promise<unknown> => {
    const callback = typeof options === 'function' ? options : fn;
    const opts = typeof options === 'function' ? {} : (options ?? {});
    if (typeof callback !== 'function') return original(opts); // unmanaged: the caller commits
    if (inside.getStore()) {
      // Would wait for itself; every service passes the open transaction down instead.
      return Promise.reject(new Error('A transaction was opened inside another transaction (pass the open one down instead).'));
    }
    const run = tail.then(() => inside.run(true, () => original(opts, callback)));
    tail = run.catch(() => undefined);
    return run;
  };
  (sequelize as unknown as { transaction: typeof queued }).transaction = queued;
}

type SqliteCallback = (this: unknown, err: Error | null, rows?: unknown) => void;
interface SqliteConnection {
  all(sql: string, ...rest: unknown[]): unknown;
  run(sql: string, ...rest: unknown[]): unknown;
  exec(sql: string, ...rest: unknown[]): unknown;
}

const TABLE_INFO = /^PRAGMA table_info\(`([^`]+)`\)$/;
const SCHEMA_CHANGE = /^\s*(CREATE|ALTER|DROP)\b/i;

const columnInfoCaches = new WeakMap<Sequelize, SqliteColumnInfoCache>();

/** The column-type cache of a SQLite database (tests); undefined on PostgreSQL. */
export function sqliteColumnInfoOf(sequelize: Sequelize): SqliteColumnInfoCache | undefined {
  return columnInfoCaches.get(sequelize);
}

/**
 * Sequelize's SQLite driver asks `PRAGMA table_info` of every table a SELECT reads, before
 * every SELECT, to learn the column types it parses values by: a second statement for each
 * read. The answer changes only when the schema does, so it is kept per database and served
 * from memory (asynchronously, as the driver would answer), and forgotten whenever a statement
 * that changes the schema (CREATE, ALTER, DROP: migrations) runs on any of its connections.
 * PostgreSQL has no such step.
 */
export class SqliteColumnInfoCache {
  private readonly tables = new Map<string, unknown>();
  /** Counts schema changes, so an answer read before one is not kept after it. */
  private generation = 0;
  /** Statements answered from memory (for tests). */
  hits = 0;

  attach(connection: SqliteConnection): void {
    const all = connection.all.bind(connection);
    const run = connection.run.bind(connection);
    const exec = connection.exec.bind(connection);
    const forgetOnSchemaChange = (sql: unknown) => {
      if (typeof sql === 'string' && SCHEMA_CHANGE.test(sql)) {
        this.tables.clear();
        this.generation++;
      }
    };
    connection.all = (sql: string, ...rest: unknown[]) => {
      const table = typeof sql === 'string' ? TABLE_INFO.exec(sql)?.[1] : undefined;
      const callback = rest[rest.length - 1];
      if (table === undefined || typeof callback !== 'function' || rest.length !== 1) {
        forgetOnSchemaChange(sql);
        return all(sql, ...rest);
      }
      const known = this.tables.get(table);
      if (known !== undefined) {
        this.hits++;
        process.nextTick(() => (callback as SqliteCallback).call(connection, null, known));
        return connection;
      }
      const asked = this.generation;
      return all(sql, (err: Error | null, rows?: unknown) => {
        if (!err && Array.isArray(rows) && rows.length > 0 && asked === this.generation) this.tables.set(table, rows);
        (callback as SqliteCallback).call(connection, err, rows);
      });
    };
    connection.run = (sql: string, ...rest: unknown[]) => {
      forgetOnSchemaChange(sql);
      return run(sql, ...rest);
    };
    connection.exec = (sql: string, ...rest: unknown[]) => {
      forgetOnSchemaChange(sql);
      return exec(sql, ...rest);
    };
  }
}

/** Opens the database and defines the models. Does not run migrations. */
export async function connectDatabase(databaseUrl: string): Promise<Db> {
  const target = parseDatabaseUrl(databaseUrl);
  let sequelize: Sequelize;
  if (target.dialect === 'sqlite') {
    if (!target.inMemory) mkdirSync(dirname(target.storage), { recursive: true });
    sequelize = new Sequelize({
      dialect: 'sqlite',
      storage: target.storage,
      logging: false,
      transactionType: Transaction.TYPES.IMMEDIATE,
    });
    hardenSqlite(sequelize);
    // Queries from outside an open transaction wait for it too (one shared connection in memory).
    serializeSqliteTransactions(sequelize);
  } else {
    // The `pg` client (pure JavaScript); nothing in the models or migrations is SQLite-only.
    sequelize = new Sequelize(target.url, { dialect: 'postgres', logging: false });
  }
  await sequelize.authenticate();
  if (target.dialect === 'sqlite') {
    // Sequelize's sqlite driver keeps one connection per storage and already turns on
    // foreign keys per connection; WAL is a property of the file, so once is enough.
    await sequelize.query('PRAGMA foreign_keys = ON');
    if (!target.inMemory) await sequelize.query('PRAGMA journal_mode = WAL');
  }
  return { sequelize, models: defineModels(sequelize) };
}
