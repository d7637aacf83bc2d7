import type { Express } from 'express';
import { openApiPath, type OpenApiDocument } from './openapi-document';

interface Layer {
  route?: { path: string | string[]; methods: Record<string, boolean> };
  handle?: { stack?: Layer[] };
}

/**
 * Every `METHOD /path` Express really answers, read from the app's router stack (routes
 * registered with `app.get(…)` and the like, also inside routers mounted with `app.use`),
 * with `:param` written as the API document writes it (`{param}`).
 */
export function mountedOperations(app: Express): string[] {
  const found: string[] = [];
  const walk = (stack: Layer[]) => {
    for (const layer of stack) {
      if (layer.route) {
        const paths = Array.isArray(layer.route.path) ? layer.route.path : [layer.route.path];
        for (const path of paths) {
          for (const method of Object.keys(layer.route.methods)) {
            if (method !== '_all') found.push(`${method.toUpperCase()} ${openApiPath(path)}`);
          }
        }
      } else if (layer.handle?.stack) {
        // A router mounted with app.use: its routes answer too. (Its mount path is not kept
        // by Express 5 in a readable form; Lotwise mounts none, so the walk only notices one.)
        walk(layer.handle.stack);
      }
    }
  };
  walk((app.router as unknown as { stack: Layer[] }).stack);
  return found;
}

/** Every `METHOD /path` the document describes. */
export function documentedOperations(document: OpenApiDocument): string[] {
  return Object.entries(document.paths ?? {}).flatMap(([path, item]) =>
    ['get', 'put', 'post', 'delete', 'patch', 'options', 'head', 'trace']
      .filter((method) => (item as Record<string, unknown>)[method] !== undefined)
      .map((method) => `${method.toUpperCase()} ${path}`),
  );
}

/** The routes Express answers that the document lacks (empty when the document is whole). */
export function undocumentedRoutes(app: Express, document: OpenApiDocument): string[] {
  const documented = new Set(documentedOperations(document));
  return [...new Set(mountedOperations(app))]
    .filter((operation) => !documented.has(operation))
    .sort();
}
