import type { Knex } from 'knex';
import path from 'node:path';

// One config for the app, the migrate script and the tests; DATABASE_URL decides the target.
const migrationsDir = path.join(import.meta.dirname ?? process.cwd(), 'db', 'migrations');
const seedsDir = path.join(import.meta.dirname ?? process.cwd(), 'db', 'seeds');

export function knexConfig(databaseUrl = process.env.DATABASE_URL): Knex.Config {
  if (!databaseUrl) throw new Error('DATABASE_URL is not set (see .env.example).');
  return {
    client: 'mysql2',
    connection: {
      uri: databaseUrl,
      charset: 'utf8mb4',
      timezone: 'Z',
      // DATETIME columns hold UTC; return them as Date objects.
      dateStrings: false,
      supportBigNumbers: true,
    } as Knex.MySql2ConnectionConfig,
    pool: { min: 0, max: 10 },
    migrations: { directory: migrationsDir, extension: 'ts', loadExtensions: ['.ts'], tableName: 'knex_migrations' },
    seeds: { directory: seedsDir, extension: 'ts', loadExtensions: ['.ts'] },
  };
}

export default knexConfig;
