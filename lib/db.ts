import 'server-only';
import knexFactory, { type Knex } from 'knex';
import { knexConfig } from '@/knexfile';
import { assertLoopbackDatabase } from '@/db/loopback-guard';
import { env } from '@/lib/env';

// One pool per server process, kept across hot reloads in development.
const globalForDb = globalThis as unknown as { ohmsteadDb?: Knex };

export function db(): Knex {
  if (!globalForDb.ohmsteadDb) {
    const { DATABASE_URL, OHMSTEAD_ALLOW_REMOTE_DB } = env();
    if (OHMSTEAD_ALLOW_REMOTE_DB !== '1') assertLoopbackDatabase(DATABASE_URL);
    globalForDb.ohmsteadDb = knexFactory(knexConfig(DATABASE_URL));
  }
  return globalForDb.ohmsteadDb;
}
