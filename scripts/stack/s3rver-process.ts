// Runs s3rver in its own process (started by scripts/stack/s3.ts) on loopback, with our bucket and its CORS rule.
import { mkdirSync } from 'node:fs';
import S3rver from 's3rver';
import { announceReady, onStop, setting } from '../fakes/lifecycle';
import { corsXml } from './s3-cors';

const port = Number(setting('S3_PORT'));
const directory = setting('S3_DIR');
const bucket = setting('S3_BUCKET');
const origins = setting('S3_CORS_ORIGINS').split(',');

mkdirSync(directory, { recursive: true });
const server = new S3rver({
  address: '127.0.0.1',
  port,
  directory,
  silent: false,
  configureBuckets: [{ name: bucket, configs: [corsXml(origins)] }],
});

onStop(() => server.close());
server.run().then(
  (addr) => announceReady(`s3rver listening on http://${addr.address}:${addr.port}, bucket ${bucket}, data in ${directory}`),
  (error: unknown) => {
    console.error('s3rver failed to start:', error);
    process.exit(1);
  },
);
