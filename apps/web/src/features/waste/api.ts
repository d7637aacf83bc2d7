import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import {
  wasteAreaSchema,
  wasteContainerDetailSchema,
  wasteContainerSchema,
  wastePickupSchema,
  type WasteAdditionCreate,
  type WasteContainerCreate,
  type WastePickupCreate,
} from '@lotwise/shared';
import { z } from 'zod';
import { api, apiRequest, withQuery } from '../../lib/api-client';

export const wasteKeys = {
  all: ['waste'] as const,
  areas: () => [...wasteKeys.all, 'areas'] as const,
  open: (compatibleWith?: string) => [...wasteKeys.all, 'open', compatibleWith ?? ''] as const,
  container: (id: number) => [...wasteKeys.all, 'container', id] as const,
  pickups: () => [...wasteKeys.all, 'pickups'] as const,
};

export const wasteAreasQueryOptions = () =>
  queryOptions({
    queryKey: wasteKeys.areas(),
    queryFn: ({ signal }) => api.get('/api/waste-areas', z.array(wasteAreaSchema), signal),
  });

export function useWasteAreas() {
  return useQuery(wasteAreasQueryOptions());
}

/** Open waste containers; with chemical ids, only those they may go into. */
export function useOpenWasteContainers(chemicalIds: number[] = []) {
  const compatibleWith = chemicalIds.length ? chemicalIds.join(',') : undefined;
  return useQuery({
    queryKey: wasteKeys.open(compatibleWith),
    queryFn: ({ signal }) =>
      api.get(
        withQuery('/api/waste-containers', { compatibleWith }),
        z.array(wasteContainerSchema),
        signal,
      ),
  });
}

export function useWasteContainer(id: number) {
  return useQuery({
    queryKey: wasteKeys.container(id),
    queryFn: ({ signal }) =>
      api.get(`/api/waste-containers/${id}`, wasteContainerDetailSchema, signal),
  });
}

export function useWastePickups() {
  return useQuery({
    queryKey: wasteKeys.pickups(),
    queryFn: ({ signal }) => api.get('/api/waste-pickups', z.array(wastePickupSchema), signal),
  });
}

export function useAddWaste(id: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (body: WasteAdditionCreate) =>
      api.post(`/api/waste-containers/${id}/additions`, body, wasteContainerDetailSchema),
    onSuccess: () => client.invalidateQueries({ queryKey: wasteKeys.all }),
  });
}

export function useRecordPickup() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (body: WastePickupCreate) =>
      api.post('/api/waste-pickups', body, wastePickupSchema),
    onSuccess: () => client.invalidateQueries({ queryKey: wasteKeys.all }),
  });
}

/** Waste counts toward lab areas (ignitable waste) and the start page: refresh everything. */
function useInvalidateAll() {
  const client = useQueryClient();
  return () => client.invalidateQueries();
}

export function useCreateWasteContainer() {
  const invalidate = useInvalidateAll();
  return useMutation({
    mutationFn: (body: WasteContainerCreate) =>
      api.post('/api/waste-containers', body, wasteContainerDetailSchema),
    onSuccess: invalidate,
  });
}

/** Marks a place as a waste accumulation area, or changes its rule set (`ruleSetId`). */
export function usePutWasteArea() {
  const invalidate = useInvalidateAll();
  return useMutation({
    mutationFn: ({ locationId, ruleSetId }: { locationId: number; ruleSetId: number | null }) =>
      apiRequest(`/api/waste-areas/${locationId}`, {
        method: 'PUT',
        body: { ruleSetId },
        schema: z.array(wasteAreaSchema),
      }),
    onSuccess: invalidate,
  });
}

export function useDeleteWasteArea(locationId: number) {
  const invalidate = useInvalidateAll();
  return useMutation({
    mutationFn: () => api.delete(`/api/waste-areas/${locationId}`),
    onSuccess: invalidate,
  });
}
