import { useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../lib/api-client';

/** Where the server answers its OpenAPI 3.1 document. */
export const openApiUrl = '/api/openapi.json';

const methods = ['get', 'post', 'put', 'patch', 'delete'] as const;

const operationSchema = z.looseObject({
  summary: z.string().optional(),
  tags: z.array(z.string()).optional(),
  'x-lotwise-access': z.string().optional(),
});

/** The parts of the API document the help page reads. */
export const openApiDocumentSchema = z.looseObject({
  openapi: z.string(),
  info: z.looseObject({ title: z.string(), version: z.string() }),
  paths: z.record(
    z.string(),
    z.looseObject(Object.fromEntries(methods.map((m) => [m, operationSchema.optional()]))),
  ),
});
export type OpenApiDocument = z.infer<typeof openApiDocumentSchema>;

export interface ApiOperation {
  method: (typeof methods)[number];
  path: string;
  summary: string;
  tag: string;
  /** `public`, `signed-in` or a permission such as `stock.draw`. */
  access: string;
}

/** Every operation of the document, in path order (methods in the order GET, POST, PUT, PATCH, DELETE). */
export function operationsOf(document: OpenApiDocument): ApiOperation[] {
  return Object.entries(document.paths)
    .sort(([a], [b]) => a.localeCompare(b))
    .flatMap(([path, item]) =>
      methods.flatMap((method) => {
        const operation = item[method] as z.infer<typeof operationSchema> | undefined;
        if (!operation) return [];
        return [
          {
            method,
            path,
            summary: operation.summary ?? '',
            tag: operation.tags?.[0] ?? 'other',
            access: operation['x-lotwise-access'] ?? 'signed-in',
          },
        ];
      }),
    );
}

/** The server's API document (it changes only with a new version of Lotwise). */
export function useOpenApiDocument() {
  return useQuery({
    queryKey: ['openapi'],
    queryFn: ({ signal }) => api.get(openApiUrl, openApiDocumentSchema, signal),
    staleTime: Infinity,
  });
}
