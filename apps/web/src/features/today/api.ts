import { queryOptions, useQuery } from '@tanstack/react-query';
import { todaySchema } from '@lotwise/shared';
import { api } from '../../lib/api-client';

export const todayKeys = {
  all: ['today'] as const,
};

export const todayQueryOptions = () =>
  queryOptions({
    queryKey: todayKeys.all,
    queryFn: ({ signal }) => api.get('/api/today', todaySchema, signal),
    // The lab changes with every draw, plan and e-mail; a page left open stays current.
    refetchInterval: 60_000,
  });

export function useToday() {
  return useQuery(todayQueryOptions());
}
