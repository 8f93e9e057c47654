/**
 * The app's route table, read from Express itself: every method and path of every route in every
 * mounted router. The role matrix is generated from it, so a new route cannot go unlisted.
 */
import type { Express } from 'express';

interface LayerLike {
  rawPath?: string | string[];
  route?: { path: string; methods: Record<string, boolean> };
  handle?: { stack?: LayerLike[] };
}

export interface RouteEntry {
  method: string;
  path: string;
}

function walk(stack: LayerLike[], prefix: string, out: RouteEntry[]): void {
  for (const layer of stack) {
    if (layer.route) {
      for (const method of Object.keys(layer.route.methods).filter((m) => m !== '_all')) {
        out.push({ method: method.toUpperCase(), path: `${prefix}${layer.route.path === '/' ? '' : layer.route.path}` || '/' });
      }
    } else if (layer.handle?.stack) {
      const mount = typeof layer.rawPath === 'string' && layer.rawPath !== '/' ? layer.rawPath : '';
      walk(layer.handle.stack, `${prefix}${mount}`, out);
    }
  }
}

/** "GET /api/filings/:id" and so on, for every API route (the web app's catch-all excluded). */
export function apiRouteTable(app: Express): string[] {
  const out: RouteEntry[] = [];
  walk((app as unknown as { router: { stack: LayerLike[] } }).router.stack, '', out);
  return [...new Set(out.filter((r) => r.path.startsWith('/api/')).map((r) => `${r.method} ${r.path}`))].sort();
}
