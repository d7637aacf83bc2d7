import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { AcceptInviteBody, ChangePasswordBody, LoginBody, MeResponse } from '@lotwise/shared';
import { apiRequest } from '../../lib/api-client';
import { meAnswerSchema, sessionKeys } from '../../lib/auth';

export const authKeys = {
  all: ['auth'] as const,
  invite: (token: string) => [...authKeys.all, 'invite', token] as const,
};

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: LoginBody) =>
      apiRequest<MeResponse>('/api/auth/login', {
        method: 'POST',
        body,
        schema: meAnswerSchema,
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

/** Who an invitation is for, as the greeting on the invitation page names them. */
export interface InviteGreeting {
  email: string | null;
  displayName: string | null;
}

function text(value: unknown): string | null {
  return typeof value === 'string' ? value : null;
}

/**
 * What the server tells about an invitation before it is accepted. The contract does not
 * name this shape yet, so it is read leniently: a greeting works with any of these fields,
 * at the top level or under `user`.
 */
export function inviteGreeting(body: unknown): InviteGreeting {
  const record = typeof body === 'object' && body !== null ? (body as Record<string, unknown>) : {};
  const user =
    typeof record.user === 'object' && record.user !== null
      ? (record.user as Record<string, unknown>)
      : {};
  return {
    email: text(record.email) ?? text(user.email),
    displayName: text(record.displayName) ?? text(user.displayName),
  };
}

export const inviteQueryOptions = (token: string) =>
  queryOptions({
    queryKey: authKeys.invite(token),
    queryFn: async ({ signal }) =>
      inviteGreeting(
        await apiRequest(`/api/auth/invite/${encodeURIComponent(token)}`, {
          signal,
          allowUnauthenticated: true,
        }),
      ),
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
      apiRequest<MeResponse>('/api/auth/password', {
        method: 'POST',
        body,
        schema: meAnswerSchema,
      }),
    onSuccess: ({ user }) => {
      queryClient.setQueryData(sessionKeys.me(), user);
    },
  });
}
