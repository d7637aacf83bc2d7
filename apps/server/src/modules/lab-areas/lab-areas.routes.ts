import {
  labAreaCreateSchema,
  labAreaDetailSchema,
  labAreaPatchSchema,
  labAreaSchema,
} from '@lotwise/shared';
import { z } from 'zod';
import { idParamsSchema } from '../../lib/validate';
import { defineRoute } from '../../lib/route-table';
import type { LabAreasService } from './lab-areas.service';

export function labAreaRoutes(labAreas: LabAreasService) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/lab-areas',
      access: 'stock.read',
      summary: 'List the lab areas with their flammable-liquid limits against what they hold',
      response: { schema: z.object({ items: z.array(labAreaSchema) }) },
      handle: async ({ res }) => {
        res.json(await labAreas.list());
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/lab-areas',
      access: 'stock.write',
      summary: 'Mark a place as a lab area (lab unit or control area)',
      response: { status: 201, schema: labAreaDetailSchema },
      body: labAreaCreateSchema,
      handle: async ({ body, res }) => {
        res.status(201).json(await labAreas.create(body));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/lab-areas/:id',
      access: 'stock.read',
      summary:
        'Read a lab area: its limits with their working, litres per class and the containers counted',
      response: { schema: labAreaDetailSchema },
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await labAreas.get(params.id));
      },
    }),
    defineRoute({
      method: 'patch',
      path: '/api/lab-areas/:id',
      access: 'stock.write',
      summary: 'Change a lab area’s class, floor area, storey or rule sets',
      response: { schema: labAreaDetailSchema },
      params: idParamsSchema,
      body: labAreaPatchSchema,
      handle: async ({ params, body, res }) => {
        res.json(await labAreas.update(params.id, body));
      },
    }),
    defineRoute({
      method: 'delete',
      path: '/api/lab-areas/:id',
      access: 'stock.write',
      summary: 'Unmark a lab area (the place and its containers stay)',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        await labAreas.remove(params.id);
        res.status(204).end();
      },
    }),
  ];
}
