import { existsSync } from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';
import compression from 'compression';
import express, { type Express, type NextFunction, type Request, type Response } from 'express';

/** A year: the longest a browser is asked to keep a file whose name changes with its content. */
const immutable = 'public, max-age=31536000, immutable';

/**
 * gzip or brotli (whichever the browser prefers) for the API's JSON and the web app's files.
 * Left alone: requests to `skipPaths` (the payment webhook, verified over its exact bytes)
 * and event streams, which must reach the browser as each event is written.
 *
 * API answers are compressed at the fastest levels (brotli quality 1, gzip level 1): they are
 * made for one request, and on a small server a page of 50 containers took 2–8 ms at the
 * default levels against 0.2–0.3 ms, for answers about a fifth larger. The web app's files are
 * fetched once per version and kept a year, so they get the default levels.
 */
export function compressAnswers(skipPaths: string[]) {
  const filter = (req: Request, res: Response) => {
    if (skipPaths.includes(req.path)) return false;
    const type = String(res.getHeader('Content-Type') ?? '');
    if (type.startsWith('text/event-stream')) return false;
    return compression.filter(req, res);
  };
  const fast = compression({
    filter,
    level: 1,
    brotli: { params: { [zlib.constants.BROTLI_PARAM_QUALITY]: 1 } },
  });
  const thorough = compression({ filter });
  return (req: Request, res: Response, next: NextFunction) =>
    (req.path.startsWith('/api/') ? fast : thorough)(req, res, next);
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
