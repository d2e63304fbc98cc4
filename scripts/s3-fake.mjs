// The local object store (s3rver), bound to loopback only, with one bucket; used by the test stack.
import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);
const S3rver = require('s3rver');
const port = Number(process.env.PORT ?? 4568);
const bucket = process.env.S3_BUCKET ?? 'padside-test';
await new S3rver({
  address: '127.0.0.1',
  port,
  directory: process.env.S3_DIR,
  silent: true,
  configureBuckets: [{ name: bucket }],
}).run();
console.log(`object store fake on http://127.0.0.1:${port}, bucket ${bucket}`);
