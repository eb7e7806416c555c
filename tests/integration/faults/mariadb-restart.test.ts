// MariaDB restarts while the app holds a connection pool (issue 8 item 6). lib/db.ts builds its one pool from
// DATABASE_URL at first use, so this test builds a pool the same way, from knexConfig() in knexfile.ts, against a
// private MariaDB that it restarts; the shared dev MariaDB is never stopped.
import knex, { type Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { knexConfig } from '@/knexfile';
import { privateMariaDb, type PrivateService } from './private-services';

let server: PrivateService & { databaseUrl: string };
let pool: Knex | undefined;

beforeAll(async () => {
  server = await privateMariaDb();
  await server.start();
}, 60_000);

afterAll(async () => {
  try {
    await pool?.destroy();
  } finally {
    await server?.dispose();
  }
}, 60_000);

/** Runs `n` queries one after another; returns how many failed and the last result. */
async function queries(db: Knex, n: number): Promise<{ errors: string[]; last: number | undefined }> {
  const errors: string[] = [];
  let last: number | undefined;
  for (let i = 0; i < n; i++) {
    try {
      last = Number((await db('readings').count({ n: '*' }).first())?.n);
    } catch (error) {
      errors.push(error instanceof Error ? error.message : String(error));
    }
  }
  return { errors, last };
}

describe('MariaDB restarted under a live pool', () => {
  it('the pool recovers: after the restart queries succeed with at most one error, and no row is lost', async () => {
    pool = knex(knexConfig(server.databaseUrl));
    await pool.schema.createTable('readings', (t) => {
      t.increments('id');
      t.string('label', 64).notNullable();
    });
    await pool('readings').insert([{ label: 'Cobalt Ridge run 1' }, { label: 'Cobalt Ridge run 2' }, { label: 'Cobalt Ridge run 3' }]);
    // Several connections open at once, so the pool holds more than one socket that the restart cuts.
    const concurrent = await Promise.all(Array.from({ length: 6 }, () => pool!('readings').count({ n: '*' }).first()));
    expect(concurrent.map((r) => Number(r?.n))).toEqual([3, 3, 3, 3, 3, 3]);

    // A request in flight when the server goes down ends (it does not hang): with an error or SLEEP's "interrupted" 1.
    const inFlight = pool.raw('SELECT SLEEP(20) AS slept').then((r: [{ slept: number }[]]) => r[0][0]!.slept, (e: Error) => e.message);
    await new Promise((r) => setTimeout(r, 200));
    const stopped = Date.now();
    await server.stop();
    expect(String(await inFlight)).toMatch(/^1$|Connection lost: The server closed the connection\.$/);
    expect(Date.now() - stopped).toBeLessThan(15_000);
    const whileDown = await queries(pool, 1);
    expect(whileDown.errors).toHaveLength(1);
    expect(whileDown.errors[0]).toMatch(/ECONNREFUSED|Connection lost|closed state/);

    await server.start();
    const after = await queries(pool, 10);
    expect(after.errors.length).toBeLessThanOrEqual(1);
    expect(after.last).toBe(3);
    // And concurrent work after the restart runs on fresh connections.
    const again = await Promise.all(Array.from({ length: 6 }, () => pool!('readings').count({ n: '*' }).first()));
    expect(again.map((r) => Number(r?.n))).toEqual([3, 3, 3, 3, 3, 3]);
  }, 90_000);
});
