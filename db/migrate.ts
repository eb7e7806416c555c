// Runs Knex migrations (and, with --seed, the demo seed) against DATABASE_URL.
// Used by `npm start`, `npm test` and by hand: `node --conditions=react-server --import tsx db/migrate.ts [--seed]`.
import knexFactory from 'knex';
import { knexConfig } from '../knexfile';
import { assertLoopbackDatabase } from './loopback-guard';

async function main(): Promise<void> {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is not set (see .env.example).');
  if (process.env.OHMSTEAD_ALLOW_REMOTE_DB !== '1') assertLoopbackDatabase(url);
  const db = knexFactory(knexConfig(url));
  try {
    const [batch, applied] = await db.migrate.latest();
    console.log(applied.length ? `migrations: batch ${batch}, applied ${applied.join(', ')}` : 'migrations: up to date');
    if (process.argv.includes('--seed')) {
      const [ran] = await db.seed.run();
      console.log(`seed: ran ${ran.map((f: string) => f.split('/').pop()).join(', ')}`);
    }
  } finally {
    await db.destroy();
  }
}

// The demo seed uses the app's own pools (database, storage) through lib/; they would keep the process alive.
main().then(() => process.exit(0), (error: unknown) => {
  console.error(`migrate failed: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
