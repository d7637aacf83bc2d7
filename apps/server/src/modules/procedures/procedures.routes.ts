import {
  procedureCreateSchema,
  procedureListQuerySchema,
  procedurePatchSchema,
  scaledQuerySchema,
} from '@lotwise/shared';
import { idParamsSchema } from '../../lib/validate';
import { defineRoute } from '../../lib/route-table';
import type { RunsService } from '../runs/runs.service';
import type { ProceduresService } from './procedures.service';

export function procedureRoutes(procedures: ProceduresService, runs: RunsService) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/procedures',
      access: 'procedures.read',
      query: procedureListQuerySchema,
      handle: async ({ query, res }) => {
        res.json(await procedures.list(query));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/procedures',
      access: 'procedures.write',
      body: procedureCreateSchema,
      handle: async ({ body, res, actor }) => {
        res.status(201).json(await procedures.create(body, actor()));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/procedures/:id',
      access: 'procedures.read',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await procedures.get(params.id));
      },
    }),
    defineRoute({
      method: 'patch',
      path: '/api/procedures/:id',
      access: 'procedures.write',
      params: idParamsSchema,
      body: procedurePatchSchema,
      handle: async ({ params, body, res }) => {
        res.json(await procedures.update(params.id, body));
      },
    }),
    defineRoute({
      method: 'delete',
      path: '/api/procedures/:id',
      access: 'procedures.write',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        await procedures.remove(params.id);
        res.status(204).end();
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/procedures/:id/scaled',
      access: 'procedures.read',
      params: idParamsSchema,
      query: scaledQuerySchema,
      handle: async ({ params, query, res }) => {
        res.json(await procedures.scaled(params.id, query));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/procedures/:id/runs',
      access: 'procedures.read',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await runs.procedureRuns(params.id));
      },
    }),
  ];
}
