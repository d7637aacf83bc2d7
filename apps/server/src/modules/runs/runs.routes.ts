import { runCreateSchema, runListQuerySchema, runRecordSchema } from '@lotwise/shared';
import { idParamsSchema } from '../../lib/validate';
import { defineRoute } from '../../lib/route-table';
import type { RunsService } from './runs.service';

/** Runs, and the history views that read them (chemical usage, lot provenance). */
export function runRoutes(runs: RunsService) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/runs',
      access: 'procedures.read',
      query: runListQuerySchema,
      handle: async ({ query, res }) => {
        res.json(await runs.list(query));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/runs',
      access: 'runs.record',
      body: runCreateSchema,
      handle: async ({ body, res, actor }) => {
        res.status(201).json(await runs.create(body, actor()));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/runs/:id',
      access: 'procedures.read',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await runs.get(params.id));
      },
    }),
    defineRoute({
      method: 'delete',
      path: '/api/runs/:id',
      access: 'runs.record',
      params: idParamsSchema,
      handle: async ({ params, res, actor }) => {
        await runs.discard(params.id, actor());
        res.status(204).end();
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/runs/:id/record',
      access: 'runs.record',
      params: idParamsSchema,
      body: runRecordSchema,
      handle: async ({ params, body, res, actor }) => {
        res.json(await runs.record(params.id, body, actor()));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/chemicals/:id/usage',
      access: 'procedures.read',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await runs.chemicalUsage(params.id));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/lots/:id/provenance',
      access: 'stock.read',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await runs.lotProvenance(params.id));
      },
    }),
  ];
}
