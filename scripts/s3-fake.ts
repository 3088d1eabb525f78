// Development and test S3: s3rver in its own process (in the same process as code that blocks the
// event loop it deadlocks), files under TW_S3_DIR, the bucket created at start.
//   TW_FAKE_HOST:TW_S3_PORT (default 127.0.0.1:54321; 0 = any free port), bucket S3_BUCKET.
// Clients must use forcePathStyle and requestChecksumCalculation/responseChecksumValidation
// 'WHEN_REQUIRED': with the SDK's default checksums s3rver silently stores corrupted uploads.
import { mkdirSync } from 'node:fs';
import S3rver from 's3rver';
import { announceReady, fatal, onStop, portFromEnv } from './fakes/fake-lifecycle';

// The browser reads media straight from the store (presigned URLs) and may upload to it; the
// fake listens on 127.0.0.1 only, so any origin on this machine may.
const CORS = `<CORSConfiguration>
  <CORSRule>
    <AllowedOrigin>*</AllowedOrigin>
    <AllowedMethod>GET</AllowedMethod>
    <AllowedMethod>HEAD</AllowedMethod>
    <AllowedMethod>PUT</AllowedMethod>
    <AllowedMethod>POST</AllowedMethod>
    <AllowedHeader>*</AllowedHeader>
    <ExposeHeader>ETag</ExposeHeader>
    <ExposeHeader>Content-Range</ExposeHeader>
    <ExposeHeader>Accept-Ranges</ExposeHeader>
    <ExposeHeader>Content-Length</ExposeHeader>
    <MaxAgeSeconds>3000</MaxAgeSeconds>
  </CORSRule>
</CORSConfiguration>`;

async function main(): Promise<void> {
  const host = process.env.TW_FAKE_HOST || '127.0.0.1';
  const directory = process.env.TW_S3_DIR;
  if (!directory) throw new Error('TW_S3_DIR must name the folder that holds the fake bucket');
  const bucket = process.env.S3_BUCKET || 'trenchwork-media';
  mkdirSync(directory, { recursive: true });

  const server = new S3rver({
    address: host,
    port: portFromEnv('TW_S3_PORT', 54321),
    directory,
    silent: process.env.TW_S3_VERBOSE !== '1',
    vhostBuckets: false,
    resetOnClose: false,
    configureBuckets: [{ name: bucket, configs: [CORS] }],
  });
  const address = await server.run().catch((error: Error) => {
    throw new Error(`s3rver could not listen on ${host}: ${error.message}`);
  });
  onStop(() => server.close());
  announceReady('s3-fake', { port: address.port, bucket });
}

main().catch(fatal);
