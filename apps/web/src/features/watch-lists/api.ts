import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import {
  watchListDetailSchema,
  watchListSchema,
  watchReportSchema,
  type WatchListCreate,
  type WatchReportQuery,
} from '@lotwise/shared';
import { api, apiRequest, withQuery } from '../../lib/api-client';

/** Every query of watch lists sits under `['watch-lists']`; chemicals carry their listings too. */
export const watchListKeys = {
  all: ['watch-lists'] as const,
  list: () => [...watchListKeys.all, 'list'] as const,
  detail: (id: number) => [...watchListKeys.all, 'detail', id] as const,
  report: (query: WatchReportQuery) => [...watchListKeys.all, 'report', query] as const,
};

const listsSchema = z.object({ items: z.array(watchListSchema) });

export const watchListsQueryOptions = () =>
  queryOptions({
    queryKey: watchListKeys.list(),
    queryFn: ({ signal }) => api.get('/api/watch-lists', listsSchema, signal),
  });

export function useWatchLists() {
  return useQuery(watchListsQueryOptions());
}

export function useWatchList(id: number, enabled: boolean) {
  return useQuery({
    queryKey: watchListKeys.detail(id),
    queryFn: ({ signal }) => api.get(`/api/watch-lists/${id}`, watchListDetailSchema, signal),
    enabled,
  });
}

/** The admin follows a list or stops following it; chemicals' badges change with it. */
export function useChooseWatchList() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, chosen }: { id: number; chosen: boolean }) =>
      apiRequest(`/api/watch-lists/${id}`, {
        method: 'PATCH',
        body: { chosen },
        schema: watchListDetailSchema,
      }),
    // The box turns at once; the server's answer (or failure) settles it.
    onMutate: async ({ id, chosen }) => {
      await queryClient.cancelQueries({ queryKey: watchListKeys.list() });
      queryClient.setQueryData(
        watchListKeys.list(),
        (old: z.infer<typeof listsSchema> | undefined) =>
          old ? { items: old.items.map((l) => (l.id === id ? { ...l, chosen } : l)) } : old,
      );
    },
    onSettled: () => queryClient.invalidateQueries(),
  });
}

export function useWatchReport(query: WatchReportQuery | null) {
  return useQuery({
    queryKey: watchListKeys.report(query ?? { from: '', to: '' }),
    queryFn: ({ signal }) =>
      api.get(withQuery('/api/watch-lists/report', { ...query! }), watchReportSchema, signal),
    enabled: query !== null,
  });
}

/** The download address of the report as CSV. */
export function watchReportCsvUrl(query: WatchReportQuery): string {
  return withQuery('/api/watch-lists/report.csv', { ...query });
}

/** The admin enters a list of the lab's own regulator, with its substances. */
export function useCreateWatchList() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: WatchListCreate) =>
      apiRequest('/api/watch-lists', { method: 'POST', body, schema: watchListDetailSchema }),
    onSettled: () => queryClient.invalidateQueries(),
  });
}
