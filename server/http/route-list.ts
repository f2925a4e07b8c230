import type { Router } from 'express';

export interface ListedRoute {
  method: string;
  path: string;
}

interface StackLayer {
  route?: { path: string | string[]; methods: Record<string, boolean> };
  handle?: { stack?: StackLayer[] };
  rawPath?: string | string[];
  slash?: boolean;
}

/**
 * Every route a router really answers, found by walking Express's own stack
 * (nested routers included, with their mount paths), so a test can compare
 * the live routes with a written list and notice one that is missing.
 */
export function listRoutes(router: Router, prefix = ''): ListedRoute[] {
  const found: ListedRoute[] = [];
  for (const layer of (router as unknown as { stack: StackLayer[] }).stack) {
    if (layer.route) {
      const paths = Array.isArray(layer.route.path) ? layer.route.path : [layer.route.path];
      for (const p of paths) {
        for (const [method, on] of Object.entries(layer.route.methods)) {
          if (on && method !== '_all') found.push({ method: method.toUpperCase(), path: prefix + p });
        }
      }
    } else if (layer.handle?.stack) {
      const mount = layer.slash || !layer.rawPath || Array.isArray(layer.rawPath) ? '' : layer.rawPath;
      found.push(...listRoutes(layer.handle as unknown as Router, prefix + (mount === '/' ? '' : mount)));
    }
  }
  return found;
}
