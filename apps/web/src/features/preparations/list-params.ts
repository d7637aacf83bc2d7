import {
  planSortFields,
  planStatusSchema,
  procedureSortFields,
  runSortFields,
} from '@lotwise/shared';
import { useListSearchParams } from '../../lib/list-search-params';
import type { PlanListParams, ProcedureListParams, RunListParams } from './api';

const sortValuesOf = (fields: readonly string[]) =>
  fields.flatMap((field) => [`${field}.asc`, `${field}.desc`]);

function positiveInt(value: string | undefined): number | undefined {
  if (value === undefined) return undefined;
  const n = Number(value);
  return Number.isInteger(n) && n > 0 ? n : undefined;
}

const procedureSortValues = sortValuesOf(procedureSortFields);
const noFilters = [] as const;

export function useProcedureListParams() {
  const { params, update, clear } = useListSearchParams<never>({
    defaultSort: 'title.asc',
    sortValues: procedureSortValues,
    filterKeys: noFilters,
  });
  const query: ProcedureListParams = {
    q: params.q,
    sort: params.sort,
    page: params.page,
    pageSize: params.pageSize,
  };
  return { query, update, clear };
}

const planSortValues = sortValuesOf(planSortFields);
const planFilterKeys = ['status', 'procedureId'] as const;

export function usePlanListParams() {
  const { params, update } = useListSearchParams<(typeof planFilterKeys)[number]>({
    defaultSort: 'plannedOn.desc',
    sortValues: planSortValues,
    filterKeys: planFilterKeys,
  });
  const status = planStatusSchema.safeParse(params.filters.status);
  const query: PlanListParams = {
    sort: params.sort,
    page: params.page,
    pageSize: params.pageSize,
    status: status.success ? status.data : undefined,
    procedureId: positiveInt(params.filters.procedureId),
  };
  return { query, update };
}

const runSortValues = sortValuesOf(runSortFields);
const runFilterKeys = ['procedureId'] as const;

export function useRunListParams() {
  const { params, update } = useListSearchParams<(typeof runFilterKeys)[number]>({
    defaultSort: 'createdAt.desc',
    sortValues: runSortValues,
    filterKeys: runFilterKeys,
  });
  const query: RunListParams = {
    sort: params.sort,
    page: params.page,
    pageSize: params.pageSize,
    procedureId: positiveInt(params.filters.procedureId),
  };
  return { query, update };
}
