import { ruleSetCreateSchema, ruleSetListQuerySchema, ruleSetSchema } from '@lotwise/shared';
import { z } from 'zod';
import { idParamsSchema } from '../../lib/validate';
import { defineRoute } from '../../lib/route-table';
import type { RuleSetsService } from './rule-sets.service';

export function ruleSetRoutes(ruleSets: RuleSetsService) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/rule-sets',
      access: 'stock.read',
      summary: 'List the rule sets (built-in and the lab’s own), optionally of one kind',
      response: { schema: z.object({ items: z.array(ruleSetSchema) }) },
      query: ruleSetListQuerySchema,
      handle: async ({ query, res }) => {
        res.json({ items: await ruleSets.list(query.kind) });
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/rule-sets',
      access: 'stock.write',
      summary: 'Enter a rule set of the lab’s own (or a copy of a built-in one)',
      response: { status: 201, schema: ruleSetSchema },
      body: ruleSetCreateSchema,
      handle: async ({ body, res }) => {
        res.status(201).json(await ruleSets.create(body));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/rule-sets/:id',
      access: 'stock.read',
      summary: 'Read a rule set with its figures and source',
      response: { schema: ruleSetSchema },
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await ruleSets.get(params.id));
      },
    }),
    defineRoute({
      method: 'patch',
      path: '/api/rule-sets/:id',
      access: 'stock.write',
      summary: 'Change a rule set of the lab’s own (built-in sets are copied instead)',
      response: { schema: ruleSetSchema },
      params: idParamsSchema,
      body: ruleSetCreateSchema,
      handle: async ({ params, body, res }) => {
        res.json(await ruleSets.update(params.id, body));
      },
    }),
    defineRoute({
      method: 'delete',
      path: '/api/rule-sets/:id',
      access: 'stock.write',
      summary: 'Delete a rule set of the lab’s own that no lab area uses',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        await ruleSets.remove(params.id);
        res.status(204).end();
      },
    }),
  ];
}
