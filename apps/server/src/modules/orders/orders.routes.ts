import {
  watchApprovalSchema,
  orderCancelSchema,
  orderCreateSchema,
  orderDetailSchema,
  orderInvoiceSchema,
  orderLineCreateSchema,
  orderLinePatchSchema,
  orderListQuerySchema,
  orderMarkOrderedSchema,
  orderPatchSchema,
  orderSummarySchema,
  pageSchema,
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
      summary: 'List shared orders',
      response: { schema: pageSchema(orderSummarySchema) },
      query: orderListQuerySchema,
      handle: async ({ query, res, actor }) => {
        res.json(await orders.list(query, actor()));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/orders',
      access: 'orders.manage',
      summary: 'Draft a shared order',
      response: { status: 201, schema: orderDetailSchema },
      body: orderCreateSchema,
      handle: async ({ body, res, actor }) => {
        res.status(201).json(await orders.create(body, actor()));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/orders/:id',
      access: 'orders.read',
      summary: 'Read a shared order with its lines and claims',
      response: { schema: orderDetailSchema },
      params: idParamsSchema,
      handle: async ({ params, res, actor }) => {
        res.json(await orders.get(params.id, actor()));
      },
    }),
    defineRoute({
      method: 'patch',
      path: '/api/orders/:id',
      access: 'orders.manage',
      summary: 'Change a shared order',
      response: { schema: orderDetailSchema },
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
      summary: 'Add a line to an order',
      response: { status: 201, schema: orderDetailSchema },
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
      summary: 'Change the packs of an order line',
      response: { schema: orderDetailSchema },
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
      summary: 'Remove an order line',
      response: { schema: orderDetailSchema },
      params: lineParamsSchema,
      handle: async ({ params, res, actor }) => {
        res.json(await orders.removeLine(params.id, params.lineId, actor()));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/orders/:id/watch-approval',
      access: 'orders.manage',
      summary: 'Approve the watched and restricted chemicals of an order, with a reason',
      response: { schema: orderDetailSchema },
      params: idParamsSchema,
      body: watchApprovalSchema,
      handle: async ({ params, body, res, actor }) => {
        res.json(await orders.approveWatch(params.id, body.reason, actor()));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/orders/:id/open',
      access: 'orders.manage',
      summary: 'Open an order for claims',
      response: { schema: orderDetailSchema },
      params: idParamsSchema,
      handle: async ({ params, res, actor }) => {
        res.json(await orders.open(params.id, actor()));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/orders/:id/lab-remainder',
      access: 'orders.manage',
      summary: 'Take what nobody claimed for the lab',
      response: { schema: orderDetailSchema },
      params: idParamsSchema,
      handle: async ({ params, res, actor }) => {
        res.json(await orders.takeLabRemainder(params.id, actor()));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/orders/:id/close-claims',
      access: 'orders.manage',
      summary: 'Close an order for claims',
      response: { schema: orderDetailSchema },
      params: idParamsSchema,
      handle: async ({ params, res, actor }) => {
        res.json(await orders.closeClaims(params.id, actor()));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/orders/:id/mark-ordered',
      access: 'orders.manage',
      summary: 'Mark an order as placed with the supplier',
      response: { schema: orderDetailSchema },
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
      summary: 'Record the supplier invoice total',
      response: { schema: orderDetailSchema },
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
      summary: 'Cancel an order',
      response: { schema: orderDetailSchema },
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
      summary: 'Claim a share of an order line',
      response: { status: 201, schema: orderDetailSchema },
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
      summary: 'Change a claimed quantity',
      response: { schema: orderDetailSchema },
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
      summary: 'Withdraw a claim',
      response: { schema: orderDetailSchema },
      params: shareParamsSchema,
      handle: async ({ params, res, actor }) => {
        res.json(await orders.withdrawShare(params.id, params.shareId, actor()));
      },
    }),
  ];
}
