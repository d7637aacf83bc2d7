import { useCallback, useMemo, useState } from 'react';
import { Link } from 'react-router';
import {
  Boxes,
  CalendarClock,
  Hourglass,
  Printer,
  SearchX,
  TestTube,
  TrendingDown,
  X,
} from 'lucide-react';
import { containerStatuses } from '@lotwise/shared';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { Button, buttonClasses } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { Select } from '../../../components/ui/input';
import { withQuery } from '../../../lib/api-client';
import { daysLeftInMonth } from '../../../lib/dates';
import { paths } from '../../../config/paths';
import { containersCsvUrl, useContainers } from '../api';
import { ContainersTable } from '../components/containers-table';
import {
  ExpiringSelect,
  FilterChip,
  FilterField,
  ListSearch,
  StorageGroupSelect,
} from '../components/filter-controls';
import { LocationSelect } from '../components/location-select';
import { AddStockLinks, CsvDownloads, PageHeader } from '../components/page-actions';
import { containerStatusLooks } from '../labels';
import { useContainerListParams } from '../list-params';

export function ContainersListPage() {
  const { query, filtered, update, clear } = useContainerListParams();
  const containers = useContainers(query);
  const monthDays = useMemo(() => daysLeftInMonth(), []);
  const handleSearch = useCallback((q: string) => update({ q }, { replace: true }), [update]);
  const thisMonth = query.expiringWithinDays === monthDays;
  const [selected, setSelected] = useState<Set<number>>(() => new Set());
  const selection = useMemo(() => ({ selected, onChange: setSelected }), [selected]);
  const pageIds = containers.data?.items.map((c) => c.id) ?? [];
  const labelIds = selected.size > 0 ? [...selected] : pageIds;
  const { page: _page, pageSize: _pageSize, ...filters } = query;

  const toggle = (key: 'expired' | 'belowReorderPoint' | 'peroxideDue') =>
    update({ filters: { [key]: query[key] ? undefined : 'true' } });

  const empty = filtered ? (
    <EmptyState
      icon={<SearchX />}
      title={query.q ? `No containers match “${query.q}”` : 'No containers match these filters'}
      action={<Button onClick={clear}>Clear search and filters</Button>}
    >
      {thisMonth
        ? 'Nothing usable expires before the end of this month.'
        : 'Try a label code such as LW-00042, a chemical name, or fewer filters.'}
    </EmptyState>
  ) : (
    <EmptyState icon={<Boxes />} title="No containers yet">
      Containers appear here once stock is received into a location.
    </EmptyState>
  );

  return (
    <div className="flex flex-col gap-5">
      <PageHeader title="Containers" actions={<AddStockLinks />}>
        Every labelled bottle, jar and bag: where it is, how much it holds and when it expires. Open
        one to record a draw.
      </PageHeader>

      <div role="search" className="flex flex-col gap-3">
        <div className="flex flex-wrap items-end gap-3">
          <ListSearch
            id="containers-search"
            q={query.q}
            onSearch={handleSearch}
            placeholder="Label code (LW-00042) or chemical"
          />
          <FilterField id="containers-location" label="Location (and inside it)">
            <LocationSelect
              id="containers-location"
              className="w-64"
              value={query.locationId}
              emptyLabel="All locations"
              onChange={(id) =>
                update({ filters: { locationId: id === undefined ? undefined : String(id) } })
              }
            />
          </FilterField>
          <FilterField id="containers-status" label="Status">
            <Select
              id="containers-status"
              className="w-36"
              value={query.status ?? ''}
              onChange={(event) => update({ filters: { status: event.target.value || undefined } })}
            >
              <option value="">Any status</option>
              {containerStatuses.map((status) => (
                <option key={status} value={status}>
                  {containerStatusLooks[status].label}
                </option>
              ))}
            </Select>
          </FilterField>
          <StorageGroupSelect
            id="containers-storage-group"
            value={query.storageGroup}
            onChange={(value) => update({ filters: { storageGroup: value } })}
          />
          <ExpiringSelect
            id="containers-expiring"
            value={query.expiringWithinDays}
            monthDays={monthDays}
            onChange={(value) => update({ filters: { expiringWithinDays: value } })}
          />
        </div>
        <div className="flex flex-wrap items-center gap-2" aria-label="Quick filters" role="group">
          <FilterChip
            pressed={thisMonth}
            onToggle={() =>
              update({
                filters: { expiringWithinDays: thisMonth ? undefined : String(monthDays) },
                sort: thisMonth ? undefined : 'expiresOn.asc',
              })
            }
            icon={<CalendarClock aria-hidden="true" />}
          >
            Expiring this month
          </FilterChip>
          <FilterChip
            pressed={Boolean(query.expired)}
            onToggle={() => toggle('expired')}
            icon={<Hourglass aria-hidden="true" />}
          >
            Expired
          </FilterChip>
          <FilterChip
            pressed={Boolean(query.belowReorderPoint)}
            onToggle={() => toggle('belowReorderPoint')}
            icon={<TrendingDown aria-hidden="true" />}
          >
            Chemical at or below reorder point
          </FilterChip>
          <FilterChip
            pressed={Boolean(query.peroxideDue)}
            onToggle={() => toggle('peroxideDue')}
            icon={<TestTube aria-hidden="true" />}
          >
            Peroxide test due
          </FilterChip>
          {filtered && (
            <Button
              variant="ghost"
              size="sm"
              onClick={clear}
              icon={<X aria-hidden="true" className="size-4" />}
            >
              Clear filters
            </Button>
          )}
        </div>
      </div>

      {containers.isError && !containers.data ? (
        <ErrorState
          title="The containers could not be loaded"
          error={containers.error}
          onRetry={() => void containers.refetch()}
        />
      ) : (
        <ContainersTable
          rows={containers.data?.items}
          total={containers.data?.total ?? 0}
          sort={query.sort}
          page={query.page}
          pageSize={query.pageSize}
          loading={containers.isPending}
          refreshing={containers.isPlaceholderData && containers.isFetching}
          onSortChange={(sort) => update({ sort })}
          onPageChange={(page) => update({ page })}
          onPageSizeChange={(pageSize) => update({ pageSize })}
          empty={empty}
          selection={selection}
        />
      )}
      <div className="flex flex-col gap-3 border-t border-ink-200 pt-4">
        <div className="flex flex-wrap items-center gap-2">
          {labelIds.length > 0 && (
            <Link
              to={withQuery(paths.stockLabels, { ids: labelIds.join(',') })}
              className={buttonClasses('secondary', 'sm')}
            >
              <Printer aria-hidden="true" className="size-4" />
              {selected.size > 0
                ? `Print labels for ${selected.size} ticked`
                : `Print labels for this page (${pageIds.length})`}
            </Link>
          )}
          {selected.size > 0 && (
            <Button size="sm" variant="ghost" onClick={() => setSelected(new Set())}>
              Untick all
            </Button>
          )}
        </div>
        <CsvDownloads
          links={[{ href: containersCsvUrl(filters), label: 'Download these containers (CSV)' }]}
        />
      </div>
      <SafetyCaution compact />
    </div>
  );
}
