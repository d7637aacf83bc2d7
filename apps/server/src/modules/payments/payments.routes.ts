import { cashPaymentBodySchema } from '@lotwise/shared';
import { z } from 'zod';
import { defineRoute } from '../../lib/route-table';
import type { PaymentsService } from './payments.service';

/** Where the payment provider sends its webhooks; its raw body is kept (see app.ts). */
export const paymentWebhookPath = '/api/webhooks/stripe';

const positiveId = z
  .string()
  .regex(/^[1-9]\d{0,14}$/, 'must be a positive whole number')
  .transform(Number);
const shareParamsSchema = z.object({ id: positiveId, shareId: positiveId });

export function paymentRoutes(payments: PaymentsService) {
  return [
    defineRoute({
      method: 'post',
      path: '/api/orders/:id/shares/:shareId/checkout',
      access: 'orders.join',
      params: shareParamsSchema,
      handle: async ({ params, actor, res }) => {
        res.json(await payments.checkout(actor(), params.id, params.shareId));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/orders/:id/shares/:shareId/cash-payment',
      access: 'orders.manage',
      params: shareParamsSchema,
      body: cashPaymentBodySchema,
      handle: async ({ params, body, actor, res }) => {
        res.status(201).json(await payments.recordCash(actor(), params.id, params.shareId, body));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/orders/:id/refunds',
      access: 'orders.manage',
      params: z.object({ id: positiveId }),
      handle: async ({ params, actor, res }) => {
        res.json(await payments.refundPaidShares(params.id, actor()));
      },
    }),
    defineRoute({
      method: 'post',
      path: paymentWebhookPath,
      // The provider signs what it sends; the signature is checked instead of a session.
      access: 'public',
      handle: async ({ req, res }) => {
        res.json(await payments.receiveWebhook(req.body, req.get('stripe-signature')));
      },
    }),
  ];
}
