import { keepPreviousData, useQuery } from '@tanstack/react-query';
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
    // The answer's schema (and the container and lot schemas it holds) loads with the first
    // search, not with every page's top bar.
    queryFn: async ({ signal }) => {
      const { searchResultSchema } = await import('./result-schema');
      return api.get(
        withQuery('/api/search', { q: trimmed, limit: 8 }),
        searchResultSchema,
        signal,
      );
    },
    enabled: trimmed.length > 0,
    placeholderData: keepPreviousData,
    staleTime: 10_000,
  });
}
