import { existsSync } from 'node:fs';
import path from 'node:path';
import express, { type Express } from 'express';

/**
 * Serves the built web app when `dist/index.html` exists: static files, and index.html for
 * any other GET outside `/api` so the client-side router can take over. Answers whether it
 * is serving.
 */
export function serveWebApp(app: Express, dist: string): boolean {
  const index = path.join(dist, 'index.html');
  if (!existsSync(index)) return false;
  app.use(express.static(dist, { index: false, maxAge: '1h' }));
  app.use((req, res, next) => {
    const isApi = req.path === '/api' || req.path.startsWith('/api/');
    if ((req.method !== 'GET' && req.method !== 'HEAD') || isApi) return next();
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index);
  });
  return true;
}
