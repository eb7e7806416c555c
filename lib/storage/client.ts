import 'server-only';
import { S3Client } from '@aws-sdk/client-s3';
import { env } from '@/lib/env';

let client: S3Client | undefined;
let presigner: S3Client | undefined;

/** An S3 client for one endpoint with the options every Ohmstead client needs. */
export function createS3Client(endpoint: string): S3Client {
  const e = env();
  return new S3Client({
    region: e.S3_REGION,
    endpoint,
    forcePathStyle: true,
    credentials: { accessKeyId: e.S3_ACCESS_KEY_ID, secretAccessKey: e.S3_SECRET_ACCESS_KEY },
    // The SDK's default checksums store streamed bodies with aws-chunked framing on some stores (stack.md).
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
    // Fail fast when storage is down (the caller answers 503); requestTimeout is per idle socket, not per body.
    requestHandler: { connectionTimeout: 5_000, requestTimeout: 60_000 },
  });
}

export function s3(): S3Client {
  client ??= createS3Client(env().S3_ENDPOINT);
  return client;
}

/** Signs URLs for browsers: S3_PUBLIC_ENDPOINT when storage is reached under another name than the server uses. */
export function presignClient(): S3Client {
  const publicEndpoint = env().S3_PUBLIC_ENDPOINT;
  if (!publicEndpoint) return s3();
  presigner ??= createS3Client(publicEndpoint);
  return presigner;
}

export function presignEndpoint(): string {
  return env().S3_PUBLIC_ENDPOINT ?? env().S3_ENDPOINT;
}

export function bucket(): string {
  return env().S3_BUCKET;
}
