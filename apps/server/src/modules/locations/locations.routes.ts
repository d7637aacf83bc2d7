import {
  locationCreateSchema,
  locationListQuerySchema,
  locationPatchSchema,
} from '@lotwise/shared';
import { idParamsSchema } from '../../lib/validate';
import { defineRoute } from '../../lib/route-table';
import type { LocationsService } from './locations.service';

export function locationRoutes(locations: LocationsService) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/locations',
      access: 'stock.read',
      query: locationListQuerySchema,
      handle: async ({ query, res }) => {
        res.json(await locations.list(query));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/locations',
      access: 'stock.write',
      body: locationCreateSchema,
      handle: async ({ body, res }) => {
        res.status(201).json(await locations.create(body));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/locations/:id',
      access: 'stock.read',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await locations.get(params.id));
      },
    }),
    defineRoute({
      method: 'patch',
      path: '/api/locations/:id',
      access: 'stock.write',
      params: idParamsSchema,
      body: locationPatchSchema,
      handle: async ({ params, body, res }) => {
        res.json(await locations.update(params.id, body));
      },
    }),
    defineRoute({
      method: 'delete',
      path: '/api/locations/:id',
      access: 'stock.write',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        await locations.remove(params.id);
        res.status(204).end();
      },
    }),
  ];
}
