/**
 * Lists every route of the Express app by walking its router: Express 5's layers keep the path
 * they were mounted at (`rawPath`), so nested routers give their full path.
 */
import type { Express } from 'express';

export interface RouteInfo {
  readonly method: string;
  readonly path: string;
}

interface LayerLike {
  rawPath?: string | string[];
  route?: { path: string | string[]; methods: Record<string, boolean> };
  handle?: { stack?: LayerLike[] };
}

function joinPath(prefix: string, part: string): string {
  const joined = `${prefix}/${part}`.replace(/\/+/g, '/');
  return joined.length > 1 ? joined.replace(/\/$/, '') : joined;
}

function walk(stack: LayerLike[], prefix: string, out: RouteInfo[]): void {
  for (const layer of stack) {
    if (layer.route) {
      const paths = Array.isArray(layer.route.path) ? layer.route.path : [layer.route.path];
      for (const p of paths) {
        for (const [method, on] of Object.entries(layer.route.methods)) {
          if (on && method !== '_all') out.push({ method: method.toUpperCase(), path: joinPath(prefix, p) });
        }
      }
    } else if (layer.handle?.stack) {
      const raw = Array.isArray(layer.rawPath) ? layer.rawPath[0] : layer.rawPath;
      walk(layer.handle.stack, joinPath(prefix, raw ?? ''), out);
    }
  }
}

/** Every (method, path) the app answers under /api, sorted, without duplicates. */
export function apiRoutes(app: Express): RouteInfo[] {
  const out: RouteInfo[] = [];
  const router = (app as unknown as { router: { stack: LayerLike[] } }).router;
  walk(router.stack, '', out);
  const seen = new Set<string>();
  return out
    .filter((r) => r.path.startsWith('/api/'))
    .filter((r) => {
      const key = `${r.method} ${r.path}`;
      if (seen.has(key)) return false;
      seen.add(key);
      return true;
    })
    .sort((a, b) => (a.path === b.path ? a.method.localeCompare(b.method) : a.path.localeCompare(b.path)));
}
