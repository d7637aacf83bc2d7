import { keepPreviousData, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import {
  chemicalSchema,
  chemicalUsageSchema,
  containerSchema,
  dispensingSheetSchema,
  locationSchema,
  lotProvenanceSchema,
  pageSchema,
  planDetailSchema,
  planPreviewSchema,
  planSchema,
  procedureRunsSchema,
  procedureSchema,
  runSchema,
  runSummarySchema,
  scaledProcedureSchema,
  type PlanCreate,
  type PlanStatus,
  type ProcedureCreate,
  type ProcedurePatch,
  type ReservationCreate,
  type RunCreate,
  type RunRecord,
} from '@lotwise/shared';
import { api, withQuery } from '../../lib/api-client';

export interface ProcedureListParams {
  q: string;
  sort: string;
  page: number;
  pageSize: number;
}

export interface PlanListParams {
  sort: string;
  page: number;
  pageSize: number;
  status?: PlanStatus;
  procedureId?: number;
}

export interface RunListParams {
  sort: string;
  page: number;
  pageSize: number;
  procedureId?: number;
}

/** What `GET /api/procedures/:id/scaled` is asked: a factor, or a target mass. */
export type ScaleRequest =
  | { factor: string }
  | { targetLimitingMass: number; unit: string }
  | { targetProductMass: number; unit: string; basis: 'theoretical' | 'expected' };

/**
 * Every query of preparations sits under `['preparations']`. Reserving and recording
 * change stock too, so they also refresh everything under `['stock']` (the stock pages'
 * root key; named here rather than imported, as features do not import each other).
 */
export const preparationKeys = {
  all: ['preparations'] as const,
  procedures: (params: ProcedureListParams) =>
    [...preparationKeys.all, 'procedures', 'list', params] as const,
  procedure: (id: number) => [...preparationKeys.all, 'procedures', 'detail', id] as const,
  scaled: (id: number, request: ScaleRequest) =>
    [...preparationKeys.all, 'procedures', 'scaled', id, request] as const,
  procedureRuns: (id: number) => [...preparationKeys.all, 'procedures', 'runs', id] as const,
  plans: (params: PlanListParams) => [...preparationKeys.all, 'plans', 'list', params] as const,
  plan: (id: number) => [...preparationKeys.all, 'plans', 'detail', id] as const,
  dispensing: (id: number) => [...preparationKeys.all, 'plans', 'dispensing', id] as const,
  runs: (params: RunListParams) => [...preparationKeys.all, 'runs', 'list', params] as const,
  run: (id: number) => [...preparationKeys.all, 'runs', 'detail', id] as const,
  usage: (chemicalId: number) => [...preparationKeys.all, 'usage', chemicalId] as const,
  provenance: (lotId: number) => [...preparationKeys.all, 'provenance', lotId] as const,
  containers: (chemicalId: number) => [...preparationKeys.all, 'containers', chemicalId] as const,
  locations: () => [...preparationKeys.all, 'locations'] as const,
};
const stockRootKey = ['stock'] as const;

const procedurePageSchema = pageSchema(procedureSchema);
const planPageSchema = pageSchema(planSchema);
const runPageSchema = pageSchema(runSummarySchema);
const containerPageSchema = pageSchema(containerSchema);
const locationPageSchema = pageSchema(locationSchema);

export function useProcedures(params: ProcedureListParams) {
  return useQuery({
    queryKey: preparationKeys.procedures(params),
    queryFn: ({ signal }) =>
      api.get(withQuery('/api/procedures', { ...params }), procedurePageSchema, signal),
    placeholderData: keepPreviousData,
  });
}

export function useProcedure(id: number | undefined) {
  return useQuery({
    queryKey: preparationKeys.procedure(id ?? 0),
    enabled: id !== undefined,
    queryFn: ({ signal }) => api.get(`/api/procedures/${id}`, procedureSchema, signal),
  });
}

export function useScaledProcedure(id: number, request: ScaleRequest | null) {
  return useQuery({
    queryKey: preparationKeys.scaled(id, request ?? { factor: '1' }),
    enabled: request !== null,
    queryFn: ({ signal }) =>
      api.get(
        withQuery(`/api/procedures/${id}/scaled`, { ...request }),
        scaledProcedureSchema,
        signal,
      ),
    placeholderData: keepPreviousData,
    retry: false,
  });
}

export function useProcedureRuns(id: number) {
  return useQuery({
    queryKey: preparationKeys.procedureRuns(id),
    queryFn: ({ signal }) => api.get(`/api/procedures/${id}/runs`, procedureRunsSchema, signal),
  });
}

export function useCreateProcedure() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: ProcedureCreate) => api.post('/api/procedures', body, procedureSchema),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: preparationKeys.all }),
  });
}

export function useUpdateProcedure(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: ProcedurePatch) => api.patch(`/api/procedures/${id}`, body, procedureSchema),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: preparationKeys.all }),
  });
}

export function usePlans(params: PlanListParams) {
  return useQuery({
    queryKey: preparationKeys.plans(params),
    queryFn: ({ signal }) =>
      api.get(withQuery('/api/plans', { ...params }), planPageSchema, signal),
    placeholderData: keepPreviousData,
  });
}

export function usePlan(id: number | undefined) {
  return useQuery({
    queryKey: preparationKeys.plan(id ?? 0),
    enabled: id !== undefined,
    queryFn: ({ signal }) => api.get(`/api/plans/${id}`, planDetailSchema, signal),
  });
}

export function useDispensingSheet(id: number) {
  return useQuery({
    queryKey: preparationKeys.dispensing(id),
    queryFn: ({ signal }) => api.get(`/api/plans/${id}/dispensing`, dispensingSheetSchema, signal),
  });
}

/** The stock check a plan would have; nothing is saved. */
export function usePreviewPlan() {
  return useMutation({
    mutationFn: (body: PlanCreate) => api.post('/api/plans/preview', body, planPreviewSchema),
  });
}

export function useCreatePlan() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: PlanCreate) => api.post('/api/plans', body, planDetailSchema),
    onSuccess: (plan) => {
      queryClient.setQueryData(preparationKeys.plan(plan.id), plan);
      return queryClient.invalidateQueries({ queryKey: [...preparationKeys.all, 'plans', 'list'] });
    },
  });
}

/** Reserve and cancel answer with the whole plan again; stock availability changes too. */
function usePlanWrite<TBody>(id: number, action: 'reservations' | 'cancel') {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: TBody) => api.post(`/api/plans/${id}/${action}`, body, planDetailSchema),
    onSuccess: async (plan) => {
      queryClient.setQueryData(preparationKeys.plan(id), plan);
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: [...preparationKeys.all, 'plans', 'list'] }),
        queryClient.invalidateQueries({ queryKey: preparationKeys.dispensing(id) }),
        queryClient.invalidateQueries({ queryKey: stockRootKey }),
      ]);
    },
  });
}

export const useReservePlan = (id: number) => usePlanWrite<ReservationCreate>(id, 'reservations');
export const useCancelPlan = (id: number) => usePlanWrite<undefined>(id, 'cancel');

export function useRuns(params: RunListParams) {
  return useQuery({
    queryKey: preparationKeys.runs(params),
    queryFn: ({ signal }) => api.get(withQuery('/api/runs', { ...params }), runPageSchema, signal),
    placeholderData: keepPreviousData,
  });
}

export function useRun(id: number) {
  return useQuery({
    queryKey: preparationKeys.run(id),
    queryFn: ({ signal }) => api.get(`/api/runs/${id}`, runSchema, signal),
  });
}

export function useCreateRun() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: RunCreate) => api.post('/api/runs', body, runSchema),
    onSuccess: (run) => queryClient.setQueryData(preparationKeys.run(run.id), run),
  });
}

/** Discards an opened run (nothing of it is in the ledger); lists of runs change. */
export function useDiscardRun(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.delete(`/api/runs/${id}`),
    onSuccess: () => {
      queryClient.removeQueries({ queryKey: preparationKeys.run(id) });
      return queryClient.invalidateQueries({ queryKey: preparationKeys.all });
    },
  });
}

export function useRecordRun(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: RunRecord) => api.post(`/api/runs/${id}/record`, body, runSchema),
    onSuccess: async (run) => {
      queryClient.setQueryData(preparationKeys.run(id), run);
      await Promise.all([
        queryClient.invalidateQueries({
          queryKey: preparationKeys.all,
          predicate: (query) => query.queryKey[3] !== id,
        }),
        queryClient.invalidateQueries({ queryKey: stockRootKey }),
      ]);
    },
  });
}

export function useChemicalUsage(chemicalId: number) {
  return useQuery({
    queryKey: preparationKeys.usage(chemicalId),
    queryFn: ({ signal }) =>
      api.get(`/api/chemicals/${chemicalId}/usage`, chemicalUsageSchema, signal),
  });
}

export function useLotProvenance(lotId: number) {
  return useQuery({
    queryKey: preparationKeys.provenance(lotId),
    queryFn: ({ signal }) => api.get(`/api/lots/${lotId}/provenance`, lotProvenanceSchema, signal),
  });
}

/** The usable containers of one chemical, to name which one a run drew from. */
export function useChemicalContainers(chemicalId: number) {
  return useQuery({
    queryKey: preparationKeys.containers(chemicalId),
    queryFn: async ({ signal }) => {
      const found = await api.get(
        withQuery('/api/containers', { chemicalId, pageSize: 100, sort: 'expiresOn.asc' }),
        containerPageSchema,
        signal,
      );
      return found.items.filter((c) => c.status === 'sealed' || c.status === 'open');
    },
  });
}

/** Every location by path, to put a product portion somewhere. */
export function useLocations() {
  return useQuery({
    queryKey: preparationKeys.locations(),
    queryFn: ({ signal }) =>
      api.get(withQuery('/api/locations', { pageSize: 100 }), locationPageSchema, signal),
  });
}

/** A chemical's identity and hazards, for the history pages about it. */
export function useChemical(id: number | undefined) {
  return useQuery({
    queryKey: [...preparationKeys.all, 'chemical', id ?? 0] as const,
    enabled: id !== undefined,
    queryFn: ({ signal }) => api.get(`/api/chemicals/${id}`, chemicalSchema, signal),
  });
}
