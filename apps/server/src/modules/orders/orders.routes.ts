import {
  orderCancelSchema,
  orderCreateSchema,
  orderInvoiceSchema,
  orderLineCreateSchema,
  orderLinePatchSchema,
  orderListQuerySchema,
  orderMarkOrderedSchema,
  orderPatchSchema,
  shareClaimSchema,
  sharePatchSchema,
} from '@lotwise/shared';
import { z } from 'zod';
import { defineRoute } from '../../lib/route-table';
import { idParamsSchema } from '../../lib/validate';
import type { OrdersService } from './orders.service';

const positiveId = idParamsSchema.shape.id;
const lineParamsSchema = z.object({ id: positiveId, lineId: positiveId });
const shareParamsSchema = z.object({ id: positiveId, shareId: positiveId });

/**
 * Shared orders. Everyone with `orders.read` sees the orders (drafts: coordinators only) and
 * who claimed what; members claim with `orders.join`; coordinators (`orders.manage`) draft,
 * open, close claims, take the rest for the lab, mark ordered and cancel.
 */
export function orderRoutes(orders: OrdersService) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/orders',
      access: 'orders.read',
      query: orderListQuerySchema,
      handle: async ({ query, res, actor }) => {
        res.json(await orders.list(query, actor()));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/orders',
      access: 'orders.manage',
      body: orderCreateSchema,
      handle: async ({ body, res, actor }) => {
        res.status(201).json(await orders.create(body, actor()));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/orders/:id',
      access: 'orders.read',
      params: idParamsSchema,
      handle: async ({ params, res, actor }) => {
        res.json(await orders.get(params.id, actor()));
      },
    }),
    defineRoute({
      method: 'patch',
      path: '/api/orders/:id',
      access: 'orders.manage',
      params: idParamsSchema,
      body: orderPatchSchema,
      handle: async ({ params, body, res, actor }) => {
        res.json(await orders.update(params.id, body, actor()));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/orders/:id/lines',
      access: 'orders.manage',
      params: idParamsSchema,
      body: orderLineCreateSchema,
      handle: async ({ params, body, res, actor }) => {
        res.status(201).json(await orders.addLine(params.id, body, actor()));
      },
    }),
    defineRoute({
      method: 'patch',
      path: '/api/orders/:id/lines/:lineId',
      access: 'orders.manage',
      params: lineParamsSchema,
      body: orderLinePatchSchema,
      handle: async ({ params, body, res, actor }) => {
        res.json(await orders.changeLine(params.id, params.lineId, body.packs, actor()));
      },
    }),
    defineRoute({
      method: 'delete',
      path: '/api/orders/:id/lines/:lineId',
      access: 'orders.manage',
      params: lineParamsSchema,
      handle: async ({ params, res, actor }) => {
        res.json(await orders.removeLine(params.id, params.lineId, actor()));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/orders/:id/open',
      access: 'orders.manage',
      params: idParamsSchema,
      handle: async ({ params, res, actor }) => {
        res.json(await orders.open(params.id, actor()));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/orders/:id/lab-remainder',
      access: 'orders.manage',
      params: idParamsSchema,
      handle: async ({ params, res, actor }) => {
        res.json(await orders.takeLabRemainder(params.id, actor()));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/orders/:id/close-claims',
      access: 'orders.manage',
      params: idParamsSchema,
      handle: async ({ params, res, actor }) => {
        res.json(await orders.closeClaims(params.id, actor()));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/orders/:id/mark-ordered',
      access: 'orders.manage',
      params: idParamsSchema,
      body: orderMarkOrderedSchema,
      handle: async ({ params, body, res, actor }) => {
        res.json(await orders.markOrdered(params.id, body, actor()));
      },
    }),
    defineRoute({
      method: 'put',
      path: '/api/orders/:id/supplier-invoice',
      access: 'orders.manage',
      params: idParamsSchema,
      body: orderInvoiceSchema,
      handle: async ({ params, body, res, actor }) => {
        res.json(await orders.recordInvoice(params.id, body.supplierInvoiceMinor, actor()));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/orders/:id/cancel',
      access: 'orders.manage',
      params: idParamsSchema,
      body: orderCancelSchema,
      handle: async ({ params, body, res, actor }) => {
        res.json(await orders.cancel(params.id, body, actor()));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/orders/:id/shares',
      access: 'orders.join',
      params: idParamsSchema,
      body: shareClaimSchema,
      handle: async ({ params, body, res, actor }) => {
        res.status(201).json(await orders.claim(params.id, body, actor()));
      },
    }),
    defineRoute({
      method: 'patch',
      path: '/api/orders/:id/shares/:shareId',
      access: 'orders.join',
      params: shareParamsSchema,
      body: sharePatchSchema,
      handle: async ({ params, body, res, actor }) => {
        res.json(await orders.changeShare(params.id, params.shareId, body.quantity, actor()));
      },
    }),
    defineRoute({
      method: 'delete',
      path: '/api/orders/:id/shares/:shareId',
      access: 'orders.join',
      params: shareParamsSchema,
      handle: async ({ params, res, actor }) => {
        res.json(await orders.withdrawShare(params.id, params.shareId, actor()));
      },
    }),
  ];
}
