import { requestCreateSchema, requestFoldSchema, requestListQuerySchema } from '@lotwise/shared';
import { idParamsSchema } from '../../lib/validate';
import { defineRoute } from '../../lib/route-table';
import type { RequestsService } from './requests.service';

/**
 * Member requests. Asking needs orders.join (members and coordinators); reading needs
 * orders.read and shows a member only their own; folding into an order is the
 * coordinator's (orders.manage).
 */
export function requestRoutes(requests: RequestsService) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/requests',
      access: 'orders.read',
      query: requestListQuerySchema,
      handle: async ({ query, res, actor }) => {
        res.json(await requests.list(query, actor()));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/requests',
      access: 'orders.join',
      body: requestCreateSchema,
      handle: async ({ body, res, actor }) => {
        res.status(201).json(await requests.create(body, actor()));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/requests/:id',
      access: 'orders.read',
      params: idParamsSchema,
      handle: async ({ params, res, actor }) => {
        res.json(await requests.get(params.id, actor()));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/requests/:id/withdraw',
      access: 'orders.join',
      params: idParamsSchema,
      handle: async ({ params, res, actor }) => {
        res.json(await requests.withdraw(params.id, actor()));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/requests/:id/fold',
      access: 'orders.manage',
      params: idParamsSchema,
      body: requestFoldSchema,
      handle: async ({ params, body, res, actor }) => {
        res.json(await requests.fold(params.id, body, actor()));
      },
    }),
  ];
}
