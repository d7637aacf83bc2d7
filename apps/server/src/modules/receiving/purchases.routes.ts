import { todayIso } from '@lotwise/shared';
import type { Response } from 'express';
import { defineRoute } from '../../lib/route-table';
import { idParamsSchema } from '../../lib/validate';
import type { PurchasesService } from './purchases.service';

function sendCsv(res: Response, fileName: string, text: string) {
  res.attachment(fileName);
  res.setHeader('Content-Type', 'text/csv; charset=utf-8');
  res.send(text);
}

/**
 * Money of shared orders: a member's purchases and receipts, the coordinator's summary and
 * CSV files. `/api/orders/money.csv` is declared before any `/api/orders/:id` route reads it.
 */
export function purchaseRoutes(purchases: PurchasesService) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/purchases',
      access: 'orders.join',
      handle: async ({ res, actor }) => {
        res.json(await purchases.mine(actor()));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/orders/money.csv',
      access: 'orders.manage',
      handle: async ({ res }) => {
        sendCsv(res, `lotwise-orders-money-${todayIso()}.csv`, await purchases.allMoneyCsv());
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/orders/:id/receipt',
      access: 'orders.join',
      params: idParamsSchema,
      handle: async ({ params, res, actor }) => {
        res.json(await purchases.receipt(params.id, actor()));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/orders/:id/money',
      access: 'orders.manage',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await purchases.orderMoney(params.id));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/orders/:id/money.csv',
      access: 'orders.manage',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        sendCsv(
          res,
          `lotwise-order-${params.id}-money-${todayIso()}.csv`,
          await purchases.orderMoneyCsv(params.id),
        );
      },
    }),
  ];
}
