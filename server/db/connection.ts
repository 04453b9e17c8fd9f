import { mkdirSync } from 'node:fs';
import { dirname } from 'node:path';
import { Sequelize } from 'sequelize';
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

/** Opens the database and defines the models. Does not run migrations. */
export async function connectDatabase(databaseUrl: string): Promise<Db> {
  const target = parseDatabaseUrl(databaseUrl);
  let sequelize: Sequelize;
  if (target.dialect === 'sqlite') {
    if (!target.inMemory) mkdirSync(dirname(target.storage), { recursive: true });
    sequelize = new Sequelize({ dialect: 'sqlite', storage: target.storage, logging: false });
    serializeSqliteTransactions(sequelize);
  } else {
    // Needs the `pg` package installed; nothing in the models or migrations is SQLite-only.
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
