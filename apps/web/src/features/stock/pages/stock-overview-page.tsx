import { useCallback, useMemo } from 'react';
import { Link, useNavigate } from 'react-router';
import { createColumnHelper } from '@tanstack/react-table';
import {
  CalendarClock,
  Hourglass,
  Package,
  SearchX,
  ShieldAlert,
  TestTube,
  TrendingDown,
  X,
} from 'lucide-react';
import type { StockItem } from '@lotwise/shared';
import { Formula } from '../../../components/chem/formula';
import { HazardCodes } from '../../../components/hazards/hazard-codes';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { StorageGroupLabel } from '../../../components/hazards/storage-group-label';
import { Button } from '../../../components/ui/button';
import type { ServerTableFeatures } from '../../../components/ui/data-table';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { ServerTable } from '../../../components/ui/server-table';
import { withQuery } from '../../../lib/api-client';
import { daysLeftInMonth } from '../../../lib/dates';
import { formatAmount, formatCount } from '../../../lib/format';
import { paths } from '../../../config/paths';
import {
  chemicalsCsvUrl,
  containersCsvUrl,
  useSegregationConflicts,
  useStockOverview,
} from '../api';
import {
  ExpiringSelect,
  FilterChip,
  FilterField,
  ListSearch,
  QuickLink,
  StorageGroupSelect,
} from '../components/filter-controls';
import { LocationSelect } from '../components/location-select';
import { AddStockLinks, CsvDownloads, PageHeader } from '../components/page-actions';
import { ExpiryText, ReorderStatusBadge } from '../labels';
import { useStockListParams } from '../list-params';

const column = createColumnHelper<ServerTableFeatures, StockItem>();

const columns = column.columns([
  column.accessor((item) => item.chemical.name, {
    id: 'name',
    header: 'Chemical',
    cell: ({ row }) => {
      const { chemical } = row.original;
      return (
        <div className="max-w-64 min-w-40">
          <Link
            to={paths.stockChemical(chemical.id)}
            className="font-medium text-accent-700 underline-offset-2 hover:underline"
          >
            {chemical.name}
          </Link>
          <p className="text-xs text-ink-600 tabular-nums">
            <Formula value={chemical.formula} />
            {chemical.casNumber && <> · CAS RN {chemical.casNumber}</>}
          </p>
        </div>
      );
    },
  }),
  column.display({
    id: 'hazards',
    header: 'Hazards',
    cell: ({ row }) => (
      <div className="flex flex-col gap-1">
        <HazardCodes
          pictograms={row.original.chemical.ghsPictograms}
          statements={row.original.chemical.hazardStatements}
        />
        <span className="text-xs text-ink-700">
          <StorageGroupLabel group={row.original.chemical.storageGroup} />
        </span>
      </div>
    ),
  }),
  column.accessor('total', {
    header: 'Usable',
    meta: { align: 'right' },
    cell: ({ row }) => (
      <span className="font-semibold whitespace-nowrap text-ink-900">
        {row.original.display.text}
      </span>
    ),
  }),
  column.accessor('containerCount', {
    header: 'Containers',
    meta: { align: 'right' },
    cell: ({ row }) => {
      const item = row.original;
      return (
        <span className="flex flex-col items-end whitespace-nowrap">
          <span>
            {formatCount(item.usableContainerCount)} usable
            {item.containerCount !== item.usableContainerCount && (
              <span className="text-ink-600"> of {formatCount(item.containerCount)}</span>
            )}
          </span>
          {item.expiredContainerCount > 0 && (
            <span className="text-xs text-danger-700">
              {formatCount(item.expiredContainerCount)} expired
            </span>
          )}
        </span>
      );
    },
  }),
  column.accessor('nextExpiresOn', {
    header: 'Next expiry',
    cell: ({ getValue }) => <ExpiryText expiresOn={getValue()} expired={false} />,
  }),
  column.display({
    id: 'reorder',
    header: 'Reorder status',
    cell: ({ row }) => {
      const item = row.original;
      return (
        <span className="flex flex-col items-start gap-0.5">
          <ReorderStatusBadge status={item.reorderStatus} />
          {item.reorderPoint !== null && (
            <span className="text-xs whitespace-nowrap text-ink-600 tabular-nums">
              reorder at {formatAmount(item.reorderPoint, item.unit)}
            </span>
          )}
        </span>
      );
    },
  }),
]);

export function StockOverviewPage() {
  const { query, filtered, update, clear } = useStockListParams();
  const stock = useStockOverview(query);
  const conflicts = useSegregationConflicts();
  const navigate = useNavigate();
  const monthDays = useMemo(() => daysLeftInMonth(), []);

  const handleSearch = useCallback((q: string) => update({ q }, { replace: true }), [update]);
  const conflictCount = conflicts.data?.total;

  const empty = filtered ? (
    <EmptyState
      icon={<SearchX />}
      title={query.q ? `No stock matches “${query.q}”` : 'No stock matches these filters'}
      action={<Button onClick={clear}>Clear search and filters</Button>}
    >
      Try a shorter search, another place, or fewer filters.
    </EmptyState>
  ) : (
    <EmptyState icon={<Package />} title="No chemicals yet">
      Stock is counted per chemical. Add chemicals first; their containers then show here.
    </EmptyState>
  );

  return (
    <div className="flex flex-col gap-5">
      <PageHeader title="Stock" actions={<AddStockLinks />}>
        How much of each chemical is usable — sealed or open, and in date — and how many containers
        hold it. Open a chemical to see where its containers are.
      </PageHeader>

      <section aria-label="Quick views" className="grid gap-2 sm:grid-cols-2 lg:grid-cols-4">
        <QuickLink
          to={withQuery(paths.stockContainers, {
            expiringWithinDays: monthDays,
            sort: 'expiresOn.asc',
          })}
          icon={<CalendarClock aria-hidden="true" />}
          title="Expiring this month"
          detail="Containers whose lot expires by the month’s end"
        />
        <QuickLink
          to={withQuery(paths.stockContainers, { expired: 'true', sort: 'expiresOn.asc' })}
          icon={<Hourglass aria-hidden="true" />}
          title="Expired containers"
          detail="Past their lot’s expiry date and not disposed of"
        />
        <QuickLink
          to={paths.stockSegregation}
          icon={<ShieldAlert aria-hidden="true" />}
          title="Storage conflicts"
          detail={
            conflictCount === undefined
              ? 'Places that hold groups to be stored apart'
              : conflictCount === 0
                ? 'No place holds incompatible groups'
                : `${formatCount(conflictCount)} ${conflictCount === 1 ? 'place needs' : 'places need'} a look`
          }
        />
        <QuickLink
          to={withQuery(paths.stockContainers, { peroxideDue: 'true' })}
          icon={<TestTube aria-hidden="true" />}
          title="Peroxide tests due"
          detail="Peroxide formers to test or discard within 30 days"
        />
      </section>

      <div role="search" className="flex flex-col gap-3">
        <div className="flex flex-wrap items-end gap-3">
          <ListSearch
            id="stock-search"
            q={query.q}
            onSearch={handleSearch}
            placeholder="Name, formula or CAS RN"
          />
          <FilterField id="stock-location" label="Location">
            <LocationSelect
              id="stock-location"
              className="w-64"
              value={query.locationId}
              emptyLabel="All locations"
              onChange={(id) =>
                update({ filters: { locationId: id === undefined ? undefined : String(id) } })
              }
            />
          </FilterField>
          <StorageGroupSelect
            id="stock-storage-group"
            value={query.storageGroup}
            onChange={(value) => update({ filters: { storageGroup: value } })}
          />
          <ExpiringSelect
            id="stock-expiring"
            value={query.expiringWithinDays}
            monthDays={monthDays}
            onChange={(value) => update({ filters: { expiringWithinDays: value } })}
          />
        </div>
        <div className="flex flex-wrap items-center gap-2">
          <FilterChip
            pressed={Boolean(query.belowReorderPoint)}
            onToggle={() =>
              update({
                filters: { belowReorderPoint: query.belowReorderPoint ? undefined : 'true' },
              })
            }
            icon={<TrendingDown aria-hidden="true" />}
          >
            At or below reorder point
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
        {query.locationId !== undefined && (
          <p className="text-sm text-ink-600">
            Totals count only containers in the chosen place and the places inside it.
          </p>
        )}
      </div>

      {stock.isError && !stock.data ? (
        <ErrorState
          title="The stock overview could not be loaded"
          error={stock.error}
          onRetry={() => void stock.refetch()}
        />
      ) : (
        <ServerTable
          columns={columns}
          rows={stock.data?.items}
          getRowId={(item) => String(item.chemical.id)}
          total={stock.data?.total ?? 0}
          sort={query.sort}
          page={query.page}
          pageSize={query.pageSize}
          loading={stock.isPending}
          refreshing={stock.isPlaceholderData && stock.isFetching}
          label="Stock by chemical"
          noun={['chemical', 'chemicals']}
          onSortChange={(sort) => update({ sort })}
          onPageChange={(page) => update({ page })}
          onPageSizeChange={(pageSize) => update({ pageSize })}
          onRowActivate={(row) => navigate(paths.stockChemical(row.original.chemical.id))}
          empty={empty}
        />
      )}
      <CsvDownloads
        links={[
          {
            href: chemicalsCsvUrl({ q: query.q, storageGroup: query.storageGroup }),
            label: 'Download chemicals (CSV)',
          },
          {
            href: containersCsvUrl({
              q: query.q,
              sort: 'chemical.asc',
              locationId: query.locationId,
              storageGroup: query.storageGroup,
              belowReorderPoint: query.belowReorderPoint,
              expiringWithinDays: query.expiringWithinDays,
            }),
            label: 'Download their containers (CSV)',
          },
        ]}
      />
      <SafetyCaution compact />
    </div>
  );
}
