// `npm run backup [-- --out DIR]`: the database (mariadb-dump) and every object of the bucket into
// backups/<UTC instant>/ with a manifest of keys, sizes and SHA-256. Uses the configured settings; run by hand
// against the dev stack it reads .data/env.sh (written by `npm run services`) when DATABASE_URL is not set.
import path from 'node:path';
import { createBackup } from '@/lib/backup/create-backup';
import { loadStackEnv } from './stack-env-file';

const args = process.argv.slice(2);
const outAt = args.indexOf('--out');
const rootDir = path.resolve(outAt >= 0 && args[outAt + 1] ? args[outAt + 1]! : 'backups');
if (args.some((a, i) => a !== '--out' && (outAt < 0 || i !== outAt + 1))) {
  console.error('usage: npm run backup [-- --out DIR]');
  process.exit(2);
}

const envFile = loadStackEnv();
if (envFile) console.log(`settings from ${path.relative(process.cwd(), envFile)}`);
const started = Date.now();
try {
  const { folder, manifest } = await createBackup({ rootDir, log: (line) => console.log(line) });
  console.log(`backup complete in ${((Date.now() - started) / 1000).toFixed(1)} s: ${path.relative(process.cwd(), folder) || folder}`);
  console.log(`  database ${manifest.source.database}: ${manifest.database.sizeBytes} bytes; ${manifest.totals.objects} objects, ${manifest.totals.objectBytes} bytes`);
  if (manifest.skippedObjects.length) console.log(`  ${manifest.skippedObjects.length} objects were deleted while the backup ran (listed in manifest.json)`);
  process.exit(0);
} catch (error) {
  console.error(`✗ backup failed: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
}
