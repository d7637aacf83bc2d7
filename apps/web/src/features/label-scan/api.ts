import { containerDetailSchema } from '@lotwise/shared';
import { api } from '../../lib/api-client';

/** The container a label code belongs to (404 when none has it). */
export const fetchContainerByLabel = (labelCode: string, signal?: AbortSignal) =>
  api.get(
    `/api/containers/by-label/${encodeURIComponent(labelCode)}`,
    containerDetailSchema,
    signal,
  );
