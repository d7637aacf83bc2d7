import { useCallback, useMemo } from 'react';
import { useSearchParams } from 'react-router';

export const pageSizeOptions = [10, 25, 50, 100] as const;
const defaultPageSize = 25;

export interface ListParams<F extends string> {
  q: string;
  /** `field.asc` or `field.desc`. */
  sort: string;
  page: number;
  pageSize: number;
  filters: Partial<Record<F, string>>;
}

export interface ListParamsChange<F extends string> {
  q?: string;
  sort?: string;
  page?: number;
  pageSize?: number;
  filters?: Partial<Record<F, string | undefined>>;
}

function positiveInt(value: string | null, fallback: number): number {
  const n = Number(value);
  return Number.isInteger(n) && n > 0 ? n : fallback;
}

/**
 * Reads and writes a list's table state (search, sort, page, page size, filters) in the URL
 * search params, so a list can be bookmarked, shared and restored with Back. Defaults are
 * left out of the URL. Changing anything but the page starts again at page 1.
 */
export function useListSearchParams<F extends string>(options: {
  defaultSort: string;
  sortValues: readonly string[];
  filterKeys: readonly F[];
}) {
  const [searchParams, setSearchParams] = useSearchParams();
  const { defaultSort, sortValues, filterKeys } = options;

  const params = useMemo<ListParams<F>>(() => {
    const sort = searchParams.get('sort');
    const pageSize = positiveInt(searchParams.get('pageSize'), defaultPageSize);
    const filters: Partial<Record<F, string>> = {};
    for (const key of filterKeys) {
      const value = searchParams.get(key);
      if (value) filters[key] = value;
    }
    return {
      q: searchParams.get('q') ?? '',
      sort: sort && sortValues.includes(sort) ? sort : defaultSort,
      page: positiveInt(searchParams.get('page'), 1),
      pageSize: (pageSizeOptions as readonly number[]).includes(pageSize)
        ? pageSize
        : defaultPageSize,
      filters,
    };
  }, [searchParams, defaultSort, sortValues, filterKeys]);

  const update = useCallback(
    (change: ListParamsChange<F>, navigateOptions: { replace?: boolean } = {}) => {
      setSearchParams(
        (previous) => {
          const next = new URLSearchParams(previous);
          const set = (key: string, value: string | undefined, fallback?: string) => {
            if (value === undefined || value === '' || value === fallback) next.delete(key);
            else next.set(key, value);
          };
          if (change.q !== undefined) set('q', change.q.trim());
          if (change.sort !== undefined) set('sort', change.sort, defaultSort);
          if (change.pageSize !== undefined)
            set('pageSize', String(change.pageSize), String(defaultPageSize));
          if (change.filters) {
            for (const [key, value] of Object.entries(change.filters))
              set(key, value as string | undefined);
          }
          const onlyPage = change.page !== undefined && Object.keys(change).length === 1;
          set('page', onlyPage ? String(change.page) : undefined, '1');
          return next;
        },
        { replace: navigateOptions.replace ?? false },
      );
    },
    [setSearchParams, defaultSort],
  );

  const clear = useCallback(() => {
    setSearchParams((previous) => {
      const next = new URLSearchParams(previous);
      for (const key of ['q', 'page', ...filterKeys]) next.delete(key);
      return next;
    });
  }, [setSearchParams, filterKeys]);

  return { params, update, clear };
}
