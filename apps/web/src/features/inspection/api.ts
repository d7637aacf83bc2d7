import { useQuery } from '@tanstack/react-query';
import { inspectionSummarySchema } from '@lotwise/shared';
import { api } from '../../lib/api-client';

export const inspectionKeys = {
  all: ['inspection'] as const,
  summary: (areaId: number) => [...inspectionKeys.all, areaId] as const,
};

/** `GET /api/lab-areas/:id/inspection`: the area's one-page summary for an inspection. */
export function useInspectionSummary(areaId: number) {
  return useQuery({
    queryKey: inspectionKeys.summary(areaId),
    queryFn: ({ signal }) =>
      api.get(`/api/lab-areas/${areaId}/inspection`, inspectionSummarySchema, signal),
  });
}
