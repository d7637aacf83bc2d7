import {
  watchListCreateSchema,
  watchListPatchSchema,
  watchReportQuerySchema,
} from '@lotwise/shared';
import { defineRoute } from '../../lib/route-table';
import { idParamsSchema } from '../../lib/validate';
import type { WatchListsService } from './watch-lists.service';

/**
 * Watch lists: everyone who reads chemicals sees the lists; the admin chooses them, keeps the
 * lab's own and reads the report. The order approval lives with the orders' permission.
 */
export function watchListRoutes(watchLists: WatchListsService) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/watch-lists',
      access: 'chemicals.read',
      handle: async ({ res }) => {
        res.json({ items: await watchLists.list() });
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/watch-lists',
      access: 'users.manage',
      body: watchListCreateSchema,
      handle: async ({ body, actor, res }) => {
        res.status(201).json(await watchLists.create(body, actor()));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/watch-lists/report',
      access: 'users.manage',
      query: watchReportQuerySchema,
      handle: async ({ query, res }) => {
        res.json(await watchLists.report(query));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/watch-lists/report.csv',
      access: 'users.manage',
      query: watchReportQuerySchema,
      handle: async ({ query, res }) => {
        await watchLists.reportCsv(query, res);
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/watch-lists/:id',
      access: 'chemicals.read',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await watchLists.get(params.id));
      },
    }),
    defineRoute({
      method: 'patch',
      path: '/api/watch-lists/:id',
      access: 'users.manage',
      params: idParamsSchema,
      body: watchListPatchSchema,
      handle: async ({ params, body, actor, res }) => {
        res.json(await watchLists.update(params.id, body, actor()));
      },
    }),
    defineRoute({
      method: 'delete',
      path: '/api/watch-lists/:id',
      access: 'users.manage',
      params: idParamsSchema,
      handle: async ({ params, actor, res }) => {
        await watchLists.remove(params.id, actor());
        res.status(204).end();
      },
    }),
  ];
}
