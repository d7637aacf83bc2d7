import { useQuery } from '@tanstack/react-query';
import { runTimelineSchema } from '@lotwise/shared';
import { api } from '../../lib/api-client';

export const runNotebookKeys = {
  timeline: (runId: number) => ['runs', 'timeline', runId] as const,
};

/** How often an open run's timeline is fetched again, so a second device follows along. */
const followEveryMs = 15_000;

/** A run's timeline; `follow` refreshes it while the run is still under way. */
export function useRunTimeline(runId: number, { follow = false }: { follow?: boolean } = {}) {
  return useQuery({
    queryKey: runNotebookKeys.timeline(runId),
    queryFn: ({ signal }) => api.get(`/api/runs/${runId}/timeline`, runTimelineSchema, signal),
    refetchInterval: follow ? followEveryMs : false,
  });
}
