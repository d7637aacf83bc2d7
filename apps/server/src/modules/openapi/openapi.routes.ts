import { z } from 'zod';
import { defineRoute, type ApiRoute } from '../../lib/route-table';
import { version } from '../../version';
import { buildOpenApiDocument, type OpenApiDocument } from './openapi-document';

export const openApiPath = '/api/openapi.json';

const documentShape = z.looseObject({
  openapi: z.string(),
  info: z.looseObject({ title: z.string(), version: z.string() }),
  paths: z.record(z.string(), z.unknown()),
});

/**
 * `GET /api/openapi.json`: the API document, built from the route table at the first request
 * and kept for the life of the process. Public: it describes the API, not the lab's data.
 */
export function openApiRoutes(table: () => ApiRoute[]) {
  let document: OpenApiDocument | null = null;
  return [
    defineRoute({
      method: 'get',
      path: openApiPath,
      access: 'public',
      summary: 'This document: the API as OpenAPI 3.1',
      response: { description: 'The OpenAPI 3.1 document.', schema: documentShape },
      handle: ({ res }) => {
        document ??= buildOpenApiDocument(table(), version);
        res.json(document);
      },
    }),
  ];
}
