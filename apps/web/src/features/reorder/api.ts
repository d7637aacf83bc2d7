import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import {
  draftedOrderSchema,
  draftResultSchema,
  memberRequestSchema,
  pageSchema,
  reorderSuggestionListSchema,
  type DraftFromSuggestions,
  type RequestCreate,
  type RequestFold,
  type RequestStatus,
  type ShortfallDraft,
} from '@lotwise/shared';
import { api, withQuery } from '../../lib/api-client';

export const restockKeys = {
  all: ['restock'] as const,
  suggestions: (params: { q: string; dueOnly: boolean }) =>
    [...restockKeys.all, 'suggestions', params] as const,
  requests: () => [...restockKeys.all, 'requests'] as const,
  requestList: (params: { status?: RequestStatus; mine?: boolean }) =>
    [...restockKeys.requests(), params] as const,
};

export const reorderSuggestionsQueryOptions = (params: { q: string; dueOnly: boolean }) =>
  queryOptions({
    queryKey: restockKeys.suggestions(params),
    queryFn: ({ signal }) =>
      api.get(
        withQuery('/api/reorder-suggestions', {
          q: params.q,
          dueOnly: params.dueOnly ? 'true' : undefined,
        }),
        reorderSuggestionListSchema,
        signal,
      ),
  });

export function useReorderSuggestions(params: { q: string; dueOnly: boolean }) {
  return useQuery(reorderSuggestionsQueryOptions(params));
}

const requestPageSchema = pageSchema(memberRequestSchema);

export function useRequests(params: { status?: RequestStatus; mine?: boolean }) {
  return useQuery({
    queryKey: restockKeys.requestList(params),
    queryFn: ({ signal }) =>
      api.get(
        withQuery('/api/requests', {
          status: params.status,
          mine: params.mine ? 'true' : undefined,
          pageSize: 100,
        }),
        requestPageSchema,
        signal,
      ),
  });
}

/** Anything that drafts or folds changes what is on order: suggestions and requests reload. */
function useRestockMutation<I, O>(mutationFn: (input: I) => Promise<O>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: restockKeys.all }),
  });
}

export function useDraftOrders() {
  return useRestockMutation((body: DraftFromSuggestions) =>
    api.post('/api/reorder-suggestions/draft-orders', body, draftResultSchema),
  );
}

export function useDraftShortfall() {
  return useRestockMutation((body: ShortfallDraft) =>
    api.post('/api/reorder-suggestions/shortfall', body, draftedOrderSchema),
  );
}

export function useCreateRequest() {
  return useRestockMutation((body: RequestCreate) =>
    api.post('/api/requests', body, memberRequestSchema),
  );
}

export function useWithdrawRequest() {
  return useRestockMutation((id: number) =>
    api.post(`/api/requests/${id}/withdraw`, {}, memberRequestSchema),
  );
}

export function useFoldRequest() {
  return useRestockMutation(({ id, ...body }: RequestFold & { id: number }) =>
    api.post(`/api/requests/${id}/fold`, body, memberRequestSchema),
  );
}
