import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { searchResultSchema } from '@lotwise/shared';
import { api, withQuery } from '../../lib/api-client';

export const searchKeys = {
  all: ['search'] as const,
  results: (q: string) => [...searchKeys.all, q] as const,
};

/** Chemicals by name, synonym, CAS RN or formula, and containers by label code. */
export function useGlobalSearch(q: string) {
  const trimmed = q.trim();
  return useQuery({
    queryKey: searchKeys.results(trimmed),
    queryFn: ({ signal }) =>
      api.get(withQuery('/api/search', { q: trimmed, limit: 8 }), searchResultSchema, signal),
    enabled: trimmed.length > 0,
    placeholderData: keepPreviousData,
    staleTime: 10_000,
  });
}
