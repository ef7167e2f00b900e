// A small S3-compatible object store for development and tests: the part of the S3 REST API the
// AWS SDK uses for us (path-style PutObject, GetObject, HeadObject, DeleteObject, and CreateBucket
// / HeadBucket for set-up). It checks AWS Signature Version 4 on every request and the payload's
// SHA-256 and CRC32 when the client sends them, so a wrong key or a damaged upload fails here
// as it would against a real store. Objects live as files under --data, written atomically.
// Node's standard library only: it starts before or without node_modules.
//
//   FAKE_PORT=4569 FAKE_S3_DIR=.data/s3/objects S3_FAKE_ACCESS_KEY_ID=… S3_FAKE_SECRET_ACCESS_KEY=… \
//     node scripts/lib/fakes/s3-server.mjs      (started by s3.mjs through detached.mjs)
import { createHash, createHmac, timingSafeEqual } from 'node:crypto';
import { createServer } from 'node:http';
import { existsSync, mkdirSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { crc32 } from 'node:zlib';

const port = Number(process.env.FAKE_PORT ?? 4569);
const dataDir = resolve(process.env.FAKE_S3_DIR ?? '.data/s3/objects');
const accessKeyId = process.env.S3_FAKE_ACCESS_KEY_ID;
const secretAccessKey = process.env.S3_FAKE_SECRET_ACCESS_KEY;
if (!accessKeyId || !secretAccessKey) {
  console.error('S3_FAKE_ACCESS_KEY_ID and S3_FAKE_SECRET_ACCESS_KEY must be set');
  process.exit(2);
}
// A signed request older or newer than this is refused, as S3 does (its limit is 15 minutes).
const MAX_CLOCK_SKEW_MS = 15 * 60_000;
// Larger bodies are refused before they are held in memory; our photos are at most 8 MB.
const MAX_OBJECT_BYTES = 64 * 1024 * 1024;
const BUCKET = /^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/;

mkdirSync(dataDir, { recursive: true });

const xml = (code, message, status) => ({
  status,
  headers: { 'content-type': 'application/xml' },
  body: `<?xml version="1.0" encoding="UTF-8"?>\n<Error><Code>${code}</Code><Message>${message}</Message></Error>`,
});

function send(res, { status, headers = {}, body }, head = false) {
  const payload = body === undefined ? Buffer.alloc(0) : Buffer.isBuffer(body) ? body : Buffer.from(body);
  res.writeHead(status, { 'content-length': String(payload.length), 'x-amz-request-id': 'tickover-fake', ...headers });
  res.end(head ? undefined : payload);
}

const hmac = (key, text) => createHmac('sha256', key).update(text).digest();
const sha256Hex = (data) => createHash('sha256').update(data).digest('hex');
// RFC 3986 unreserved characters stay; everything else is percent-encoded (SigV4 rules).
const uriEncode = (text) => encodeURIComponent(text).replace(/[!'()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);

function canonicalQuery(search) {
  if (!search) return '';
  return search
    .slice(1)
    .split('&')
    .filter(Boolean)
    .map((pair) => {
      const [k, v = ''] = pair.split('=');
      return [uriEncode(decodeURIComponent(k)), uriEncode(decodeURIComponent(v))];
    })
    .sort(([a, av], [b, bv]) => (a < b ? -1 : a > b ? 1 : av < bv ? -1 : av > bv ? 1 : 0))
    .map(([k, v]) => `${k}=${v}`)
    .join('&');
}

/** Checks the SigV4 Authorization header; returns an error answer or null. */
function verifySignature(req, path, search) {
  const auth = req.headers.authorization ?? '';
  const match = /^AWS4-HMAC-SHA256 Credential=([^/]+)\/(\d{8})\/([^/]+)\/s3\/aws4_request, ?SignedHeaders=([^,]+), ?Signature=([0-9a-f]{64})$/.exec(auth);
  if (!match) return xml('AccessDenied', 'Requests must be signed with AWS Signature Version 4.', 403);
  const [, keyId, date, region, signedHeaders, signature] = match;
  if (keyId !== accessKeyId) return xml('InvalidAccessKeyId', 'The access key id is not known here.', 403);
  const amzDate = req.headers['x-amz-date'] ?? '';
  const when = Date.parse(amzDate.replace(/^(\d{4})(\d{2})(\d{2})T(\d{2})(\d{2})(\d{2})Z$/, '$1-$2-$3T$4:$5:$6Z'));
  if (!Number.isFinite(when) || Math.abs(Date.now() - when) > MAX_CLOCK_SKEW_MS) {
    return xml('RequestTimeTooSkewed', 'The request time differs too much from the server time.', 403);
  }
  const headerLines = signedHeaders
    .split(';')
    .map((name) => `${name}:${String(req.headers[name] ?? '').trim().replace(/\s+/g, ' ')}\n`)
    .join('');
  const payloadHash = req.headers['x-amz-content-sha256'] ?? 'UNSIGNED-PAYLOAD';
  const canonical = [req.method, path, canonicalQuery(search), headerLines, signedHeaders, payloadHash].join('\n');
  const scope = `${date}/${region}/s3/aws4_request`;
  const toSign = ['AWS4-HMAC-SHA256', amzDate, scope, sha256Hex(canonical)].join('\n');
  const key = hmac(hmac(hmac(hmac(`AWS4${secretAccessKey}`, date), region), 's3'), 'aws4_request');
  const expected = hmac(key, toSign);
  if (!timingSafeEqual(expected, Buffer.from(signature, 'hex'))) {
    return xml('SignatureDoesNotMatch', 'The request signature does not match; check the secret key.', 403);
  }
  return null;
}

const objectFile = (bucket, key) => join(dataDir, bucket, `${Buffer.from(key).toString('base64url')}.bin`);
const metaFile = (bucket, key) => join(dataDir, bucket, `${Buffer.from(key).toString('base64url')}.json`);

function writeAtomically(file, data) {
  const temp = `${file}.${process.pid}.${Date.now()}.tmp`;
  writeFileSync(temp, data);
  renameSync(temp, file);
}

function putObject(req, bucket, key, body) {
  if (req.headers['content-encoding']?.includes('aws-chunked')) {
    return xml('NotImplemented', 'Chunked (streaming) uploads are not supported by this local store.', 501);
  }
  const declared = req.headers['x-amz-content-sha256'];
  if (declared && declared !== 'UNSIGNED-PAYLOAD' && declared !== sha256Hex(body)) {
    return xml('XAmzContentSHA256Mismatch', 'The body does not match its x-amz-content-sha256.', 400);
  }
  const crc = req.headers['x-amz-checksum-crc32'];
  const actualCrc = Buffer.alloc(4);
  actualCrc.writeUInt32BE(crc32(body) >>> 0);
  if (crc && crc !== actualCrc.toString('base64')) return xml('BadDigest', 'The body does not match its CRC32 checksum.', 400);
  const etag = `"${createHash('md5').update(body).digest('hex')}"`;
  writeAtomically(objectFile(bucket, key), body);
  const meta = { contentType: req.headers['content-type'] ?? 'application/octet-stream', etag, size: body.length, lastModified: new Date().toUTCString() };
  writeAtomically(metaFile(bucket, key), JSON.stringify(meta));
  return { status: 200, headers: { etag, 'x-amz-checksum-crc32': actualCrc.toString('base64') } };
}

function getObject(bucket, key) {
  if (!existsSync(metaFile(bucket, key))) return xml('NoSuchKey', 'The specified key does not exist.', 404);
  const meta = JSON.parse(readFileSync(metaFile(bucket, key), 'utf8'));
  return {
    status: 200,
    headers: { 'content-type': meta.contentType, etag: meta.etag, 'last-modified': meta.lastModified, 'accept-ranges': 'none' },
    body: readFileSync(objectFile(bucket, key)),
  };
}

function handle(req, body) {
  const url = new URL(req.url, 'http://fake');
  if (url.pathname === '/_tickover/health') return { status: 200, headers: { 'content-type': 'application/json' }, body: JSON.stringify({ service: 's3-fake', dataDir }) };
  const denied = verifySignature(req, url.pathname, url.search);
  if (denied) return denied;
  const [, bucket = '', ...rest] = url.pathname.split('/');
  const key = rest.map(decodeURIComponent).join('/');
  if (!BUCKET.test(bucket)) return xml('InvalidBucketName', 'The bucket name is not valid.', 400);
  const bucketDir = join(dataDir, bucket);
  if (!key) {
    if (req.method === 'PUT') {
      mkdirSync(bucketDir, { recursive: true });
      return { status: 200, headers: { location: `/${bucket}` } };
    }
    if (req.method === 'HEAD') return existsSync(bucketDir) && statSync(bucketDir).isDirectory() ? { status: 200 } : { status: 404 };
    return xml('NotImplemented', 'Only CreateBucket and HeadBucket are supported on a bucket.', 501);
  }
  if (!existsSync(bucketDir)) return xml('NoSuchBucket', 'The specified bucket does not exist.', 404);
  switch (req.method) {
    case 'PUT':
      return putObject(req, bucket, key, body);
    case 'GET':
    case 'HEAD':
      return getObject(bucket, key);
    case 'DELETE':
      rmSync(objectFile(bucket, key), { force: true });
      rmSync(metaFile(bucket, key), { force: true });
      return { status: 204 };
    default:
      return xml('NotImplemented', `${req.method} is not supported by this local store.`, 501);
  }
}

const server = createServer((req, res) => {
  const chunks = [];
  let size = 0;
  req.on('data', (chunk) => {
    size += chunk.length;
    if (size > MAX_OBJECT_BYTES) {
      send(res, xml('EntityTooLarge', 'The object is larger than this local store accepts.', 400));
      req.destroy();
    } else chunks.push(chunk);
  });
  req.on('end', () => {
    try {
      send(res, handle(req, Buffer.concat(chunks)), req.method === 'HEAD');
    } catch (error) {
      console.error(error);
      send(res, xml('InternalError', 'The local store failed; see its log.', 500));
    }
  });
});
server.listen(port, '127.0.0.1', () => console.log(`s3 fake listening on 127.0.0.1:${port}, data in ${dataDir}`));
for (const signal of ['SIGTERM', 'SIGINT']) process.on(signal, () => server.close(() => process.exit(0)));
