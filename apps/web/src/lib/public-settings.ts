import { queryOptions, useQuery } from '@tanstack/react-query';
import { publicSettingsSchema } from '@lotwise/shared';
import { api } from './api-client';

export const publicSettingsQueryOptions = () =>
  queryOptions({
    queryKey: ['settings', 'public'] as const,
    queryFn: ({ signal }) => api.get('/api/settings/public', publicSettingsSchema, signal),
    // Set at the server's start: it does not change while the page is open.
    staleTime: Infinity,
  });

/** The lab's public set-up (its address, `PUBLIC_URL`), read once per page load. */
export function usePublicSettings() {
  return useQuery(publicSettingsQueryOptions());
}
