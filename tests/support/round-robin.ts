/**
 * A minimal round-robin HTTP load balancer on loopback for scale-out tests: each request goes to
 * the next instance, with X-Forwarded-For and X-Forwarded-Proto set as a TLS-terminating proxy would.
 */
import http from 'node:http';
import type { AddressInfo } from 'node:net';

export interface Balancer {
  readonly url: string;
  /** How many requests each instance received, in instance order. */
  readonly hits: number[];
  close(): Promise<void>;
}

export async function startRoundRobin(targets: readonly string[], proto = 'https'): Promise<Balancer> {
  const hits = targets.map(() => 0);
  let next = 0;
  const server = http.createServer((req, res) => {
    const i = next++ % targets.length;
    hits[i]!++;
    const target = new URL(targets[i]!);
    const upstream = http.request(
      {
        host: target.hostname,
        port: target.port,
        method: req.method,
        path: req.url,
        headers: { ...req.headers, 'x-forwarded-for': req.socket.remoteAddress ?? '127.0.0.1', 'x-forwarded-proto': proto },
      },
      (up) => {
        res.writeHead(up.statusCode ?? 502, up.headers);
        up.pipe(res);
      },
    );
    upstream.on('error', () => {
      res.writeHead(502, { 'content-type': 'application/json' });
      res.end(JSON.stringify({ error: 'upstream down' }));
    });
    req.pipe(upstream);
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}`,
    hits,
    close: () => new Promise<void>((resolve) => {
      server.closeAllConnections();
      server.close(() => resolve());
    }),
  };
}
