/**
 * A tiny S3-compatible server on 127.0.0.1 for tests: path-style PutObject, GetObject, HeadObject
 * and DeleteObject on one bucket, kept in memory. It checks that requests are signed (AWS4) but
 * does not verify signatures.
 */
import { createHash } from 'node:crypto';
import http from 'node:http';
import type { AddressInfo } from 'node:net';

export interface FakeObject {
  body: Buffer;
  contentType: string;
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

/** Starts the fake on a free loopback port. */
export async function startFakeS3(bucket = 'slantwise-test'): Promise<FakeS3> {
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
      const prefix = `/${bucket}/`;
      if (!path.startsWith(prefix)) return xmlError(res, 404, 'NoSuchBucket', 'The bucket does not exist');
      const key = path.slice(prefix.length);
      const found = objects.get(key);
      switch (req.method) {
        case 'PUT': {
          if (String(req.headers['content-encoding'] ?? '').includes('aws-chunked')) return xmlError(res, 400, 'NotImplemented', 'aws-chunked is not supported by the fake');
          const body = Buffer.concat(chunks);
          objects.set(key, { body, contentType: String(req.headers['content-type'] ?? 'application/octet-stream') });
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
