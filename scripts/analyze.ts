// CLI: npm run analyze -- FILE [--meta META.json] [--pretty] — prints the file's summary JSON (exit 2 on bad input).
import { createReadStream } from 'node:fs';
import { readFile, stat } from 'node:fs/promises';
import path from 'node:path';
import { validateTransportDataset } from '../lib/schema/validate-transport-dataset';
import { TransportParseError } from '../lib/transport/parse/errors';
import { summariseFile } from '../lib/transport/summarise-file';

const USAGE = 'usage: npm run analyze -- FILE [--meta META.json] [--pretty]';

class UsageError extends Error {}

function parseArgs(argv: string[]): { file: string; meta?: string; pretty: boolean } {
  let file: string | undefined;
  let meta: string | undefined;
  let pretty = false;
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === '--pretty') pretty = true;
    else if (a === '--meta') {
      meta = argv[++i];
      if (!meta) throw new UsageError(`--meta needs a file name; ${USAGE}`);
    } else if (a.startsWith('--')) throw new UsageError(`unknown option ${a}; ${USAGE}`);
    else if (file) throw new UsageError(`only one FILE, got '${file}' and '${a}'; ${USAGE}`);
    else file = a;
  }
  if (!file) throw new UsageError(USAGE);
  return { file, meta, pretty };
}

async function loadMetadata(metaPath: string) {
  let json: unknown;
  try {
    json = JSON.parse(await readFile(metaPath, 'utf8'));
  } catch (e) {
    throw new UsageError(`metadata ${metaPath}: ${e instanceof SyntaxError ? 'not valid JSON' : 'cannot be read'} (${(e as Error).message})`);
  }
  const checked = validateTransportDataset(json, { partial: true });
  if (!checked.ok) throw new UsageError(`metadata ${metaPath}: ${checked.errors[0].path || '(record)'}: ${checked.errors[0].message}`);
  return checked.value;
}

async function main(): Promise<void> {
  const args = parseArgs(process.argv.slice(2));
  const info = await stat(args.file).catch(() => undefined);
  if (!info?.isFile()) throw new UsageError(`${args.file}: no such file`);
  const metadata = args.meta ? await loadMetadata(args.meta) : undefined;
  const summary = await summariseFile(createReadStream(args.file), { metadata, fileName: path.basename(args.file), sizeBytes: info.size });
  process.stdout.write(`${JSON.stringify(summary, null, args.pretty ? 2 : undefined)}\n`);
}

main().catch((e: unknown) => {
  if (e instanceof TransportParseError) process.stderr.write(`analyze: ${e.code}${e.line ? ` (line ${e.line})` : ''}: ${e.message}\n`);
  else if (e instanceof UsageError) process.stderr.write(`analyze: ${e.message}\n`);
  else process.stderr.write(`analyze: internal error: ${e instanceof Error ? e.message : String(e)}\n`);
  process.exitCode = e instanceof TransportParseError || e instanceof UsageError ? 2 : 1;
});
