import {
  keepPreviousData,
  queryOptions,
  useMutation,
  useQuery,
  useQueryClient,
} from '@tanstack/react-query';
import {
  chemicalSchema,
  pageSchema,
  type Chemical,
  type ChemicalCreate,
  type ChemicalPatch,
  type GhsCode,
  type PhysicalState,
  type StorageGroup,
} from '@lotwise/shared';
import { api, withQuery } from '../../lib/api-client';

/** Exactly what a list request asks the server; it is also the cache key. */
export interface ChemicalListParams {
  q: string;
  sort: string;
  page: number;
  pageSize: number;
  storageGroup?: StorageGroup;
  pictogram?: GhsCode;
  physicalState?: PhysicalState;
}

export const chemicalKeys = {
  all: ['chemicals'] as const,
  lists: () => [...chemicalKeys.all, 'list'] as const,
  list: (params: ChemicalListParams) => [...chemicalKeys.lists(), params] as const,
  details: () => [...chemicalKeys.all, 'detail'] as const,
  detail: (id: number) => [...chemicalKeys.details(), id] as const,
};

const chemicalPageSchema = pageSchema(chemicalSchema);

export const chemicalsQueryOptions = (params: ChemicalListParams) =>
  queryOptions({
    queryKey: chemicalKeys.list(params),
    queryFn: ({ signal }) =>
      api.get(withQuery('/api/chemicals', { ...params }), chemicalPageSchema, signal),
    // Keep the previous page on screen while the next one loads: no flashing table.
    placeholderData: keepPreviousData,
  });

export function useChemicals(params: ChemicalListParams) {
  return useQuery(chemicalsQueryOptions(params));
}

export const chemicalQueryOptions = (id: number) =>
  queryOptions({
    queryKey: chemicalKeys.detail(id),
    queryFn: ({ signal }) => api.get(`/api/chemicals/${id}`, chemicalSchema, signal),
  });

export function useChemical(id: number) {
  return useQuery(chemicalQueryOptions(id));
}

export function useCreateChemical() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: ChemicalCreate) => api.post('/api/chemicals', body, chemicalSchema),
    onSuccess: async (chemical: Chemical) => {
      queryClient.setQueryData(chemicalKeys.detail(chemical.id), chemical);
      await queryClient.invalidateQueries({ queryKey: chemicalKeys.lists() });
    },
  });
}

export function useUpdateChemical(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (patch: ChemicalPatch) => api.patch(`/api/chemicals/${id}`, patch, chemicalSchema),
    onSuccess: async (chemical: Chemical) => {
      queryClient.setQueryData(chemicalKeys.detail(chemical.id), chemical);
      await queryClient.invalidateQueries({ queryKey: chemicalKeys.lists() });
    },
  });
}

export function useDeleteChemical() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api.delete(`/api/chemicals/${id}`),
    onSuccess: async (_data, id) => {
      queryClient.removeQueries({ queryKey: chemicalKeys.detail(id) });
      await queryClient.invalidateQueries({ queryKey: chemicalKeys.lists() });
    },
  });
}
