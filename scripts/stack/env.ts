// The environment contract between the runners and the app (read by lib/env.ts); see .env.example.
import type { DataLayout, Profile } from './layout';
import type { Ports } from './ports';
import type { StackSecrets } from './secrets';

export const DATABASE_NAME: Record<Profile, string> = { dev: 'ohmstead', test: 'ohmstead_test' };
export const S3_BUCKET = 'ohmstead';
export const DOI_REPOSITORY_ID = 'OHM.HUB';
export const DOI_PREFIX = '10.80123';
/** The app's client id at the local ORCID sign-in fake (its secret is generated per data dir). */
export const ORCID_CLIENT_ID = 'APP-OHMSTEAD-LOCAL';

export type StackEnv = Record<string, string>;

export function buildEnv(profile: Profile, ports: Ports, layout: DataLayout, secrets: StackSecrets): StackEnv {
  const env: StackEnv = {
    OHMSTEAD_DATA_DIR: layout.dir,
    PORT: String(ports.PORT),
    DB_PORT: String(ports.DB_PORT),
    S3_PORT: String(ports.S3_PORT),
    SMTP_PORT: String(ports.SMTP_PORT),
    DOI_PORT: String(ports.DOI_PORT),
    ORCID_PORT: String(ports.ORCID_PORT),
    DATABASE_URL: `mysql://root@127.0.0.1:${ports.DB_PORT}/${DATABASE_NAME[profile]}`,
    S3_ENDPOINT: `http://127.0.0.1:${ports.S3_PORT}`,
    S3_REGION: 'us-east-1',
    S3_BUCKET,
    S3_ACCESS_KEY_ID: 'S3RVER',
    S3_SECRET_ACCESS_KEY: 'S3RVER',
    SMTP_URL: `smtp://127.0.0.1:${ports.SMTP_PORT}`,
    MAIL_FROM: 'Ohmstead <no-reply@ohmstead.test>',
    MAIL_DIR: layout.mail,
    DOI_API_URL: `http://127.0.0.1:${ports.DOI_PORT}`,
    DOI_REPOSITORY_ID,
    DOI_PASSWORD: secrets.DOI_PASSWORD,
    DOI_PREFIX,
    ORCID_ISSUER: `http://127.0.0.1:${ports.ORCID_PORT}`,
    ORCID_CLIENT_ID,
    ORCID_CLIENT_SECRET: secrets.ORCID_CLIENT_SECRET,
    NEXTAUTH_URL: `http://localhost:${ports.PORT}`,
    NEXTAUTH_SECRET: secrets.NEXTAUTH_SECRET,
    NODE_ENV: profile === 'test' ? 'test' : 'production',
    NEXT_TELEMETRY_DISABLED: '1',
    AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: 'true',
  };
  if (profile === 'test') env.E2E_BASE_URL = `http://localhost:${ports.PORT}`;
  return env;
}
