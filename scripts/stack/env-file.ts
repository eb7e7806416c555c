// <data dir>/env.sh: the stack's settings as KEY='value' lines, so scripts run by hand (the bench fixture, the bench,
// one test file, reindex) reach the same services: `set -a; . .data/env.sh; set +a`. Read back by scripts/stack-env-file.ts; written by npm start and npm run services.
import { chmodSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { shellQuote } from '@/lib/format/shell-quote';
import type { Stack } from './index';

export function envFileText(env: Record<string, string>): string {
  return Object.entries(env).map(([k, v]) => `${k}=${shellQuote(v)}`).join('\n') + '\n';
}

/** Writes <data dir>/env.sh and returns its path. */
export function writeEnvFile(stack: Pick<Stack, 'env' | 'layout'>): string {
  const file = path.join(stack.layout.dir, 'env.sh');
  writeFileSync(file, envFileText(stack.env), { mode: 0o600 });
  chmodSync(file, 0o600); // the mode above applies only to a new file; one written by an older version may be 0644
  return file;
}
