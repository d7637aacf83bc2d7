import {
  draftFromSuggestionsSchema,
  reorderSuggestionQuerySchema,
  shortfallDraftSchema,
} from '@lotwise/shared';
import { defineRoute } from '../../lib/route-table';
import type { ReorderService } from './reorder.service';

/**
 * Reorder suggestions: anyone who may see orders reads them (members see what the lab is
 * about to buy, and may ask for more through a request); drafting orders from them is the
 * coordinator's (orders.manage).
 */
export function reorderRoutes(reorder: ReorderService) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/reorder-suggestions',
      access: 'orders.read',
      query: reorderSuggestionQuerySchema,
      handle: async ({ query, res }) => {
        res.json(await reorder.list(query));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/reorder-suggestions/draft-orders',
      access: 'orders.manage',
      body: draftFromSuggestionsSchema,
      handle: async ({ body, res, actor }) => {
        res.status(201).json({ orders: await reorder.draftOrders(body, actor()) });
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/reorder-suggestions/shortfall',
      access: 'orders.manage',
      body: shortfallDraftSchema,
      handle: async ({ body, res, actor }) => {
        res.status(201).json(await reorder.draftShortfall(body, actor()));
      },
    }),
  ];
}
