import {
  containerSortFields,
  containerStatusSchema,
  stockSortFields,
  storageGroupSchema,
} from '@lotwise/shared';
import { useListSearchParams } from '../../lib/list-search-params';
import type { ContainerListParams, StockListParams } from './api';

const sortValuesOf = (fields: readonly string[]) =>
  fields.flatMap((field) => [`${field}.asc`, `${field}.desc`]);

function positiveInt(value: string | undefined): number | undefined {
  if (value === undefined) return undefined;
  const n = Number(value);
  return Number.isInteger(n) && n > 0 ? n : undefined;
}

function days(value: string | undefined): number | undefined {
  if (value === undefined) return undefined;
  const n = Number(value);
  return Number.isInteger(n) && n >= 0 && n <= 3650 ? n : undefined;
}

const yes = (value: string | undefined) => (value === 'true' ? true : undefined);

const stockSortValues = sortValuesOf(stockSortFields);
const stockFilterKeys = [
  'locationId',
  'storageGroup',
  'belowReorderPoint',
  'expiringWithinDays',
] as const;
export type StockFilterKey = (typeof stockFilterKeys)[number];

/** The stock overview's table state, read from and written to the URL. */
export function useStockListParams() {
  const { params, update, clear } = useListSearchParams<StockFilterKey>({
    defaultSort: 'name.asc',
    sortValues: stockSortValues,
    filterKeys: stockFilterKeys,
  });
  const storageGroup = storageGroupSchema.safeParse(params.filters.storageGroup);
  const query: StockListParams = {
    q: params.q,
    sort: params.sort,
    page: params.page,
    pageSize: params.pageSize,
    locationId: positiveInt(params.filters.locationId),
    storageGroup: storageGroup.success ? storageGroup.data : undefined,
    belowReorderPoint: yes(params.filters.belowReorderPoint),
    expiringWithinDays: days(params.filters.expiringWithinDays),
  };
  const filtered = Boolean(
    query.q ||
    query.locationId ||
    query.storageGroup ||
    query.belowReorderPoint ||
    query.expiringWithinDays !== undefined,
  );
  return { query, filtered, update, clear };
}

const containerSortValues = sortValuesOf(containerSortFields);
const containerFilterKeys = [
  'locationId',
  'chemicalId',
  'status',
  'storageGroup',
  'expiringWithinDays',
  'expired',
  'belowReorderPoint',
  'peroxideDue',
] as const;
export type ContainerFilterKey = (typeof containerFilterKeys)[number];

/** The containers list's table state, read from and written to the URL. */
export function useContainerListParams() {
  const { params, update, clear } = useListSearchParams<ContainerFilterKey>({
    defaultSort: 'labelCode.asc',
    sortValues: containerSortValues,
    filterKeys: containerFilterKeys,
  });
  const storageGroup = storageGroupSchema.safeParse(params.filters.storageGroup);
  const status = containerStatusSchema.safeParse(params.filters.status);
  const query: ContainerListParams = {
    q: params.q,
    sort: params.sort,
    page: params.page,
    pageSize: params.pageSize,
    locationId: positiveInt(params.filters.locationId),
    chemicalId: positiveInt(params.filters.chemicalId),
    status: status.success ? status.data : undefined,
    storageGroup: storageGroup.success ? storageGroup.data : undefined,
    expiringWithinDays: days(params.filters.expiringWithinDays),
    expired: yes(params.filters.expired),
    belowReorderPoint: yes(params.filters.belowReorderPoint),
    peroxideDue: yes(params.filters.peroxideDue),
  };
  const filtered = Boolean(
    query.q ||
    query.locationId ||
    query.chemicalId ||
    query.status ||
    query.storageGroup ||
    query.expiringWithinDays !== undefined ||
    query.expired ||
    query.belowReorderPoint ||
    query.peroxideDue,
  );
  return { query, filtered, update, clear };
}
