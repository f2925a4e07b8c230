import { readdirSync, statSync } from 'node:fs';
import path from 'node:path';

export interface ExportedRoute {
  pattern: RegExp;
  file: string;
  /** Static segments win over dynamic ones, as in the client router. */
  rank: number;
}

/**
 * Maps the HTML files of a static Expo Router export to URL patterns:
 * `networks/index.html` → /networks, `networks/[networkId].html` →
 * /networks/<anything>, group folders such as `(app)` vanish from the URL.
 */
export function readRouteTable(webRoot: string): ExportedRoute[] {
  const routes: ExportedRoute[] = [];
  const visit = (dir: string, rel: string[]) => {
    for (const name of readdirSync(dir)) {
      const full = path.join(dir, name);
      if (statSync(full).isDirectory()) {
        if (name === '_expo' || name === 'assets') continue;
        visit(full, [...rel, name]);
      } else if (name.endsWith('.html') && !name.startsWith('+') && !name.startsWith('_')) {
        const segments = [...rel, name.slice(0, -5)].filter((s) => !/^\(.*\)$/.test(s));
        if (segments[segments.length - 1] === 'index') segments.pop();
        routes.push(toRoute(segments, full));
      }
    }
  };
  visit(webRoot, []);
  return routes.sort((a, b) => b.rank - a.rank);
}

function toRoute(segments: string[], file: string): ExportedRoute {
  let rank = 0;
  const parts = segments.map((s) => {
    if (/^\[\.\.\..+\]$/.test(s)) return '(?:/.+)';
    if (/^\[.+\]$/.test(s)) {
      rank += 1;
      return '/[^/]+';
    }
    rank += 100;
    return '/' + s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
  });
  return { pattern: new RegExp(`^${parts.join('') || '/'}/?$`), file, rank };
}

export function matchRoute(routes: ExportedRoute[], urlPath: string): string | null {
  const found = routes.find((r) => r.pattern.test(urlPath));
  return found ? found.file : null;
}
