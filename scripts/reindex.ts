// `npm run reindex`: asks every running app instance to rebuild its search index from the database (through the
// outbox log each instance follows), and builds one here to report what the index holds.
import { db } from '@/lib/db';
import { SEARCH_CHANGED_TOPIC } from '@/lib/search/repo';
import { forgetSearchIndex, searchIndexStatus } from '@/lib/search/search-service';
import { loadStackEnv } from './stack-env-file';

async function main(): Promise<void> {
  loadStackEnv();
  await db()('outbox').insert({ topic: SEARCH_CHANGED_TOPIC, aggregate_id: '*', payload: JSON.stringify({ rebuild: true }), processed_at: db().fn.now() });
  forgetSearchIndex();
  const t = Date.now();
  const status = await searchIndexStatus();
  console.log(`reindex: ${status.versions} published versions indexed in ${((Date.now() - t) / 1000).toFixed(1)} s; running instances rebuild on their next search`);
}

main().then(() => process.exit(0), (error: unknown) => {
  console.error(`reindex failed: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
