// Local S3-compatible object store on loopback (s3rver), standing in for hosted object storage.
// Usage: node scripts/object-store.mjs --port 4568 --dir .data/s3 --bucket rigcall
import fs from 'node:fs';
import { parseArgs } from 'node:util';
import S3rver from 's3rver';

const { values } = parseArgs({
  options: {
    port: { type: 'string', default: '4568' },
    dir: { type: 'string', default: '.data/s3' },
    bucket: { type: 'string', default: 'rigcall' },
  },
});

fs.mkdirSync(values.dir, { recursive: true });

// Browsers upload photos straight to the store with presigned PUTs, so the bucket allows CORS.
const cors = `<CORSConfiguration>
  <CORSRule>
    <AllowedOrigin>*</AllowedOrigin>
    <AllowedMethod>GET</AllowedMethod>
    <AllowedMethod>PUT</AllowedMethod>
    <AllowedMethod>HEAD</AllowedMethod>
    <AllowedHeader>*</AllowedHeader>
    <ExposeHeader>ETag</ExposeHeader>
    <MaxAgeSeconds>3000</MaxAgeSeconds>
  </CORSRule>
</CORSConfiguration>`;

const server = new S3rver({
  address: '127.0.0.1',
  port: Number(values.port),
  directory: values.dir,
  silent: true,
  vhostBuckets: false,
  configureBuckets: [{ name: values.bucket, configs: [cors] }],
});

await server.run();
console.log(`object store on http://127.0.0.1:${values.port} bucket ${values.bucket}`);

const shutdown = () => server.close().finally(() => process.exit(0));
process.on('SIGTERM', shutdown);
process.on('SIGINT', shutdown);
