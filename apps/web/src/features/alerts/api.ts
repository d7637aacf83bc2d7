import {
  keepPreviousData,
  queryOptions,
  useMutation,
  useQuery,
  useQueryClient,
} from '@tanstack/react-query';
import {
  alertEvaluationSchema,
  alertListSchema,
  alertPreferencesSchema,
  outboxMessageDetailSchema,
  outboxMessageSchema,
  pageSchema,
  type AlertKind,
  type AlertPreferencesBody,
  type OutboxStatus,
} from '@lotwise/shared';
import { api, apiRequest, withQuery } from '../../lib/api-client';
import { paths } from '../../config/paths';

/** Web paths of the alert screens (to be listed in config/paths.ts when wired). */
export const alertPaths = {
  alerts: paths.alerts,
  preferences: paths.alertPreferences,
  outbox: paths.adminOutbox,
} as const;

export interface OutboxListParams {
  status?: OutboxStatus;
  q: string;
  page: number;
  pageSize: number;
}

export const alertKeys = {
  all: ['alerts'] as const,
  current: (kind?: AlertKind) => [...alertKeys.all, 'current', kind ?? 'all'] as const,
  preferences: () => [...alertKeys.all, 'preferences'] as const,
  outbox: () => [...alertKeys.all, 'outbox'] as const,
  outboxList: (params: OutboxListParams) => [...alertKeys.outbox(), 'list', params] as const,
  outboxMessage: (id: number) => [...alertKeys.outbox(), 'message', id] as const,
};

export const currentAlertsQueryOptions = (kind?: AlertKind) =>
  queryOptions({
    queryKey: alertKeys.current(kind),
    queryFn: ({ signal }) => api.get(withQuery('/api/alerts', { kind }), alertListSchema, signal),
    // Conditions change with every draw anywhere in the lab.
    refetchInterval: 60_000,
  });

export function useCurrentAlerts(kind?: AlertKind) {
  return useQuery(currentAlertsQueryOptions(kind));
}

export function useAlertPreferences() {
  return useQuery({
    queryKey: alertKeys.preferences(),
    queryFn: ({ signal }) => api.get('/api/alerts/preferences', alertPreferencesSchema, signal),
  });
}

export function useSaveAlertPreferences() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: AlertPreferencesBody) =>
      apiRequest('/api/alerts/preferences', {
        method: 'PUT',
        body,
        schema: alertPreferencesSchema,
      }),
    onSuccess: (saved) => queryClient.setQueryData(alertKeys.preferences(), saved),
  });
}

const outboxPageSchema = pageSchema(outboxMessageSchema);

export function useOutbox(params: OutboxListParams) {
  return useQuery({
    queryKey: alertKeys.outboxList(params),
    queryFn: ({ signal }) =>
      api.get(
        withQuery('/api/outbox', { ...params, sort: 'createdAt.desc' }),
        outboxPageSchema,
        signal,
      ),
    placeholderData: keepPreviousData,
  });
}

export function useOutboxMessage(id: number | null) {
  return useQuery({
    queryKey: alertKeys.outboxMessage(id ?? 0),
    queryFn: ({ signal }) => api.get(`/api/outbox/${id}`, outboxMessageDetailSchema, signal),
    enabled: id !== null,
  });
}

export function useResendOutboxMessage() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number) =>
      api.post(`/api/outbox/${id}/resend`, undefined, outboxMessageDetailSchema),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: alertKeys.outbox() });
    },
  });
}

export function useEvaluateAlerts() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.post('/api/alerts/evaluate', undefined, alertEvaluationSchema),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: alertKeys.all });
    },
  });
}
