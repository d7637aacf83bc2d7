import { catalogItemSortFields, supplierSortFields } from '@lotwise/shared';
import { useListSearchParams } from '../../lib/list-search-params';
import type { CatalogListParams, SupplierListParams } from './api';

const supplierSorts = supplierSortFields.flatMap((field) => [`${field}.asc`, `${field}.desc`]);
const catalogSorts = catalogItemSortFields.flatMap((field) => [`${field}.asc`, `${field}.desc`]);
const supplierFilters = ['archived'] as const;
const catalogFilters = ['discontinued'] as const;

const flag = (value: string | undefined) =>
  value === 'true' || value === 'false' ? value : undefined;

/** The suppliers list's table state, read from and written to the URL. */
export function useSupplierListParams() {
  const { params, update, clear } = useListSearchParams({
    defaultSort: 'name.asc',
    sortValues: supplierSorts,
    filterKeys: supplierFilters,
  });
  const query: SupplierListParams = {
    q: params.q,
    sort: params.sort,
    page: params.page,
    pageSize: params.pageSize,
    // In use only, unless the person asks for the archived ones.
    archived: flag(params.filters.archived) ?? 'false',
  };
  return { query, filtered: Boolean(query.q), update, clear };
}

/** A supplier's catalogue table state, read from and written to the URL. */
export function useCatalogListParams(supplierId: number) {
  const { params, update, clear } = useListSearchParams({
    defaultSort: 'chemical.asc',
    sortValues: catalogSorts,
    filterKeys: catalogFilters,
  });
  const query: CatalogListParams = {
    q: params.q,
    sort: params.sort,
    page: params.page,
    pageSize: params.pageSize,
    supplierId,
    discontinued: flag(params.filters.discontinued),
  };
  return { query, filtered: Boolean(query.q || query.discontinued), update, clear };
}
