import {
  chemicalSortFields,
  ghsCodeSchema,
  physicalStateSchema,
  storageGroupSchema,
} from '@lotwise/shared';
import { useListSearchParams } from '../../lib/list-search-params';
import type { ChemicalListParams } from './api';

const sortValues = chemicalSortFields.flatMap((field) => [`${field}.asc`, `${field}.desc`]);
const filterKeys = ['storageGroup', 'pictogram', 'physicalState'] as const;
export type ChemicalFilterKey = (typeof filterKeys)[number];

/** The chemicals list's table state, read from and written to the URL. */
export function useChemicalListParams() {
  const { params, update, clear } = useListSearchParams<ChemicalFilterKey>({
    defaultSort: 'name.asc',
    sortValues,
    filterKeys,
  });
  // Unknown filter values in a hand-edited URL are ignored rather than sent to the server.
  const storageGroup = storageGroupSchema.safeParse(params.filters.storageGroup);
  const pictogram = ghsCodeSchema.safeParse(params.filters.pictogram);
  const physicalState = physicalStateSchema.safeParse(params.filters.physicalState);
  const query: ChemicalListParams = {
    q: params.q,
    sort: params.sort,
    page: params.page,
    pageSize: params.pageSize,
    storageGroup: storageGroup.success ? storageGroup.data : undefined,
    pictogram: pictogram.success ? pictogram.data : undefined,
    physicalState: physicalState.success ? physicalState.data : undefined,
  };
  const filtered = Boolean(query.q || query.storageGroup || query.pictogram || query.physicalState);
  return { query, filtered, update, clear };
}
