import 'server-only';
import Ajv from 'ajv/dist/2020';
import addFormats from 'ajv-formats';
import envSchema from '@/schemas/env.schema.json';

export type ServerEnv = {
  DATABASE_URL: string;
  OHMSTEAD_ALLOW_REMOTE_DB?: '0' | '1';
  S3_ENDPOINT: string;
  S3_PUBLIC_ENDPOINT?: string;
  S3_BUCKET: string;
  S3_REGION: string;
  S3_ACCESS_KEY_ID: string;
  S3_SECRET_ACCESS_KEY: string;
  SMTP_URL: string;
  MAIL_FROM: string;
  MAIL_DIR?: string;
  DOI_API_URL: string;
  DOI_REPOSITORY_ID: string;
  DOI_PASSWORD: string;
  DOI_PREFIX: string;
  NEXTAUTH_URL: string;
  NEXTAUTH_SECRET: string;
  /** Sign in with ORCID is offered when these three are set. */
  ORCID_ISSUER?: string;
  ORCID_CLIENT_ID?: string;
  ORCID_CLIENT_SECRET?: string;
  LOG_LEVEL?: 'debug' | 'info' | 'warn' | 'error';
  /** lib/http/client-address.ts reads it. */
  TRUSTED_PROXY_HOPS?: string;
  /** Bytes, as a decimal string; lib/uploads/limits.ts reads it. */
  MAX_UPLOAD_BYTES?: string;
};

let cached: ServerEnv | undefined;

/** Validates process.env once against schemas/env.schema.json and fails fast with every problem listed. */
export function env(): ServerEnv {
  if (cached) return cached;
  const ajv = new Ajv({ allErrors: true, strict: true });
  addFormats(ajv);
  const validate = ajv.compile(envSchema);
  const picked = Object.fromEntries(
    Object.keys(envSchema.properties).filter((k) => process.env[k] !== undefined && process.env[k] !== '').map((k) => [k, process.env[k]]),
  );
  if (!validate(picked)) {
    const problems = (validate.errors ?? []).map((e) =>
      e.keyword === 'required' ? `${String(e.params.missingProperty)} is not set` : `${e.instancePath.slice(1)} ${e.message}`,
    );
    throw new Error(`Ohmstead configuration is invalid (see .env.example):\n- ${problems.join('\n- ')}`);
  }
  cached = picked as unknown as ServerEnv;
  return cached;
}
