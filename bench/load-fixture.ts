// npx tsx bench/load-fixture.ts [--remove] — 100,000 synthetic published versions for `npm run bench:load`, inserted
// straight into DATABASE_URL with batched inserts. Bench data only: every row belongs to the group 'bench-fixture',
// no DOI is registered anywhere (doi stays NULL, doi_state 'none'), and --remove deletes all of it again.
import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import knex, { type Knex } from 'knex';
import { knexConfig } from '../knexfile';
import { searchCorpus } from './search-corpus';

const GROUP_SLUG = 'bench-fixture';
const COUNT = Number(process.env.BENCH_FIXTURE_COUNT ?? 100_000);
const BATCH = 1_000;
const TEMPLATE = path.join(import.meta.dirname, '..', 'tests', 'fixtures', 'transport', 'cu-wire-rt.meta.json');

async function groupId(db: Knex): Promise<string | undefined> {
  return (await db('groups').where({ slug: GROUP_SLUG }).first('id'))?.id as string | undefined;
}

/** Deletes the bench group and everything under it (versions and publications cascade from datasets). */
async function remove(db: Knex): Promise<number> {
  const id = await groupId(db);
  if (!id) return 0;
  let removed = 0;
  // In slices: one DELETE of 100,000 cascading rows holds locks for long on a shared dev database.
  for (;;) {
    const ids = (await db('datasets').where({ group_id: id }).limit(BATCH).pluck('id')) as string[];
    if (ids.length === 0) break;
    removed += await db('datasets').whereIn('id', ids).delete();
  }
  await db('groups').where({ id }).delete();
  return removed;
}

async function insert(db: Knex): Promise<void> {
  if (await groupId(db)) throw new Error(`group '${GROUP_SLUG}' already exists: run with --remove first`);
  const template = JSON.parse(readFileSync(TEMPLATE, 'utf8')) as Record<string, unknown>;
  const gid = randomUUID();
  await db('groups').insert({
    id: gid, slug: GROUP_SLUG, name: 'Bench fixture (synthetic load-test data, not real measurements)',
    description: 'Created by bench/load-fixture.ts for npm run bench:load; remove with --remove.',
  });
  const corpus = searchCorpus();
  const started = Date.now();
  for (let from = 0; from < COUNT; from += BATCH) {
    const datasets: Record<string, unknown>[] = [];
    const versions: Record<string, unknown>[] = [];
    const publications: Record<string, unknown>[] = [];
    for (let i = from; i < Math.min(COUNT, from + BATCH); i++) {
      const doc = corpus.make(i);
      const datasetId = randomUUID();
      const versionId = randomUUID();
      // Spread over the corpus years, but never after the load: a version cannot have been published in the future.
      const publishedAt = new Date(Math.min(Date.UTC(doc.year, i % 12, 1 + (i % 28), 9), started - i * 1000));
      const title = `[bench] ${doc.title}`.slice(0, 300);
      const record = { ...template, title, description: `Synthetic bench record ${i}. ${doc.description}`, keywords: doc.keywords };
      datasets.push({ id: datasetId, group_id: gid });
      versions.push({
        id: versionId, dataset_id: datasetId, version_number: 1, state: 'published', title, metadata: JSON.stringify(record),
        doi_state: 'none', published_at: publishedAt, submitted_at: publishedAt,
      });
      publications.push({ version_id: versionId, dataset_id: datasetId, published_at: publishedAt });
    }
    await db.transaction(async (trx) => {
      await trx('datasets').insert(datasets);
      await trx('dataset_versions').insert(versions);
      await trx('version_publications').insert(publications);
    });
    if ((from / BATCH) % 10 === 9) console.log(`${(from + BATCH).toLocaleString('en')} versions (${((Date.now() - started) / 1000).toFixed(0)} s)`);
  }
  console.log(`inserted ${COUNT.toLocaleString('en')} published versions in group '${GROUP_SLUG}' in ${((Date.now() - started) / 1000).toFixed(1)} s`);
}

const db = knex(knexConfig());
try {
  if (process.argv.includes('--remove')) console.log(`removed ${await remove(db)} bench datasets and the group '${GROUP_SLUG}'`);
  else await insert(db);
} finally {
  await db.destroy();
}
