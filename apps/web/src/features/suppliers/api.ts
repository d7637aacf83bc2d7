import {
  keepPreviousData,
  queryOptions,
  useMutation,
  useQuery,
  useQueryClient,
} from '@tanstack/react-query';
import {
  catalogItemSchema,
  pageSchema,
  supplierPageSchema,
  supplierSchema,
  type CatalogItemCreate,
  type CatalogItemPatch,
  type SupplierCreate,
  type SupplierPatch,
} from '@lotwise/shared';
import { api, withQuery } from '../../lib/api-client';

/** Exactly what a supplier list request asks the server; it is also the cache key. */
export interface SupplierListParams {
  q: string;
  sort: string;
  page: number;
  pageSize: number;
  archived?: 'true' | 'false';
}

/** Exactly what a catalogue list request asks the server; it is also the cache key. */
export interface CatalogListParams {
  q: string;
  sort: string;
  page: number;
  pageSize: number;
  supplierId?: number;
  chemicalId?: number;
  discontinued?: 'true' | 'false';
}

export const supplierKeys = {
  all: ['suppliers'] as const,
  lists: () => [...supplierKeys.all, 'list'] as const,
  list: (params: SupplierListParams) => [...supplierKeys.lists(), params] as const,
  detail: (id: number) => [...supplierKeys.all, 'detail', id] as const,
};

export const catalogKeys = {
  all: ['catalog-items'] as const,
  lists: () => [...catalogKeys.all, 'list'] as const,
  list: (params: CatalogListParams) => [...catalogKeys.lists(), params] as const,
};

const catalogPageSchema = pageSchema(catalogItemSchema);

export const suppliersQueryOptions = (params: SupplierListParams) =>
  queryOptions({
    queryKey: supplierKeys.list(params),
    queryFn: ({ signal }) =>
      api.get(withQuery('/api/suppliers', { ...params }), supplierPageSchema, signal),
    placeholderData: keepPreviousData,
  });

export function useSuppliers(params: SupplierListParams) {
  return useQuery(suppliersQueryOptions(params));
}

export function useSupplier(id: number) {
  return useQuery({
    queryKey: supplierKeys.detail(id),
    queryFn: ({ signal }) => api.get(`/api/suppliers/${id}`, supplierSchema, signal),
  });
}

export function useCatalogItems(params: CatalogListParams) {
  return useQuery({
    queryKey: catalogKeys.list(params),
    queryFn: ({ signal }) =>
      api.get(withQuery('/api/catalog-items', { ...params }), catalogPageSchema, signal),
    placeholderData: keepPreviousData,
  });
}

/** Suppliers and catalogue change together (counts, names): refresh both after a write. */
function useRefresh() {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: supplierKeys.all }),
      queryClient.invalidateQueries({ queryKey: catalogKeys.all }),
    ]);
}

export function useCreateSupplier() {
  const refresh = useRefresh();
  return useMutation({
    mutationFn: (body: SupplierCreate) => api.post('/api/suppliers', body, supplierSchema),
    onSuccess: refresh,
  });
}

export function useUpdateSupplier(id: number) {
  const refresh = useRefresh();
  return useMutation({
    mutationFn: (patch: SupplierPatch) => api.patch(`/api/suppliers/${id}`, patch, supplierSchema),
    onSuccess: refresh,
  });
}

export function useDeleteSupplier(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.delete(`/api/suppliers/${id}`),
    onSuccess: async () => {
      queryClient.removeQueries({ queryKey: supplierKeys.detail(id) });
      await queryClient.invalidateQueries({ queryKey: supplierKeys.lists() });
    },
  });
}

export function useSaveCatalogItem(id: number | null) {
  const refresh = useRefresh();
  return useMutation({
    mutationFn: (body: CatalogItemCreate | CatalogItemPatch) =>
      id === null
        ? api.post('/api/catalog-items', body, catalogItemSchema)
        : api.patch(`/api/catalog-items/${id}`, body, catalogItemSchema),
    onSuccess: refresh,
  });
}

export function useUpdateCatalogItem() {
  const refresh = useRefresh();
  return useMutation({
    mutationFn: ({ id, patch }: { id: number; patch: CatalogItemPatch }) =>
      api.patch(`/api/catalog-items/${id}`, patch, catalogItemSchema),
    onSuccess: refresh,
  });
}

export function useDeleteCatalogItem() {
  const refresh = useRefresh();
  return useMutation({
    mutationFn: (id: number) => api.delete(`/api/catalog-items/${id}`),
    onSuccess: refresh,
  });
}
