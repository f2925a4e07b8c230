import express, { type Router } from 'express';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { matchRoute, readRouteTable, type ExportedRoute } from './route-table';

/**
 * Serves the static web export: assets as files, pages through the export's
 * route table (so dynamic routes such as /networks/12 find their HTML), and
 * anything unknown as the exported not-found page with a real 404 (sending
 * index.html instead would make the client hydrate the wrong page).
 */
export function webRouter(webRoot: string): Router {
  const router = express.Router();
  const notFound = path.join(webRoot, '+not-found.html');
  let routes: ExportedRoute[] | null = null;
  router.use(express.static(webRoot, { index: false, redirect: false, maxAge: '1h' }));
  router.use((req, res) => {
    if (req.method !== 'GET' && req.method !== 'HEAD') {
      res.status(404).type('text/plain').send('Not found');
      return;
    }
    if (!existsSync(webRoot)) {
      res.status(503).type('text/plain').send('The web build is missing: run npm run build:web');
      return;
    }
    routes ??= readRouteTable(webRoot);
    const file = matchRoute(routes, decodeURIComponent(req.path));
    if (file) res.sendFile(file, { dotfiles: 'allow', headers: { 'Cache-Control': 'no-cache' } });
    else if (existsSync(notFound)) res.status(404).sendFile(notFound, { dotfiles: 'allow' });
    else res.status(404).type('text/plain').send('Not found');
  });
  return router;
}
