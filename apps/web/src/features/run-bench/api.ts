import { useQuery } from '@tanstack/react-query';
import {
  procedureSchema,
  runPhotoSchema,
  runSchema,
  runTimelineSchema,
  timelineAppendResultSchema,
  uploadFieldName,
  type RunPhoto,
  type TimelineAppendResult,
  type TimelineEntryInput,
} from '@lotwise/shared';
import {
  ApiError,
  api,
  checkAnswer,
  notifyUnauthenticated,
  toApiError,
} from '../../lib/api-client';

/**
 * Queries of the bench page sit under `['run-bench']`. The run and its procedure are fetched
 * here again rather than through the preparations feature (features do not import each other).
 */
export const benchKeys = {
  all: ['run-bench'] as const,
  run: (id: number) => [...benchKeys.all, 'run', id] as const,
  procedure: (id: number) => [...benchKeys.all, 'procedure', id] as const,
  timeline: (runId: number) => [...benchKeys.all, 'timeline', runId] as const,
};

/** How often the timeline is fetched again while the page is visible (other people's entries). */
export const timelineRefreshMs = 5_000;

export function useBenchRun(id: number) {
  return useQuery({
    queryKey: benchKeys.run(id),
    queryFn: ({ signal }) => api.get(`/api/runs/${id}`, runSchema, signal),
  });
}

export function useBenchProcedure(id: number | undefined) {
  return useQuery({
    queryKey: benchKeys.procedure(id ?? 0),
    enabled: id !== undefined,
    queryFn: ({ signal }) => api.get(`/api/procedures/${id}`, procedureSchema, signal),
  });
}

/** The run's timeline, fetched again every few seconds while the page is in view. */
export function useRunTimeline(runId: number) {
  return useQuery({
    queryKey: benchKeys.timeline(runId),
    queryFn: ({ signal }) => api.get(`/api/runs/${runId}/timeline`, runTimelineSchema, signal),
    refetchInterval: timelineRefreshMs,
    refetchIntervalInBackground: false,
    staleTime: 0,
  });
}

/** `POST /api/runs/:id/timeline`: one entry; a resend of its client id stores nothing new. */
export function postTimelineEntry(
  runId: number,
  entry: TimelineEntryInput,
): Promise<TimelineAppendResult> {
  return api.post(`/api/runs/${runId}/timeline`, entry, timelineAppendResultSchema);
}

/**
 * `POST /api/runs/:id/photos`: the photo as multipart `file` with its `clientId`, so that
 * sending it again after a dropped connection answers the photo already stored.
 */
export async function postRunPhoto(
  runId: number,
  clientId: string,
  photo: Blob,
  fileName: string,
): Promise<RunPhoto> {
  const body = new FormData();
  body.append('clientId', clientId);
  body.append(uploadFieldName, photo, fileName);
  let response: Response;
  try {
    response = await fetch(`/api/runs/${runId}/photos`, {
      method: 'POST',
      credentials: 'same-origin',
      headers: { Accept: 'application/json' },
      body,
    });
  } catch (_error) {
    throw new ApiError(
      0,
      'network_error',
      'Lotwise could not reach its server. Check the connection and try again.',
    );
  }
  if (!response.ok) {
    if (response.status === 401) notifyUnauthenticated();
    throw await toApiError(response);
  }
  return checkAnswer(response.status, await response.json(), runPhotoSchema);
}
