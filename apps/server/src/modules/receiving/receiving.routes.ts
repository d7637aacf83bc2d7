import { receiveOrderSchema } from '@lotwise/shared';
import { defineRoute } from '../../lib/route-table';
import { idParamsSchema } from '../../lib/validate';
import type { ReceivingService } from './receiving.service';

/** Receiving a shared order's delivery into members' containers, and closing the order. */
export function receivingRoutes(receiving: ReceivingService) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/orders/:id/receiving',
      access: 'orders.manage',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await receiving.view(params.id));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/orders/:id/receive',
      access: 'orders.manage',
      params: idParamsSchema,
      body: receiveOrderSchema,
      handle: async ({ params, body, res, actor }) => {
        res.json(await receiving.receive(params.id, body, actor()));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/orders/:id/close',
      access: 'orders.manage',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await receiving.close(params.id));
      },
    }),
  ];
}
