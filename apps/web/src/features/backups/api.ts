import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { backupListSchema, backupTakenSchema } from '@lotwise/shared';
import { api } from '../../lib/api-client';

export const backupKeys = {
  all: ['backups'] as const,
  list: () => [...backupKeys.all, 'list'] as const,
};

export const backupsQueryOptions = () =>
  queryOptions({
    queryKey: backupKeys.list(),
    queryFn: ({ signal }) => api.get('/api/backups', backupListSchema, signal),
    // While the server is taking a backup (on its schedule, or someone else's), look again soon.
    refetchInterval: (query) => (query.state.data?.running ? 2000 : false),
  });

export function useBackups() {
  return useQuery(backupsQueryOptions());
}

export function useTakeBackup() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.post('/api/backups', undefined, backupTakenSchema),
    onSettled: () => queryClient.invalidateQueries({ queryKey: backupKeys.all }),
  });
}

/** The download address of a backup (the browser saves it under its own name). */
export function backupDownloadUrl(name: string): string {
  return `/api/backups/${encodeURIComponent(name)}/download`;
}
