import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import {
  meResponseSchema,
  type AcceptInviteBody,
  type ChangePasswordBody,
  type LoginBody,
} from '@lotwise/shared';
import { z } from 'zod';
import { apiRequest } from '../../lib/api-client';
import { sessionKeys } from '../../lib/auth';

export const authKeys = {
  all: ['auth'] as const,
  invite: (token: string) => [...authKeys.all, 'invite', token] as const,
};

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: LoginBody) =>
      apiRequest('/api/auth/login', {
        method: 'POST',
        body,
        schema: meResponseSchema,
        allowUnauthenticated: true,
      }),
    onSuccess: ({ user }) => {
      queryClient.setQueryData(sessionKeys.me(), user);
    },
  });
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () =>
      apiRequest('/api/auth/logout', { method: 'POST', allowUnauthenticated: true }),
    onSettled: () => {
      // Nothing cached for one person may be shown to the next one at this browser.
      queryClient.clear();
      queryClient.setQueryData(sessionKeys.me(), null);
    },
  });
}

/**
 * What the server tells about an invitation before it is accepted. The contract does not
 * name this shape yet, so it is read leniently: a greeting works with any of these fields.
 */
const inviteGreetingSchema = z
  .object({
    email: z.string().optional(),
    displayName: z.string().optional(),
    user: z.object({ email: z.string().optional(), displayName: z.string().optional() }).optional(),
  })
  .transform((body) => ({
    email: body.email ?? body.user?.email ?? null,
    displayName: body.displayName ?? body.user?.displayName ?? null,
  }));
export type InviteGreeting = z.output<typeof inviteGreetingSchema>;

export const inviteQueryOptions = (token: string) =>
  queryOptions({
    queryKey: authKeys.invite(token),
    queryFn: ({ signal }) =>
      apiRequest(`/api/auth/invite/${encodeURIComponent(token)}`, {
        schema: inviteGreetingSchema,
        signal,
        allowUnauthenticated: true,
      }),
    retry: false,
  });

export function useInvite(token: string) {
  return useQuery(inviteQueryOptions(token));
}

export function useAcceptInvite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: AcceptInviteBody) =>
      apiRequest('/api/auth/accept-invite', { method: 'POST', body, allowUnauthenticated: true }),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: sessionKeys.all });
    },
  });
}

/** Changes one's own password; the server ends every other session and renews this one. */
export function useChangePassword() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: ChangePasswordBody) =>
      apiRequest('/api/auth/password', { method: 'POST', body, schema: meResponseSchema }),
    onSuccess: ({ user }) => {
      queryClient.setQueryData(sessionKeys.me(), user);
    },
  });
}
