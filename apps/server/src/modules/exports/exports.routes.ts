import { chemicalListQuerySchema, containerListQuerySchema } from '@lotwise/shared';
import { defineRoute } from '../../lib/route-table';
import type { ExportsService } from './exports.service';

export function exportRoutes(exports: ExportsService) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/exports/containers.csv',
      access: 'stock.read',
      // The containers list's filters and sort; page and pageSize are ignored (all rows).
      query: containerListQuerySchema,
      handle: async ({ query, res }) => {
        await exports.containersCsv(query, res);
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/exports/chemicals.csv',
      access: 'chemicals.read',
      query: chemicalListQuerySchema,
      handle: async ({ query, res }) => {
        await exports.chemicalsCsv(query, res);
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/exports/stock-import-template.csv',
      access: 'stock.read',
      handle: ({ res }) => {
        exports.templateCsv(res);
      },
    }),
  ];
}
