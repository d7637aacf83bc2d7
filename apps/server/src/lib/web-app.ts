import { existsSync } from 'node:fs';
import path from 'node:path';
import compression from 'compression';
import express, { type Express, type Request, type Response } from 'express';

/** A year: the longest a browser is asked to keep a file whose name changes with its content. */
const immutable = 'public, max-age=31536000, immutable';

/**
 * gzip or brotli (whichever the browser prefers) for the API's JSON and the web app's files.
 * Left alone: requests to `skipPaths` (the payment webhook, verified over its exact bytes)
 * and event streams, which must reach the browser as each event is written.
 */
export function compressAnswers(skipPaths: string[]) {
  return compression({
    filter: (req: Request, res: Response) => {
      if (skipPaths.includes(req.path)) return false;
      const type = String(res.getHeader('Content-Type') ?? '');
      if (type.startsWith('text/event-stream')) return false;
      return compression.filter(req, res);
    },
  });
}

/**
 * Serves the built web app when `dist/index.html` exists: static files, and index.html for
 * any other GET outside `/api` so the client-side router can take over. Answers whether it
 * is serving.
 *
 * Vite names every file under `assets/` after a hash of its content, so the browser keeps
 * those for a year without asking again; index.html (which names the current files) is
 * revalidated on every visit, so a new build is picked up at the next page load.
 */
export function serveWebApp(app: Express, dist: string): boolean {
  const index = path.join(dist, 'index.html');
  if (!existsSync(index)) return false;
  const assets = path.join(path.resolve(dist), 'assets') + path.sep;
  app.use(
    express.static(dist, {
      index: false,
      maxAge: '1h',
      setHeaders: (res, file) => {
        if (file.startsWith(assets)) res.setHeader('Cache-Control', immutable);
        else if (file === index) res.setHeader('Cache-Control', 'no-cache');
      },
    }),
  );
  app.use((req, res, next) => {
    const isApi = req.path === '/api' || req.path.startsWith('/api/');
    if ((req.method !== 'GET' && req.method !== 'HEAD') || isApi) return next();
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index);
  });
  return true;
}
