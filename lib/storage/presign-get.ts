import 'server-only';
import { GetObjectCommand } from '@aws-sdk/client-s3';
import { getSignedUrl } from '@aws-sdk/s3-request-presigner';
import type { ObjectStore } from './objects';

export type PresignGetOptions = {
  expiresInS: number;
  /** Sent back as the response's Content-Disposition (response-content-disposition), so the browser names the file. */
  contentDisposition?: string;
  contentType?: string;
};

/** A GET address for one object that needs no credentials until it expires; signed for the endpoint browsers reach. */
export async function presignObjectGet(store: ObjectStore, key: string, options: PresignGetOptions): Promise<string> {
  const command = new GetObjectCommand({
    Bucket: store.bucket,
    Key: key,
    ResponseContentDisposition: options.contentDisposition,
    ResponseContentType: options.contentType,
  });
  return getSignedUrl(store.presigner, command, { expiresIn: options.expiresInS });
}
