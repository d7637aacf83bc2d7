import {
  adjustmentSchema,
  containerChangeSchema,
  containerCreateSchema,
  containerDetailSchema,
  containerListQuerySchema,
  containerPatchSchema,
  containerSchema,
  disposalSchema,
  drawSchema,
  labelCodeParamsSchema,
  ledgerEntrySchema,
  ledgerListQuerySchema,
  pageSchema,
  splitSchema,
  transferSchema,
  wasteContainerSchema,
} from '@lotwise/shared';
import { idParamsSchema } from '../../lib/validate';
import { defineRoute } from '../../lib/route-table';
import type { WasteService } from '../waste/waste.service';
import type { ContainersService } from './containers.service';

export function containerRoutes(containers: ContainersService, waste: WasteService) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/containers',
      access: 'stock.read',
      summary: 'List containers (`kind=waste`: the open and full waste containers)',
      response: { schema: pageSchema(containerSchema).or(pageSchema(wasteContainerSchema)) },
      query: containerListQuerySchema,
      handle: async ({ query, res }) => {
        if (query.kind === 'waste') {
          const items = await waste.list({
            statuses: ['open', 'full'],
            ...(query.locationId ? { locationId: query.locationId } : {}),
          });
          res.json({ items, total: items.length, page: 1, pageSize: Math.max(items.length, 1) });
          return;
        }
        res.json(await containers.list(query));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/containers',
      access: 'stock.write',
      summary: 'Add a container of a lot',
      response: { status: 201, schema: containerChangeSchema },
      body: containerCreateSchema,
      handle: async ({ body, res, actor }) => {
        res.status(201).json(await containers.create(body, actor()));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/containers/by-label/:labelCode',
      access: 'stock.read',
      summary: 'Find a container by its label code',
      response: { schema: containerDetailSchema },
      params: labelCodeParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await containers.getByLabel(params.labelCode));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/containers/:id',
      access: 'stock.read',
      summary: 'Read a container',
      response: { schema: containerDetailSchema },
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await containers.get(params.id));
      },
    }),
    defineRoute({
      method: 'patch',
      path: '/api/containers/:id',
      access: 'stock.write',
      summary: 'Change a container (location, tare, status)',
      response: { schema: containerDetailSchema },
      params: idParamsSchema,
      body: containerPatchSchema,
      handle: async ({ params, body, res }) => {
        res.json(await containers.update(params.id, body));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/containers/:id/ledger',
      access: 'stock.read',
      summary: 'List the ledger entries of a container',
      response: { schema: pageSchema(ledgerEntrySchema) },
      params: idParamsSchema,
      query: ledgerListQuerySchema,
      handle: async ({ params, query, res }) => {
        res.json(await containers.ledger(params.id, query));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/containers/:id/draws',
      access: 'stock.draw',
      summary: 'Record a draw from a container',
      response: { status: 201, schema: containerChangeSchema },
      params: idParamsSchema,
      body: drawSchema,
      handle: async ({ params, body, res, actor }) => {
        res.status(201).json(await containers.draw(params.id, body, actor()));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/containers/:id/adjustments',
      access: 'stock.write',
      summary: 'Adjust the balance of a container',
      response: { status: 201, schema: containerChangeSchema },
      params: idParamsSchema,
      body: adjustmentSchema,
      handle: async ({ params, body, res, actor }) => {
        res.status(201).json(await containers.adjust(params.id, body, actor()));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/containers/:id/splits',
      access: 'stock.write',
      summary: 'Split a container into a new one',
      response: { status: 201, schema: containerChangeSchema },
      params: idParamsSchema,
      body: splitSchema,
      handle: async ({ params, body, res, actor }) => {
        res.status(201).json(await containers.split(params.id, body, actor()));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/containers/:id/transfers',
      access: 'stock.write',
      summary: 'Move a container to another location',
      response: { status: 201, schema: containerChangeSchema },
      params: idParamsSchema,
      body: transferSchema,
      handle: async ({ params, body, res, actor }) => {
        res.status(201).json(await containers.transfer(params.id, body, actor()));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/containers/:id/disposal',
      access: 'stock.write',
      summary: 'Dispose of a container',
      response: { status: 201, schema: containerChangeSchema },
      params: idParamsSchema,
      body: disposalSchema,
      handle: async ({ params, body, res, actor }) => {
        res.status(201).json(await containers.dispose(params.id, body, actor()));
      },
    }),
  ];
}
