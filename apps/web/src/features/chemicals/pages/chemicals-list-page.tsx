import { useCallback } from 'react';
import { Link } from 'react-router';
import { FlaskConical, Plus, SearchX } from 'lucide-react';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { buttonClasses } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { Button } from '../../../components/ui/button';
import { useCan } from '../../../lib/auth';
import { paths } from '../../../config/paths';
import { useChemicals } from '../api';
import { ChemicalFilters } from '../components/chemical-filters';
import { ChemicalsTable } from '../components/chemicals-table';
import { useChemicalListParams } from '../list-params';

export function ChemicalsListPage() {
  const { query, filtered, update, clear } = useChemicalListParams();
  const chemicals = useChemicals(query);
  const mayWrite = useCan('chemicals.write');

  const handleSearch = useCallback((q: string) => update({ q }, { replace: true }), [update]);

  const addButton = mayWrite && (
    <Link to={paths.chemicalNew} className={buttonClasses('primary')}>
      <Plus aria-hidden="true" className="size-4" />
      Add a chemical
    </Link>
  );

  const empty = filtered ? (
    <EmptyState
      icon={<SearchX />}
      title={query.q ? `No chemicals match “${query.q}”` : 'No chemicals match these filters'}
      action={<Button onClick={clear}>Clear search and filters</Button>}
    >
      Try a shorter search, another spelling or the CAS RN.
    </EmptyState>
  ) : (
    <EmptyState icon={<FlaskConical />} title="No chemicals yet" action={addButton || undefined}>
      {mayWrite
        ? 'Start with the reagents your lab keeps. Hazards, storage group and reorder point can be added now or later.'
        : 'Someone with the manager or admin role adds the lab’s chemicals. They will appear here.'}
    </EmptyState>
  );

  return (
    <div className="flex flex-col gap-5">
      <header className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-xl font-semibold text-ink-900">Chemicals</h1>
          <p className="text-sm text-ink-600">
            Every substance the lab keeps, with its hazards, storage group and reorder point.
          </p>
        </div>
        {addButton}
      </header>

      <ChemicalFilters
        q={query.q}
        storageGroup={query.storageGroup}
        pictogram={query.pictogram}
        physicalState={query.physicalState}
        filtered={filtered}
        onSearch={handleSearch}
        onFilter={(key, value) => update({ filters: { [key]: value } })}
        onClear={clear}
      />

      {chemicals.isError && !chemicals.data ? (
        <ErrorState
          title="The chemicals could not be loaded"
          error={chemicals.error}
          onRetry={() => void chemicals.refetch()}
        />
      ) : (
        <ChemicalsTable
          rows={chemicals.data?.items}
          total={chemicals.data?.total ?? 0}
          sort={query.sort}
          page={query.page}
          pageSize={query.pageSize}
          loading={chemicals.isPending}
          refreshing={chemicals.isPlaceholderData && chemicals.isFetching}
          onSortChange={(sort) => update({ sort })}
          onPageChange={(page) => update({ page })}
          onPageSizeChange={(pageSize) => update({ pageSize })}
          empty={empty}
        />
      )}
      <SafetyCaution compact />
    </div>
  );
}
