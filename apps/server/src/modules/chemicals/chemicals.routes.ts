import {
  chemicalCreateBodySchema,
  chemicalListQuerySchema,
  chemicalPatchBodySchema,
  chemicalSchema,
  pageSchema,
} from '@lotwise/shared';
import { idParamsSchema } from '../../lib/validate';
import { defineRoute } from '../../lib/route-table';
import type { ChemicalsService } from './chemicals.service';

export function chemicalRoutes(chemicals: ChemicalsService) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/chemicals',
      access: 'chemicals.read',
      summary: 'List chemicals (search, filter by hazard and storage group)',
      response: { schema: pageSchema(chemicalSchema) },
      query: chemicalListQuerySchema,
      handle: async ({ query, res }) => {
        res.json(await chemicals.list(query));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/chemicals',
      access: 'chemicals.write',
      summary: 'Add a chemical',
      response: { status: 201, schema: chemicalSchema },
      body: chemicalCreateBodySchema,
      handle: async ({ body, res }) => {
        res.status(201).json(await chemicals.create(body));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/chemicals/:id',
      access: 'chemicals.read',
      summary: 'Read a chemical with its hazards',
      response: { schema: chemicalSchema },
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await chemicals.get(params.id));
      },
    }),
    defineRoute({
      method: 'patch',
      path: '/api/chemicals/:id',
      access: 'chemicals.write',
      summary: 'Change a chemical',
      response: { schema: chemicalSchema },
      params: idParamsSchema,
      body: chemicalPatchBodySchema,
      handle: async ({ params, body, res }) => {
        res.json(await chemicals.update(params.id, body));
      },
    }),
    defineRoute({
      method: 'delete',
      path: '/api/chemicals/:id',
      access: 'chemicals.write',
      summary: 'Delete a chemical that has no stock',
      response: { status: 204 },
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        await chemicals.remove(params.id);
        res.status(204).end();
      },
    }),
  ];
}
