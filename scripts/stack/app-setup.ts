// Steps between the services and the app: migrations (the lead's db/migrate.ts) and the demo-account banner.
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { runForeground } from './foreground';
import type { Stack } from './index';
import { projectRoot } from './layout';

export const MIGRATE_SCRIPT = path.join(projectRoot, 'db', 'migrate.ts');
const DEMO_ACCOUNTS = path.join(projectRoot, 'db', 'seeds', 'demo-accounts.json');

export type StepOutcome = { ok: boolean; seconds: number; note?: string; missing?: boolean };

/** `tsx db/migrate.ts [--seed]` with the stack's environment. */
export async function migrate(stack: Stack, seed: boolean): Promise<StepOutcome> {
  if (!existsSync(MIGRATE_SCRIPT)) {
    return { ok: false, seconds: 0, missing: true, note: 'db/migrate.ts does not exist yet, so no tables were created' };
  }
  const args = [MIGRATE_SCRIPT, ...(seed ? ['--seed'] : [])];
  console.log(`$ tsx db/migrate.ts${seed ? ' --seed' : ''}`);
  // The demo seed deposits through lib/ operations, which are marked 'server-only': resolve them as the server does.
  const r = await runForeground(process.execPath, ['--conditions=react-server', '--import', 'tsx', ...args], { ...process.env, ...stack.env });
  return { ok: r.code === 0, seconds: r.seconds, note: r.code === 0 ? undefined : `exit code ${r.code}` };
}

type Account = { email: string; role?: string; note?: string; password?: string };

/** Accepts `[{email, role, note}]` (optionally with `password`) or `{password, accounts: [...]}`. */
export function demoAccountLines(file = DEMO_ACCOUNTS): string[] {
  if (!existsSync(file)) return ['Demo accounts: db/seeds/demo-accounts.json is not there yet (no demo seed written).'];
  let parsed: unknown;
  try {
    parsed = JSON.parse(readFileSync(file, 'utf8'));
  } catch (error) {
    return [`Demo accounts: could not read db/seeds/demo-accounts.json (${String(error)}).`];
  }
  const shared = !Array.isArray(parsed) && typeof parsed === 'object' && parsed !== null ? (parsed as { password?: unknown }).password : undefined;
  const list: unknown = Array.isArray(parsed) ? parsed : (parsed as { accounts?: unknown } | null)?.accounts;
  const accounts = (Array.isArray(list) ? list : []).filter(
    (a): a is Account => typeof a === 'object' && a !== null && typeof (a as Account).email === 'string',
  );
  if (accounts.length === 0) return ['Demo accounts: db/seeds/demo-accounts.json lists none.'];
  const lines = [`Demo accounts${typeof shared === 'string' ? ` (password for all: ${shared})` : ''}:`];
  const width = Math.max(...accounts.map((a) => a.email.length));
  for (const a of accounts) {
    const extra = [a.role, a.note, a.password ? `password ${a.password}` : undefined].filter(Boolean).join(' — ');
    lines.push(`  ${a.email.padEnd(width)}  ${extra}`);
  }
  return lines;
}
