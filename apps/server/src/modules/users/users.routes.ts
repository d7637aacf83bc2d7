import { userCreateSchema, userListQuerySchema, userPatchSchema } from '@lotwise/shared';
import { defineRoute } from '../../lib/route-table';
import { idParamsSchema } from '../../lib/validate';
import type { Sessions } from '../auth/session';
import type { UsersService } from './users.service';

// Unknown fields are refused here as they are for chemicals (the shared schemas strip them).
const createBody = userCreateSchema.strict();
const patchBody = userPatchSchema.strict();

export function userRoutes(users: UsersService, session: Sessions) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/users',
      access: 'users.manage',
      query: userListQuerySchema,
      handle: async ({ query, res }) => {
        res.json(await users.list(query));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/users',
      access: 'users.manage',
      body: createBody,
      handle: async ({ body, res, actor }) => {
        res.status(201).json(await users.create(body, actor().id));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/users/:id',
      access: 'users.manage',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await users.get(params.id));
      },
    }),
    defineRoute({
      method: 'patch',
      path: '/api/users/:id',
      access: 'users.manage',
      params: idParamsSchema,
      body: patchBody,
      handle: async ({ params, body, res, actor }) => {
        const user = await users.update(params.id, body, actor().id);
        // A change to one's own password or role ends one's other sessions, not this one.
        if (params.id === actor().id) await session.issue(res, user.id);
        res.json(user);
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/users/:id/invite',
      access: 'users.manage',
      params: idParamsSchema,
      handle: async ({ params, res, actor }) => {
        res.json(await users.reissueInvite(params.id, actor().id));
      },
    }),
  ];
}
