import {
  keepPreviousData,
  queryOptions,
  useMutation,
  useQueries,
  useQuery,
  useQueryClient,
} from '@tanstack/react-query';
import {
  chemicalSchema,
  containerChangeSchema,
  containerDetailSchema,
  containerSchema,
  ledgerEntrySchema,
  locationDetailSchema,
  locationSchema,
  pageSchema,
  segregationConflictsResponseSchema,
  stockHistorySchema,
  stockItemSchema,
  stocktakeExpectedSchema,
  stocktakeSchema,
  lotSchema,
  type Adjustment,
  type ContainerCreate,
  type LotCreate,
  type ContainerChange,
  type ContainerPatch,
  type ContainerStatus,
  type Disposal,
  type Draw,
  type LocationCreate,
  type LocationPatch,
  type Split,
  type StocktakeCreate,
  type StorageGroup,
  type Transfer,
} from '@lotwise/shared';
import { api, withQuery } from '../../lib/api-client';
import { uploadFile, type UploadProgress } from '../../lib/upload';

/** Exactly what the stock overview asks the server; it is also the cache key. */
export interface StockListParams {
  q: string;
  sort: string;
  page: number;
  pageSize: number;
  locationId?: number;
  storageGroup?: StorageGroup;
  belowReorderPoint?: boolean;
  expiringWithinDays?: number;
}

/** Exactly what the containers list asks the server. */
export interface ContainerListParams {
  q: string;
  sort: string;
  page: number;
  pageSize: number;
  locationId?: number;
  chemicalId?: number;
  status?: ContainerStatus;
  storageGroup?: StorageGroup;
  expiringWithinDays?: number;
  expired?: boolean;
  belowReorderPoint?: boolean;
  peroxideDue?: boolean;
}

/** Every stock query sits under `['stock']`, so one invalidation refreshes all of stock. */
export const stockKeys = {
  all: ['stock'] as const,
  overview: (params: StockListParams) => [...stockKeys.all, 'overview', params] as const,
  containerLists: () => [...stockKeys.all, 'containers', 'list'] as const,
  containerList: (params: ContainerListParams) => [...stockKeys.containerLists(), params] as const,
  container: (id: number) => [...stockKeys.all, 'containers', 'detail', id] as const,
  containerByLabel: (labelCode: string) =>
    [...stockKeys.all, 'containers', 'by-label', labelCode] as const,
  ledger: (id: number, page: number, pageSize: number) =>
    [...stockKeys.all, 'containers', 'ledger', id, { page, pageSize }] as const,
  history: (chemicalId: number, days: number) =>
    [...stockKeys.all, 'history', chemicalId, days] as const,
  locations: () => [...stockKeys.all, 'locations', 'list'] as const,
  location: (id: number) => [...stockKeys.all, 'locations', 'detail', id] as const,
  conflicts: () => [...stockKeys.all, 'segregation'] as const,
  stocktake: (locationId: number, includeSublocations: boolean) =>
    [...stockKeys.all, 'stocktake', locationId, includeSublocations] as const,
  chemical: (id: number) => [...stockKeys.all, 'chemical', id] as const,
  lots: (chemicalId: number) => [...stockKeys.all, 'lots', 'list', chemicalId] as const,
  lot: (id: number) => [...stockKeys.all, 'lots', 'detail', id] as const,
};

const flag = (value: boolean | undefined) => (value === undefined ? undefined : String(value));

const stockPageSchema = pageSchema(stockItemSchema);
const containerPageSchema = pageSchema(containerSchema);
const ledgerPageSchema = pageSchema(ledgerEntrySchema);
const locationPageSchema = pageSchema(locationSchema);

export const stockOverviewQueryOptions = (params: StockListParams) =>
  queryOptions({
    queryKey: stockKeys.overview(params),
    queryFn: ({ signal }) =>
      api.get(
        withQuery('/api/stock', {
          ...params,
          belowReorderPoint: flag(params.belowReorderPoint),
        }),
        stockPageSchema,
        signal,
      ),
    placeholderData: keepPreviousData,
  });

export function useStockOverview(params: StockListParams) {
  return useQuery(stockOverviewQueryOptions(params));
}

export const containersQueryOptions = (params: ContainerListParams) =>
  queryOptions({
    queryKey: stockKeys.containerList(params),
    queryFn: ({ signal }) =>
      api.get(
        withQuery('/api/containers', {
          ...params,
          expired: flag(params.expired),
          belowReorderPoint: flag(params.belowReorderPoint),
          peroxideDue: flag(params.peroxideDue),
        }),
        containerPageSchema,
        signal,
      ),
    placeholderData: keepPreviousData,
  });

export function useContainers(params: ContainerListParams) {
  return useQuery(containersQueryOptions(params));
}

export function useContainer(id: number) {
  return useQuery(containerQuery(id));
}

const containerQuery = (id: number) => ({
  queryKey: stockKeys.container(id),
  queryFn: ({ signal }: { signal: AbortSignal }) =>
    api.get(`/api/containers/${id}`, containerDetailSchema, signal),
});

const containerByLabelQuery = (labelCode: string) => ({
  queryKey: stockKeys.containerByLabel(labelCode),
  queryFn: ({ signal }: { signal: AbortSignal }) =>
    api.get(
      `/api/containers/by-label/${encodeURIComponent(labelCode)}`,
      containerDetailSchema,
      signal,
    ),
});

export function useContainerByLabel(labelCode: string) {
  return useQuery(containerByLabelQuery(labelCode));
}

/** Several containers at once, by id or by label code (a label sheet), in the order asked. */
export function useContainerSet(ids: readonly number[], labelCodes: readonly string[]) {
  return useQueries({
    queries: [...ids.map(containerQuery), ...labelCodes.map(containerByLabelQuery)],
  });
}

export function useLedger(id: number, page: number, pageSize: number) {
  return useQuery({
    queryKey: stockKeys.ledger(id, page, pageSize),
    queryFn: ({ signal }) =>
      api.get(
        withQuery(`/api/containers/${id}/ledger`, { page, pageSize }),
        ledgerPageSchema,
        signal,
      ),
    placeholderData: keepPreviousData,
  });
}

export function useStockHistory(chemicalId: number, days: number) {
  return useQuery({
    queryKey: stockKeys.history(chemicalId, days),
    queryFn: ({ signal }) =>
      api.get(
        withQuery(`/api/chemicals/${chemicalId}/stock-history`, { days }),
        stockHistorySchema,
        signal,
      ),
  });
}

/** Every location, by path (a lab has few; the server's default page holds them all). */
export function useLocations() {
  return useQuery({
    queryKey: stockKeys.locations(),
    queryFn: ({ signal }) => api.get('/api/locations', locationPageSchema, signal),
  });
}

export function useLocation(id: number) {
  return useQuery({
    queryKey: stockKeys.location(id),
    queryFn: ({ signal }) => api.get(`/api/locations/${id}`, locationDetailSchema, signal),
  });
}

export function useSegregationConflicts() {
  return useQuery({
    queryKey: stockKeys.conflicts(),
    queryFn: ({ signal }) =>
      api.get('/api/segregation/conflicts', segregationConflictsResponseSchema, signal),
  });
}

export function useStocktakeExpected(locationId: number, includeSublocations: boolean) {
  return useQuery({
    queryKey: stockKeys.stocktake(locationId, includeSublocations),
    queryFn: ({ signal }) =>
      api.get(
        withQuery(`/api/locations/${locationId}/stocktake`, {
          includeSublocations: String(includeSublocations),
        }),
        stocktakeExpectedSchema,
        signal,
      ),
    // A stocktake compares against what is recorded right now.
    staleTime: 0,
  });
}

/**
 * A write to one container. The answer holds the saved container, which goes straight into
 * the cache; everything else about stock (lists, totals, ledger, conflicts) is refetched.
 */
function useContainerWrite<TBody>(id: number, action: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: TBody) =>
      api.post(`/api/containers/${id}/${action}`, body, containerChangeSchema),
    onSuccess: async (change: ContainerChange) => {
      queryClient.setQueryData(stockKeys.container(id), change.container);
      await queryClient.invalidateQueries({ queryKey: stockKeys.all });
    },
  });
}

export const useRecordDraw = (id: number) => useContainerWrite<Draw>(id, 'draws');
export const useAdjustContainer = (id: number) => useContainerWrite<Adjustment>(id, 'adjustments');
export const useSplitContainer = (id: number) => useContainerWrite<Split>(id, 'splits');
export const useTransferContainer = (id: number) => useContainerWrite<Transfer>(id, 'transfers');
export const useDisposeContainer = (id: number) => useContainerWrite<Disposal>(id, 'disposal');

/** Details that are not quantity or place (`PATCH /api/containers/:id`). */
export function useUpdateContainer(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (patch: ContainerPatch) =>
      api.patch(`/api/containers/${id}`, patch, containerDetailSchema),
    onSuccess: () => queryClient.invalidateQueries(),
  });
}

export function useCreateLocation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: LocationCreate) => api.post('/api/locations', body, locationSchema),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: stockKeys.all }),
  });
}

export function useUpdateLocation(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (patch: LocationPatch) => api.patch(`/api/locations/${id}`, patch, locationSchema),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: stockKeys.all }),
  });
}

export function useDeleteLocation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api.delete(`/api/locations/${id}`),
    onSuccess: async (_data, id) => {
      queryClient.removeQueries({ queryKey: stockKeys.location(id) });
      await queryClient.invalidateQueries({ queryKey: stockKeys.all });
    },
  });
}

export function useCommitStocktake() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: StocktakeCreate) => api.post('/api/stocktakes', body, stocktakeSchema),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: stockKeys.all }),
  });
}

/** The chemical itself (identity and hazards) as the chemical stock page shows it. */
export function useStockChemical(id: number) {
  return useQuery({
    queryKey: stockKeys.chemical(id),
    queryFn: ({ signal }) => api.get(`/api/chemicals/${id}`, chemicalSchema, signal),
  });
}

/**
 * One chemical's line of the stock overview. The overview has no filter by id, so it is
 * looked up by name and picked out by id.
 */
export function useChemicalStockItem(id: number, name: string | undefined) {
  return useQuery({
    queryKey: [...stockKeys.all, 'overview', 'chemical', id, name] as const,
    enabled: Boolean(name),
    queryFn: async ({ signal }) => {
      const found = await api.get(
        withQuery('/api/stock', { q: name, pageSize: 200 }),
        stockPageSchema,
        signal,
      );
      return found.items.find((item) => item.chemical.id === id) ?? null;
    },
  });
}

const lotPageSchema = pageSchema(lotSchema);

/** The lots of one chemical, newest first (receiving into a lot already recorded). */
export function useChemicalLots(chemicalId: number | undefined) {
  return useQuery({
    queryKey: stockKeys.lots(chemicalId ?? 0),
    enabled: chemicalId !== undefined,
    queryFn: ({ signal }) =>
      api.get(
        withQuery('/api/lots', { chemicalId, sort: 'receivedOn.desc', pageSize: 50 }),
        lotPageSchema,
        signal,
      ),
  });
}

export function useLot(id: number) {
  return useQuery({
    queryKey: stockKeys.lot(id),
    queryFn: ({ signal }) => api.get(`/api/lots/${id}`, lotSchema, signal),
  });
}

export const createLot = (body: LotCreate) => api.post('/api/lots', body, lotSchema);
export const deleteLot = (id: number) => api.delete(`/api/lots/${id}`);
export const createContainer = (body: ContainerCreate) =>
  api.post('/api/containers', body, containerChangeSchema);

/** Where a stored file of a chemical (its SDS) or a lot (its certificate) lives. */
export const storedFileUrls = {
  sds: (chemicalId: number) => `/api/chemicals/${chemicalId}/sds`,
  certificate: (lotId: number) => `/api/lots/${lotId}/certificate`,
};

/**
 * Upload (replacing any earlier file) and delete of an SDS or a certificate. The answer is
 * not relied on: the chemical or lot is read again, which carries the file's details.
 */
export function useStoredFile(url: string) {
  const queryClient = useQueryClient();
  const refresh = () => queryClient.invalidateQueries({ queryKey: stockKeys.all });
  const upload = useMutation({
    mutationFn: ({ file, onProgress }: { file: File; onProgress?: (p: UploadProgress) => void }) =>
      uploadFile(url, file, { onProgress }),
    onSuccess: refresh,
  });
  const remove = useMutation({
    mutationFn: () => api.delete(url),
    onSuccess: refresh,
  });
  return { upload, remove };
}

/** CSV downloads of the lists as filtered on screen (all rows, not one page). */
export function containersCsvUrl(params: Omit<ContainerListParams, 'page' | 'pageSize'>): string {
  return withQuery('/api/exports/containers.csv', {
    ...params,
    expired: flag(params.expired),
    belowReorderPoint: flag(params.belowReorderPoint),
    peroxideDue: flag(params.peroxideDue),
  });
}

export function chemicalsCsvUrl(params: { q: string; storageGroup?: StorageGroup }): string {
  return withQuery('/api/exports/chemicals.csv', params);
}
