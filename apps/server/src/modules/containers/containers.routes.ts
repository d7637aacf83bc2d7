import {
  adjustmentSchema,
  containerCreateSchema,
  containerListQuerySchema,
  containerPatchSchema,
  disposalSchema,
  drawSchema,
  labelCodeParamsSchema,
  ledgerListQuerySchema,
  splitSchema,
  transferSchema,
} from '@lotwise/shared';
import { idParamsSchema } from '../../lib/validate';
import { defineRoute } from '../../lib/route-table';
import type { ContainersService } from './containers.service';

export function containerRoutes(containers: ContainersService) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/containers',
      access: 'stock.read',
      query: containerListQuerySchema,
      handle: async ({ query, res }) => {
        res.json(await containers.list(query));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/containers',
      access: 'stock.write',
      body: containerCreateSchema,
      handle: async ({ body, res, actor }) => {
        res.status(201).json(await containers.create(body, actor()));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/containers/by-label/:labelCode',
      access: 'stock.read',
      params: labelCodeParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await containers.getByLabel(params.labelCode));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/containers/:id',
      access: 'stock.read',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await containers.get(params.id));
      },
    }),
    defineRoute({
      method: 'patch',
      path: '/api/containers/:id',
      access: 'stock.write',
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
      params: idParamsSchema,
      body: disposalSchema,
      handle: async ({ params, body, res, actor }) => {
        res.status(201).json(await containers.dispose(params.id, body, actor()));
      },
    }),
  ];
}
