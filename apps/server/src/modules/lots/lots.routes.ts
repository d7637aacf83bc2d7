import { lotCreateSchema, lotListQuerySchema, lotPatchSchema } from '@lotwise/shared';
import { idParamsSchema } from '../../lib/validate';
import { defineRoute } from '../../lib/route-table';
import type { LotsService } from './lots.service';

export function lotRoutes(lots: LotsService) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/lots',
      access: 'stock.read',
      query: lotListQuerySchema,
      handle: async ({ query, res }) => {
        res.json(await lots.list(query));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/lots',
      access: 'stock.write',
      body: lotCreateSchema,
      handle: async ({ body, res }) => {
        res.status(201).json(await lots.create(body));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/lots/:id',
      access: 'stock.read',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await lots.get(params.id));
      },
    }),
    defineRoute({
      method: 'patch',
      path: '/api/lots/:id',
      access: 'stock.write',
      params: idParamsSchema,
      body: lotPatchSchema,
      handle: async ({ params, body, res }) => {
        res.json(await lots.update(params.id, body));
      },
    }),
    defineRoute({
      method: 'delete',
      path: '/api/lots/:id',
      access: 'stock.write',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        await lots.remove(params.id);
        res.status(204).end();
      },
    }),
  ];
}
