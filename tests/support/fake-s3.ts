/**
 * A tiny S3-compatible server on 127.0.0.1 for tests: path-style PutObject, GetObject, HeadObject,
 * DeleteObject and ListObjectsV2 (with continuation tokens) on one bucket, kept in memory. It checks
 * that requests are signed (AWS4) but does not verify signatures.
 */
import { createHash } from 'node:crypto';
import http from 'node:http';
import type { AddressInfo } from 'node:net';

export interface FakeObject {
  body: Buffer;
  contentType: string;
  /** Set on PUT; a test may move it back to make an object look old. Listings report it. */
  lastModified?: Date;
}

export interface FakeS3Options {
  /** Most keys one listing page returns, whatever max-keys asks for (S3 itself: 1000). */
  readonly pageSize?: number;
}

export interface FakeS3 {
  readonly endpoint: string;
  readonly bucket: string;
  readonly objects: Map<string, FakeObject>;
  /** Every request seen: method and path. */
  readonly requests: Array<{ method: string; path: string; authorization: string }>;
  close(): Promise<void>;
}

function xmlError(res: http.ServerResponse, status: number, code: string, message: string): void {
  const body = `<?xml version="1.0" encoding="UTF-8"?><Error><Code>${code}</Code><Message>${message}</Message></Error>`;
  res.writeHead(status, { 'Content-Type': 'application/xml', 'Content-Length': Buffer.byteLength(body), 'x-amz-request-id': 'fake' });
  res.end(body);
}

function xmlText(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

/** The ListObjectsV2 answer: keys in UTF-8 binary order after the continuation token, one page. */
function listObjects(res: http.ServerResponse, bucket: string, objects: Map<string, FakeObject>, query: URLSearchParams, pageSize: number): void {
  const prefix = query.get('prefix') ?? '';
  const asked = query.get('max-keys');
  const maxKeys = Math.min(pageSize, asked !== null && /^\d+$/.test(asked) ? Number(asked) : 1000);
  const token = query.get('continuation-token');
  const after = token !== null ? Buffer.from(token, 'base64url').toString('utf8') : (query.get('start-after') ?? '');
  const urlEncoded = query.get('encoding-type') === 'url';
  const keys = [...objects.keys()].filter((k) => k.startsWith(prefix) && Buffer.compare(Buffer.from(k), Buffer.from(after)) > 0).sort((a, b) => Buffer.compare(Buffer.from(a), Buffer.from(b)));
  const page = keys.slice(0, maxKeys);
  const truncated = page.length > 0 && keys.length > page.length;
  const name = (k: string) => xmlText(urlEncoded ? encodeURIComponent(k).replace(/%2F/g, '/') : k);
  const contents = page
    .map((k) => {
      const o = objects.get(k)!;
      return `<Contents><Key>${name(k)}</Key><LastModified>${(o.lastModified ?? new Date()).toISOString()}</LastModified><ETag>&quot;${createHash('md5').update(o.body).digest('hex')}&quot;</ETag><Size>${o.body.length}</Size><StorageClass>STANDARD</StorageClass></Contents>`;
    })
    .join('');
  const body =
    `<?xml version="1.0" encoding="UTF-8"?><ListBucketResult xmlns="http://s3.amazonaws.com/doc/2006-03-01/">` +
    `<Name>${xmlText(bucket)}</Name><Prefix>${name(prefix)}</Prefix><KeyCount>${page.length}</KeyCount><MaxKeys>${maxKeys}</MaxKeys>` +
    (urlEncoded ? '<EncodingType>url</EncodingType>' : '') +
    `<IsTruncated>${truncated}</IsTruncated>` +
    (token !== null ? `<ContinuationToken>${xmlText(token)}</ContinuationToken>` : '') +
    (truncated ? `<NextContinuationToken>${Buffer.from(page[page.length - 1]!).toString('base64url')}</NextContinuationToken>` : '') +
    `${contents}</ListBucketResult>`;
  res.writeHead(200, { 'Content-Type': 'application/xml', 'Content-Length': Buffer.byteLength(body), 'x-amz-request-id': 'fake' });
  res.end(body);
}

/** Starts the fake on a free loopback port. */
export async function startFakeS3(bucket = 'slantwise-test', options: FakeS3Options = {}): Promise<FakeS3> {
  const objects = new Map<string, FakeObject>();
  const requests: FakeS3['requests'] = [];
  const server = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (c: Buffer) => chunks.push(c));
    req.on('end', () => {
      const url = new URL(req.url ?? '/', 'http://fake');
      const path = decodeURIComponent(url.pathname);
      const authorization = String(req.headers['authorization'] ?? '');
      requests.push({ method: req.method ?? '', path, authorization });
      if (!authorization.startsWith('AWS4-HMAC-SHA256 ')) return xmlError(res, 403, 'AccessDenied', 'Unsigned request');
      if (req.method === 'GET' && (path === `/${bucket}` || path === `/${bucket}/`) && url.searchParams.get('list-type') === '2') {
        return listObjects(res, bucket, objects, url.searchParams, options.pageSize ?? 1000);
      }
      const prefix = `/${bucket}/`;
      if (!path.startsWith(prefix)) return xmlError(res, 404, 'NoSuchBucket', 'The bucket does not exist');
      const key = path.slice(prefix.length);
      const found = objects.get(key);
      switch (req.method) {
        case 'PUT': {
          if (String(req.headers['content-encoding'] ?? '').includes('aws-chunked')) return xmlError(res, 400, 'NotImplemented', 'aws-chunked is not supported by the fake');
          const body = Buffer.concat(chunks);
          objects.set(key, { body, contentType: String(req.headers['content-type'] ?? 'application/octet-stream'), lastModified: new Date() });
          res.writeHead(200, { ETag: `"${createHash('md5').update(body).digest('hex')}"` });
          return res.end();
        }
        case 'GET':
        case 'HEAD': {
          if (!found) {
            if (req.method === 'HEAD') {
              res.writeHead(404);
              return res.end();
            }
            return xmlError(res, 404, 'NoSuchKey', 'The specified key does not exist.');
          }
          res.writeHead(200, {
            'Content-Type': found.contentType,
            'Content-Length': found.body.length,
            ETag: `"${createHash('md5').update(found.body).digest('hex')}"`,
            'Last-Modified': new Date().toUTCString(),
          });
          return res.end(req.method === 'GET' ? found.body : undefined);
        }
        case 'DELETE':
          objects.delete(key);
          res.writeHead(204);
          return res.end();
        default:
          return xmlError(res, 405, 'MethodNotAllowed', 'Not supported by the fake');
      }
    });
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  return {
    endpoint: `http://127.0.0.1:${port}`,
    bucket,
    objects,
    requests,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
