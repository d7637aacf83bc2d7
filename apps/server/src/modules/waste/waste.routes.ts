import {
  wasteAdditionCreateSchema,
  wasteAreaPutSchema,
  wasteAreaSchema,
  wasteContainerCreateSchema,
  wasteContainerDetailSchema,
  wasteContainerListQuerySchema,
  wasteContainerPatchSchema,
  wasteContainerSchema,
  wastePickupCreateSchema,
  wastePickupSchema,
} from '@lotwise/shared';
import { z } from 'zod';
import { defineRoute } from '../../lib/route-table';
import { idParamsSchema } from '../../lib/validate';
import type { WasteService } from './waste.service';

const locationParamsSchema = z.object({
  locationId: idParamsSchema.shape.id,
});

export function wasteRoutes(waste: WasteService) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/waste-containers',
      access: 'stock.read',
      summary:
        'List waste containers (open ones unless a status is given), optionally only those a set of chemicals may go into',
      response: { schema: z.array(wasteContainerSchema) },
      query: wasteContainerListQuerySchema,
      handle: async ({ query, res }) => {
        res.json(await waste.list({ ...query, status: query.status ?? 'open' }));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/waste-containers',
      access: 'stock.write',
      summary: 'Add a waste container',
      response: { status: 201, schema: wasteContainerDetailSchema },
      body: wasteContainerCreateSchema,
      handle: async ({ body, res }) => {
        res.status(201).json(await waste.create(body));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/waste-containers/:id',
      access: 'stock.read',
      summary: 'Read a waste container with what went into it',
      response: { schema: wasteContainerDetailSchema },
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await waste.get(params.id));
      },
    }),
    defineRoute({
      method: 'patch',
      path: '/api/waste-containers/:id',
      access: 'stock.write',
      summary: 'Change a waste container (title, place, characteristics, open or full)',
      response: { schema: wasteContainerDetailSchema },
      params: idParamsSchema,
      body: wasteContainerPatchSchema,
      handle: async ({ params, body, res }) => {
        res.json(await waste.update(params.id, body));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/waste-containers/:id/additions',
      access: 'stock.draw',
      summary: 'Record what went into a waste container',
      response: { status: 201, schema: wasteContainerDetailSchema },
      params: idParamsSchema,
      body: wasteAdditionCreateSchema,
      handle: async ({ params, body, res, actor }) => {
        res.status(201).json(await waste.addTo(params.id, body, actor()));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/waste-areas',
      access: 'stock.read',
      summary: 'List waste accumulation areas with their totals against the limits',
      response: { schema: z.array(wasteAreaSchema) },
      handle: async ({ res }) => {
        res.json(await waste.areas());
      },
    }),
    defineRoute({
      method: 'put',
      path: '/api/waste-areas/:locationId',
      access: 'stock.write',
      summary: 'Mark a place as a waste accumulation area',
      response: { schema: z.array(wasteAreaSchema) },
      params: locationParamsSchema,
      body: wasteAreaPutSchema,
      handle: async ({ params, body, res }) => {
        res.json(await waste.setArea(params.locationId, body));
      },
    }),
    defineRoute({
      method: 'delete',
      path: '/api/waste-areas/:locationId',
      access: 'stock.write',
      summary: 'Stop treating a place as a waste accumulation area',
      params: locationParamsSchema,
      handle: async ({ params, res }) => {
        await waste.removeArea(params.locationId);
        res.status(204).end();
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/waste-pickups',
      access: 'stock.read',
      summary: 'List waste pickups, latest first',
      response: { schema: z.array(wastePickupSchema) },
      handle: async ({ res }) => {
        res.json(await waste.pickups());
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/waste-pickups',
      access: 'stock.write',
      summary: 'Record a waste pickup; its containers are marked picked up',
      response: { status: 201, schema: wastePickupSchema },
      body: wastePickupCreateSchema,
      handle: async ({ body, res, actor }) => {
        res.status(201).json(await waste.pickup(body, actor()));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/waste-pickups/:id',
      access: 'stock.read',
      summary: 'Read a waste pickup',
      response: { schema: wastePickupSchema },
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await waste.getPickup(params.id));
      },
    }),
  ];
}
