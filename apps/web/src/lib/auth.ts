import { queryOptions, useQuery } from '@tanstack/react-query';
import { can, meResponseSchema, type Permission, type User } from '@lotwise/shared';
import { apiRequest, isApiError } from './api-client';

/**
 * The answer naming the signed-in user, checked against the contract in development and tests
 * only. Left out of a production build altogether, so that the first page (sign-in, and the
 * session check every page starts with) does not load zod and the contract's schemas.
 */
export const meAnswerSchema = import.meta.env.DEV ? meResponseSchema : undefined;

/** Root of every session-related query key. */
export const sessionKeys = {
  all: ['session'] as const,
  me: () => [...sessionKeys.all, 'me'] as const,
};

/** The signed-in user, or `null` when nobody is signed in (a 401 is an answer, not an error). */
export async function fetchCurrentUser(signal?: AbortSignal): Promise<User | null> {
  try {
    const { user } = await apiRequest('/api/auth/me', {
      schema: meAnswerSchema,
      signal,
      allowUnauthenticated: true,
    });
    return user;
  } catch (error) {
    if (isApiError(error) && error.status === 401) return null;
    throw error;
  }
}

export const currentUserQueryOptions = () =>
  queryOptions({
    queryKey: sessionKeys.me(),
    queryFn: ({ signal }) => fetchCurrentUser(signal),
    staleTime: 5 * 60_000,
    retry: false,
  });

export function useCurrentUser() {
  return useQuery(currentUserQueryOptions());
}

/** True when the signed-in user's role holds the permission. */
export function useCan(permission: Permission): boolean {
  const { data: user } = useCurrentUser();
  return user ? can(user.role, permission) : false;
}
