import {
  chemicalUsageSchema,
  lotProvenanceSchema,
  pageSchema,
  runCreateSchema,
  runListQuerySchema,
  runRecordSchema,
  runSchema,
  runSummarySchema,
} from '@lotwise/shared';
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
      summary: 'List runs',
      response: { schema: pageSchema(runSummarySchema) },
      query: runListQuerySchema,
      handle: async ({ query, res }) => {
        res.json(await runs.list(query));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/runs',
      access: 'runs.record',
      summary: 'Start a run of a procedure or plan',
      response: { status: 201, schema: runSchema },
      body: runCreateSchema,
      handle: async ({ body, res, actor }) => {
        res.status(201).json(await runs.create(body, actor()));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/runs/:id',
      access: 'procedures.read',
      summary: 'Read a run',
      response: { schema: runSchema },
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
      summary: 'Record a run: draws, products, yield',
      response: { schema: runSchema },
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
      summary: 'Where a chemical was used in runs and procedures',
      response: { schema: chemicalUsageSchema },
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await runs.chemicalUsage(params.id));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/lots/:id/provenance',
      access: 'stock.read',
      summary: 'Where a lot came from and went',
      response: { schema: lotProvenanceSchema },
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await runs.lotProvenance(params.id));
      },
    }),
  ];
}
