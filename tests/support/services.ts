// Helpers for tests that talk to the local services `npm test` starts (env set by scripts/stack/env.ts).
const LOOPBACK_NAMES = new Set(['localhost', '127.0.0.1', '::1', '[::1]']);

export function isLoopbackHost(host: string): boolean {
  return LOOPBACK_NAMES.has(host.toLowerCase()) || /^127(\.\d{1,3}){3}$/.test(host);
}

/** Throws unless the URL points at this machine: tests must never write to a shared or remote service. */
export function assertLoopback(url: string, what = 'service'): URL {
  let parsed: URL;
  try {
    parsed = new URL(url);
  } catch {
    throw new Error(`${what} URL ${JSON.stringify(url)} is not a valid URL.`);
  }
  if (!isLoopbackHost(parsed.hostname)) {
    throw new Error(`Refusing to run tests against ${what} at "${parsed.hostname}": tests only use services on loopback (127.0.0.1).`);
  }
  return parsed;
}

/** A variable `npm test` sets; running a test file by hand without it fails with this hint. */
export function requireEnv(name: string): string {
  const value = process.env[name];
  if (!value) throw new Error(`${name} is not set. Run the tests through \`npm test\`, which starts the local services and exports their settings.`);
  return value;
}

export type ServiceUrls = { database: URL; s3: URL; smtp: URL; doi: URL; app: URL };

/** Every service URL from the environment, each checked to be on loopback. */
export function serviceUrls(): ServiceUrls {
  return {
    database: assertLoopback(requireEnv('DATABASE_URL'), 'database'),
    s3: assertLoopback(requireEnv('S3_ENDPOINT'), 'object storage'),
    smtp: assertLoopback(requireEnv('SMTP_URL'), 'SMTP'),
    doi: assertLoopback(requireEnv('DOI_API_URL'), 'DOI API'),
    app: assertLoopback(requireEnv('NEXTAUTH_URL'), 'app'),
  };
}

/** Authorization header value for the DOI fake (HTTP Basic with the repository id and password). */
export function doiAuthorization(): string {
  return `Basic ${Buffer.from(`${requireEnv('DOI_REPOSITORY_ID')}:${requireEnv('DOI_PASSWORD')}`).toString('base64')}`;
}
