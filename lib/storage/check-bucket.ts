import 'server-only';
import { HeadBucketCommand } from '@aws-sdk/client-s3';
import { bucket, s3 } from './client';

export async function checkBucket(): Promise<void> {
  await s3().send(new HeadBucketCommand({ Bucket: bucket() }));
}
