import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import {
  labAreaDetailSchema,
  labAreaSchema,
  ruleSetSchema,
  type LabAreaCreate,
  type LabAreaPatch,
  type RuleSetCreate,
  type RuleSetKind,
} from '@lotwise/shared';
import { api, withQuery } from '../../lib/api-client';

/**
 * Lab areas and rule sets. The location page (stock) marks a place as a lab area and the
 * lab-area pages show it, so their queries live here, where both may use them.
 */
export const roomRuleKeys = {
  all: ['room-rules'] as const,
  labAreas: () => [...roomRuleKeys.all, 'lab-areas'] as const,
  labArea: (id: number) => [...roomRuleKeys.labAreas(), id] as const,
  ruleSets: (kind?: RuleSetKind) => [...roomRuleKeys.all, 'rule-sets', kind ?? 'all'] as const,
  ruleSet: (id: number) => [...roomRuleKeys.all, 'rule-set', id] as const,
};

const labAreaListSchema = z.object({ items: z.array(labAreaSchema) });
const ruleSetListSchema = z.object({ items: z.array(ruleSetSchema) });

export const labAreasQueryOptions = () =>
  queryOptions({
    queryKey: roomRuleKeys.labAreas(),
    queryFn: ({ signal }) => api.get('/api/lab-areas', labAreaListSchema, signal),
  });

export function useLabAreas() {
  return useQuery(labAreasQueryOptions());
}

export function useLabArea(id: number) {
  return useQuery({
    queryKey: roomRuleKeys.labArea(id),
    queryFn: ({ signal }) => api.get(`/api/lab-areas/${id}`, labAreaDetailSchema, signal),
  });
}

export function useRuleSets(kind?: RuleSetKind) {
  return useQuery({
    queryKey: roomRuleKeys.ruleSets(kind),
    queryFn: ({ signal }) =>
      api.get(withQuery('/api/rule-sets', { kind }), ruleSetListSchema, signal),
  });
}

/** `id` 0: nothing to load (the query waits). */
export function useRuleSet(id: number) {
  return useQuery({
    queryKey: roomRuleKeys.ruleSet(id),
    queryFn: ({ signal }) => api.get(`/api/rule-sets/${id}`, ruleSetSchema, signal),
    enabled: id > 0,
  });
}

/** Every write here can change an area's totals, the start page and the stock pages. */
function useInvalidateAll() {
  const queryClient = useQueryClient();
  return () => queryClient.invalidateQueries();
}

export function useCreateLabArea() {
  const invalidate = useInvalidateAll();
  return useMutation({
    mutationFn: (body: LabAreaCreate) => api.post('/api/lab-areas', body, labAreaDetailSchema),
    onSuccess: invalidate,
  });
}

export function useUpdateLabArea(id: number) {
  const invalidate = useInvalidateAll();
  return useMutation({
    mutationFn: (patch: LabAreaPatch) =>
      api.patch(`/api/lab-areas/${id}`, patch, labAreaDetailSchema),
    onSuccess: invalidate,
  });
}

export function useDeleteLabArea(id: number) {
  const invalidate = useInvalidateAll();
  return useMutation({
    mutationFn: () => api.delete(`/api/lab-areas/${id}`),
    onSuccess: invalidate,
  });
}

export function useCreateRuleSet() {
  const invalidate = useInvalidateAll();
  return useMutation({
    mutationFn: (body: RuleSetCreate) => api.post('/api/rule-sets', body, ruleSetSchema),
    onSuccess: invalidate,
  });
}

export function useUpdateRuleSet(id: number) {
  const invalidate = useInvalidateAll();
  return useMutation({
    mutationFn: (patch: Partial<RuleSetCreate>) =>
      api.patch(`/api/rule-sets/${id}`, patch, ruleSetSchema),
    onSuccess: invalidate,
  });
}

export function useDeleteRuleSet(id: number) {
  const invalidate = useInvalidateAll();
  return useMutation({
    mutationFn: () => api.delete(`/api/rule-sets/${id}`),
    onSuccess: invalidate,
  });
}
