// `npm run restore -- FOLDER [--database NAME] [--key-prefix PREFIX] [--replace]`: loads a backup's dump into the
// configured database (or NAME; refused when it has tables unless --replace), uploads every object and checks its
// SHA-256. Run by hand against the dev stack it reads .data/env.sh (written by `npm run services`) when DATABASE_URL is unset.
import path from 'node:path';
import { restoreBackup } from '@/lib/backup/restore-backup';
import { loadStackEnv } from './stack-env-file';

const USAGE = 'usage: npm run restore -- FOLDER [--database NAME] [--key-prefix PREFIX] [--replace]';
const args = process.argv.slice(2);
let folder: string | undefined;
let database: string | undefined;
let keyPrefix: string | undefined;
let replace = false;
for (let i = 0; i < args.length; i++) {
  const a = args[i]!;
  if (a === '--database') database = args[++i];
  else if (a === '--key-prefix') keyPrefix = args[++i];
  else if (a === '--replace') replace = true;
  else if (!a.startsWith('--') && !folder) folder = a;
  else {
    console.error(USAGE);
    process.exit(2);
  }
}
if (!folder) {
  console.error(USAGE);
  process.exit(2);
}

const envFile = loadStackEnv();
if (envFile) console.log(`settings from ${path.relative(process.cwd(), envFile)}`);
const started = Date.now();
try {
  const { manifest, database: loaded } = await restoreBackup({ folder: path.resolve(folder), database, keyPrefix, replace, log: (l) => console.log(l) });
  console.log(`restore complete in ${((Date.now() - started) / 1000).toFixed(1)} s: database ${loaded}, ${manifest.totals.objects} objects verified`);
  process.exit(0);
} catch (error) {
  console.error(`✗ restore failed: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
}
