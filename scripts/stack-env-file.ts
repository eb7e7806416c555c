// Settings of the dev stack for scripts run by hand: `npm run services` writes .data/env.sh with
// KEY='value' lines. Variables already set in the shell win.
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';

/** Parses env.sh as services.ts writes it: single-quoted values, a quote inside written as '\''. */
export function parseEnvSh(text: string): Record<string, string> {
  const out: Record<string, string> = {};
  for (const line of text.split('\n')) {
    const m = /^([A-Z_][A-Z0-9_]*)=(.*)$/.exec(line.trim());
    if (!m) continue;
    const raw = m[2]!;
    out[m[1]!] = raw.startsWith("'") && raw.endsWith("'") && raw.length >= 2 ? raw.slice(1, -1).replace(/'\\''/g, "'") : raw;
  }
  return out;
}

/** Loads .data/env.sh into process.env when DATABASE_URL is not set; returns the file it read, if any. */
export function loadStackEnv(root = process.cwd()): string | null {
  if (process.env.DATABASE_URL) return null;
  const file = path.join(root, '.data', 'env.sh');
  if (!existsSync(file)) return null;
  for (const [k, v] of Object.entries(parseEnvSh(readFileSync(file, 'utf8')))) process.env[k] ??= v;
  return file;
}
