import {
  keepPreviousData,
  queryOptions,
  useMutation,
  useQuery,
  useQueryClient,
} from '@tanstack/react-query';
import {
  pageSchema,
  userCreatedSchema,
  userSchema,
  type UserCreate,
  type UserPatch,
} from '@lotwise/shared';
import { z } from 'zod';
import { api, withQuery } from '../../lib/api-client';
import { sessionKeys } from '../../lib/auth';

export interface UserListParams {
  q: string;
  sort: string;
  page: number;
  pageSize: number;
}

export const userKeys = {
  all: ['users'] as const,
  lists: () => [...userKeys.all, 'list'] as const,
  list: (params: UserListParams) => [...userKeys.lists(), params] as const,
};

const userPageSchema = pageSchema(userSchema);

export const usersQueryOptions = (params: UserListParams) =>
  queryOptions({
    queryKey: userKeys.list(params),
    queryFn: ({ signal }) =>
      api.get(withQuery('/api/users', { ...params }), userPageSchema, signal),
    placeholderData: keepPreviousData,
  });

export function useUsers(params: UserListParams) {
  return useQuery(usersQueryOptions(params));
}

export function useCreateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: UserCreate) => api.post('/api/users', body, userCreatedSchema),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: userKeys.lists() }),
  });
}

export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, patch }: { id: number; patch: UserPatch }) =>
      api.patch(`/api/users/${id}`, patch),
    onSettled: async () => {
      await queryClient.invalidateQueries({ queryKey: userKeys.lists() });
      // The admin may have changed their own name or role.
      await queryClient.invalidateQueries({ queryKey: sessionKeys.all });
    },
  });
}

/** A new invitation link; any earlier link for that person stops working. */
const reissuedSchema = z.object({ inviteUrl: z.string() }).loose();

export function useReissueInvite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api.post(`/api/users/${id}/invite`, undefined, reissuedSchema),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: userKeys.lists() }),
  });
}
