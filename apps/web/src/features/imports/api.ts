import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { importSchema, type Import, type ImportKind, type ImportStatus } from '@lotwise/shared';
import { api, withQuery } from '../../lib/api-client';
import { sessionKeys } from '../../lib/auth';
import { uploadFile, type UploadProgress } from '../../lib/upload';

export const importKeys = {
  all: ['imports'] as const,
  detail: (id: number, errorsPage: number, errorsPageSize: number) =>
    [...importKeys.all, 'detail', id, { errorsPage, errorsPageSize }] as const,
};

/** While the server is still reading or writing rows, the import is asked again this often. */
export const pollMs = 600;
const working: readonly ImportStatus[] = ['validating', 'committing'];
export const isWorking = (status: ImportStatus) => working.includes(status);

/** One import with one page of its problems; followed while the server works on it. */
export function useImport(id: number | null, errorsPage: number, errorsPageSize: number) {
  return useQuery({
    queryKey: importKeys.detail(id ?? 0, errorsPage, errorsPageSize),
    enabled: id !== null,
    queryFn: ({ signal }) =>
      api.get(
        withQuery(`/api/imports/${id}`, { errorsPage, errorsPageSize }),
        importSchema,
        signal,
      ),
    refetchInterval: (query) =>
      query.state.data && isWorking(query.state.data.status) ? pollMs : false,
    // An import changes under our feet while it runs; never show an old state as fresh.
    staleTime: 0,
  });
}

/** Sends the CSV; the server answers with the import, checked (small files) or being checked. */
export function useUploadImport() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({
      file,
      onProgress,
      target,
    }: {
      file: File;
      onProgress: (p: UploadProgress) => void;
      /** A price list names its supplier; without a target the file is stock. */
      target?: { kind: ImportKind; supplierId: number | null };
    }) =>
      uploadFile(withQuery('/api/imports', { ...target }), file, {
        schema: importSchema,
        onProgress,
      }),
    onSuccess: (result: Import) => {
      queryClient.setQueryData(importKeys.detail(result.id, 1, result.errorsPageSize), result);
    },
  });
}

/** Writes every row of a checked import, all or nothing. */
export function useCommitImport(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.post(`/api/imports/${id}/commit`, undefined, importSchema),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: [...importKeys.all, 'detail', id] });
    },
  });
}

/** After a commit, everything about stock and chemicals may have changed. */
export function useRefreshAfterImport() {
  const queryClient = useQueryClient();
  return () =>
    queryClient.invalidateQueries({
      predicate: (query) =>
        query.queryKey[0] !== sessionKeys.all[0] && query.queryKey[0] !== importKeys.all[0],
    });
}

/** The example files shipped with Lotwise (copies of docs/examples/*.csv). */
export const exampleCsvHrefs: Record<ImportKind, string> = {
  stock: '/examples/stock-import.csv',
  'price-list': '/examples/price-list-import.csv',
};
