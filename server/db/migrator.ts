import type { QueryInterface, Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug, type MigrationFn } from 'umzug';
import * as m0001 from './migrations/0001-accounts';
import * as m0002 from './migrations/0002-projects';
import * as m0003 from './migrations/0003-schemes-plans';
import * as m0004 from './migrations/0004-team-mail-audit';
import * as m0005 from './migrations/0005-underlays';
import * as m0006 from './migrations/0006-scheme-status-prices';
import * as m0007 from './migrations/0007-plan-v2-composite-columns';
import * as m0008 from './migrations/0008-underlay-pdf-pages';
import * as m0009 from './migrations/0009-bay-studies';
import * as m0010 from './migrations/0010-stud-camber-prices-deck-profiles';
import * as m0011 from './migrations/0011-column-tier-shapes';
import * as m0012 from './migrations/0012-member-deflection-limits';

export type Migration = MigrationFn<QueryInterface>;

// Ordered list, explicit so it works the same under tsx, vitest and a bundler.
// Add new migrations at the end; never edit one that has shipped.
const MIGRATIONS: { name: string; up: Migration; down: Migration }[] = [
  { name: '0001-accounts', ...m0001 },
  { name: '0002-projects', ...m0002 },
  { name: '0003-schemes-plans', ...m0003 },
  { name: '0004-team-mail-audit', ...m0004 },
  { name: '0005-underlays', ...m0005 },
  { name: '0006-scheme-status-prices', ...m0006 },
  { name: '0007-plan-v2-composite-columns', ...m0007 },
  { name: '0008-underlay-pdf-pages', ...m0008 },
  { name: '0009-bay-studies', ...m0009 },
  { name: '0010-stud-camber-prices-deck-profiles', ...m0010 },
  { name: '0011-column-tier-shapes', ...m0011 },
  { name: '0012-member-deflection-limits', ...m0012 },
];

/** The migration names in the order they run. */
export const MIGRATION_NAMES: readonly string[] = MIGRATIONS.map((m) => m.name);

export function createMigrator(sequelize: Sequelize) {
  return new Umzug({
    migrations: MIGRATIONS,
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

/** Applies every pending migration; returns the names applied. */
export async function migrateToLatest(sequelize: Sequelize): Promise<string[]> {
  const applied = await createMigrator(sequelize).up();
  return applied.map((m) => m.name);
}
