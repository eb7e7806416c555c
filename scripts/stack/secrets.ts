// Secrets generated once per data dir and kept, so a second `npm start` keeps sessions and the fakes' passwords.
import { randomBytes } from 'node:crypto';
import { mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import path from 'node:path';

export type StackSecrets = { NEXTAUTH_SECRET: string; DOI_PASSWORD: string; ORCID_CLIENT_SECRET: string };

const fresh = (): StackSecrets => ({
  NEXTAUTH_SECRET: randomBytes(32).toString('base64url'),
  DOI_PASSWORD: randomBytes(18).toString('base64url'),
  ORCID_CLIENT_SECRET: randomBytes(24).toString('base64url'),
});

export function loadOrCreateSecrets(file: string): StackSecrets {
  let saved: Partial<StackSecrets> = {};
  try {
    saved = JSON.parse(readFileSync(file, 'utf8')) as Partial<StackSecrets>;
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code !== 'ENOENT') throw new Error(`${file} is unreadable (${String(error)}); delete it to regenerate.`);
  }
  const secrets = { ...fresh(), ...saved };
  // Written back when any secret was missing (a data dir from before a secret was added keeps the ones it had).
  if ((Object.keys(secrets) as (keyof StackSecrets)[]).some((k) => saved[k] !== secrets[k])) {
    mkdirSync(path.dirname(file), { recursive: true });
    const tmp = `${file}.tmp`;
    writeFileSync(tmp, JSON.stringify(secrets, null, 2) + '\n', { mode: 0o600 });
    renameSync(tmp, file);
  }
  return secrets;
}
