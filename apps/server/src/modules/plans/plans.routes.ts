import {
  dispensingSheetSchema,
  pageSchema,
  planCreateSchema,
  planDetailSchema,
  planListQuerySchema,
  planPatchSchema,
  planSchema,
  reservationCreateSchema,
} from '@lotwise/shared';
import { idParamsSchema } from '../../lib/validate';
import { defineRoute } from '../../lib/route-table';
import type { PlansService } from './plans.service';

/**
 * Everyone who may read procedures may read plans and their dispensing sheets; making and
 * changing plans needs `runs.record` (one's own) or `plans.manage` (anyone's).
 */
export function planRoutes(plans: PlansService) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/plans',
      access: 'procedures.read',
      summary: 'List prep plans',
      response: { schema: pageSchema(planSchema) },
      query: planListQuerySchema,
      handle: async ({ query, res, actor }) => {
        res.json(await plans.list(query, actor()));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/plans',
      access: 'runs.record',
      summary: 'Plan a preparation (answers its stock check)',
      response: { status: 201, schema: planDetailSchema },
      body: planCreateSchema,
      handle: async ({ body, res, actor }) => {
        res.status(201).json(await plans.create(body, actor()));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/plans/preview',
      access: 'procedures.read',
      body: planCreateSchema,
      handle: async ({ body, res }) => {
        res.json(await plans.preview(body));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/plans/:id',
      access: 'procedures.read',
      summary: 'Read a prep plan with its stock check',
      response: { schema: planDetailSchema },
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await plans.get(params.id));
      },
    }),
    defineRoute({
      method: 'patch',
      path: '/api/plans/:id',
      access: 'runs.record',
      summary: 'Change a prep plan',
      response: { schema: planDetailSchema },
      params: idParamsSchema,
      body: planPatchSchema,
      handle: async ({ params, body, res, actor }) => {
        res.json(await plans.update(params.id, body, actor()));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/plans/:id/reservations',
      access: 'runs.record',
      summary: 'Reserve containers for a plan',
      response: { status: 201, schema: planDetailSchema },
      params: idParamsSchema,
      body: reservationCreateSchema,
      handle: async ({ params, body, res, actor }) => {
        res.status(201).json(await plans.reserve(params.id, body, actor()));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/plans/:id/cancel',
      access: 'runs.record',
      summary: 'Cancel a prep plan',
      response: { schema: planDetailSchema },
      params: idParamsSchema,
      handle: async ({ params, res, actor }) => {
        res.json(await plans.cancel(params.id, actor()));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/plans/:id/dispensing',
      access: 'procedures.read',
      summary: 'The dispensing sheet of a plan',
      response: { schema: dispensingSheetSchema },
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await plans.dispensing(params.id));
      },
    }),
  ];
}
