// Local S3-compatible object store on loopback (s3rver), standing in for hosted object storage.
// Like a hosted bucket it refuses anonymous requests: every request (but a CORS preflight) must
// carry an AWS Signature Version 4 made with the configured key, in the Authorization header or
// in a presigned URL's query, and the signature is checked here (s3rver itself does not check
// version 4 signatures).
// Usage: S3_ACCESS_KEY_ID=… S3_SECRET_ACCESS_KEY=… node scripts/object-store.mjs --port 4568 --dir .data/s3 --bucket rigcall
import crypto from 'node:crypto';
import fs from 'node:fs';
import http from 'node:http';
import { createRequire } from 'node:module';
import { parseArgs } from 'node:util';
import S3rver from 's3rver';

const require = createRequire(import.meta.url);
const AWSAccount = require('s3rver/lib/models/account.js');

const { values } = parseArgs({
  options: {
    port: { type: 'string', default: '4568' },
    dir: { type: 'string', default: '.data/s3' },
    bucket: { type: 'string', default: 'rigcall' },
  },
});

const accessKeyId = process.env.S3_ACCESS_KEY_ID;
const secretAccessKey = process.env.S3_SECRET_ACCESS_KEY;
if (!accessKeyId || !secretAccessKey) {
  console.error('object store: set S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY (the key clients must sign with)');
  process.exit(2);
}
// Only the configured key is known (s3rver ships with a well-known one; it is withdrawn).
AWSAccount.DUMMY_ACCOUNT.revokeAccessKey('S3RVER');
AWSAccount.DUMMY_ACCOUNT.createKeyPair(accessKeyId, secretAccessKey);

fs.mkdirSync(values.dir, { recursive: true });

// ---------------------------------------------------------------- signature version 4 check
// https://docs.aws.amazon.com/AmazonS3/latest/API/sig-v4-header-based-auth.html
// https://docs.aws.amazon.com/AmazonS3/latest/API/sigv4-query-string-auth.html

const hmac = (key, data) => crypto.createHmac('sha256', key).update(data).digest();
const sha256Hex = (data) => crypto.createHash('sha256').update(data).digest('hex');
const encode = (s) =>
  encodeURIComponent(s).replace(/[!'()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
const maxClockSkewMs = 15 * 60 * 1000;

function parseAmzDate(s) {
  const m = /^(\d{4})(\d{2})(\d{2})T(\d{2})(\d{2})(\d{2})Z$/.exec(s ?? '');
  return m ? Date.UTC(+m[1], +m[2] - 1, +m[3], +m[4], +m[5], +m[6]) : NaN;
}

/** Why this request is refused, or null when it is signed with our key. */
function checkSignature(req) {
  const url = new URL(req.url ?? '/', 'http://store.invalid');
  const rawPath = (req.url ?? '/').split('?')[0] || '/';
  const q = url.searchParams;
  const fromQuery = q.get('X-Amz-Algorithm') !== null;
  let credential, signedHeaders, signature, amzDate, payloadHash;
  if (fromQuery) {
    if (q.get('X-Amz-Algorithm') !== 'AWS4-HMAC-SHA256') return 'unsupported signing algorithm';
    credential = q.get('X-Amz-Credential');
    signedHeaders = q.get('X-Amz-SignedHeaders');
    signature = q.get('X-Amz-Signature');
    amzDate = q.get('X-Amz-Date');
    payloadHash = 'UNSIGNED-PAYLOAD';
    const expires = Number(q.get('X-Amz-Expires'));
    if (!(expires > 0) || parseAmzDate(amzDate) + expires * 1000 < Date.now()) return 'the presigned URL has expired';
  } else {
    const auth = req.headers.authorization;
    if (!auth) return 'anonymous requests are refused';
    const m = /^AWS4-HMAC-SHA256 Credential=([^,]+), ?SignedHeaders=([^,]+), ?Signature=([0-9a-f]+)$/.exec(auth);
    if (!m) return 'only AWS Signature Version 4 is accepted';
    [, credential, signedHeaders, signature] = m;
    amzDate = req.headers['x-amz-date'];
    payloadHash = req.headers['x-amz-content-sha256'] ?? 'UNSIGNED-PAYLOAD';
  }
  const [keyId, day, region, service, terminator] = (credential ?? '').split('/');
  if (keyId !== accessKeyId) return 'unknown access key';
  if (service !== 's3' || terminator !== 'aws4_request' || !day || !region) return 'malformed credential scope';
  const when = parseAmzDate(amzDate);
  if (!Number.isFinite(when) || !amzDate.startsWith(day)) return 'missing or malformed X-Amz-Date';
  if (!fromQuery && Math.abs(Date.now() - when) > maxClockSkewMs) return 'the request time is too far from now';
  const names = (signedHeaders ?? '').split(';').filter(Boolean);
  if (!names.includes('host')) return 'the host header must be signed';
  const canonicalHeaders = names
    .map((n) => {
      const v = req.headers[n];
      return `${n}:${(Array.isArray(v) ? v.join(',') : (v ?? '')).trim().replace(/\s+/g, ' ')}\n`;
    })
    .join('');
  const canonicalQuery = [...q.entries()]
    .filter(([k]) => !(fromQuery && k === 'X-Amz-Signature'))
    .map(([k, v]) => [encode(k), encode(v)])
    .sort(([a, av], [b, bv]) => (a < b ? -1 : a > b ? 1 : av < bv ? -1 : av > bv ? 1 : 0))
    .map(([k, v]) => `${k}=${v}`)
    .join('&');
  const canonicalPath = rawPath
    .split('/')
    .map((seg) => encode(decodeURIComponent(seg)))
    .join('/');
  const canonicalRequest = [
    req.method,
    canonicalPath,
    canonicalQuery,
    canonicalHeaders,
    names.join(';'),
    payloadHash,
  ].join('\n');
  const scope = `${day}/${region}/${service}/aws4_request`;
  const stringToSign = ['AWS4-HMAC-SHA256', amzDate, scope, sha256Hex(canonicalRequest)].join('\n');
  const key = hmac(hmac(hmac(hmac(`AWS4${secretAccessKey}`, day), region), service), 'aws4_request');
  const expected = hmac(key, stringToSign).toString('hex');
  const given = Buffer.from(signature ?? '', 'utf8');
  if (given.length !== expected.length || !crypto.timingSafeEqual(given, Buffer.from(expected, 'utf8')))
    return 'the signature does not match';
  return null;
}

function refuse(res, reason) {
  res.writeHead(403, { 'content-type': 'application/xml' });
  res.end(
    `<?xml version="1.0" encoding="UTF-8"?><Error><Code>AccessDenied</Code><Message>Access denied: ${reason}</Message></Error>`,
  );
}

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

/** s3rver behind the signature check: the check answers first, s3rver only sees signed requests. */
class SignedOnlyS3rver extends S3rver {
  listen(port, address) {
    const handle = this.callback();
    const server = http.createServer((req, res) => {
      // A CORS preflight carries no credentials by design; s3rver answers it from the bucket's rules.
      if (req.method === 'OPTIONS') return handle(req, res);
      const reason = checkSignature(req);
      if (reason) return refuse(res, reason);
      return handle(req, res);
    });
    return new Promise((resolve, reject) => {
      server.once('error', reject);
      server.listen(Number(port), address, () => resolve(server));
    });
  }
}

const server = new SignedOnlyS3rver({
  address: '127.0.0.1',
  port: Number(values.port),
  directory: values.dir,
  silent: true,
  vhostBuckets: false,
  configureBuckets: [{ name: values.bucket, configs: [cors] }],
});

await server.run();
console.log(`object store on http://127.0.0.1:${values.port} bucket ${values.bucket} (signed requests only)`);

const shutdown = () => {
  server.httpServer?.close();
  process.exit(0);
};
process.on('SIGTERM', shutdown);
process.on('SIGINT', shutdown);
