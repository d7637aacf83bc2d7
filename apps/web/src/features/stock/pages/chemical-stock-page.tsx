import { useState } from 'react';
import { Link, useParams } from 'react-router';
import { Boxes, ChevronLeft, FileText, FlaskConical, TriangleAlert } from 'lucide-react';
import { Formula } from '../../../components/chem/formula';
import { HazardStatementList } from '../../../components/hazards/hazard-statement-list';
import { PictogramList } from '../../../components/hazards/pictogram-badge';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { StorageGroupLabel } from '../../../components/hazards/storage-group-label';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { Notice } from '../../../components/ui/notice';
import { PageSpinner } from '../../../components/ui/spinner';
import { isApiError, withQuery } from '../../../lib/api-client';
import { useCan } from '../../../lib/auth';
import { formatAmount, formatCount } from '../../../lib/format';
import { paths } from '../../../config/paths';
import { storedFileUrls, useChemicalStockItem, useContainers, useStockChemical } from '../api';
import { ContainersTable } from '../components/containers-table';
import { StockHistorySection } from '../components/stock-history';
import { StoredFilePanel } from '../components/stored-file-panel';
import { ExpiryText, ReorderStatusBadge } from '../labels';

const back = (
  <Link
    to={paths.stock}
    className="inline-flex items-center gap-1 text-sm text-ink-600 hover:text-ink-900"
  >
    <ChevronLeft aria-hidden="true" className="size-4" />
    Stock overview
  </Link>
);

export function ChemicalStockPage() {
  const params = useParams();
  const id = Number(params.id);
  const chemical = useStockChemical(id);
  const item = useChemicalStockItem(id, chemical.data?.name);
  const [page, setPage] = useState(1);
  const [pageSize, setPageSize] = useState(25);
  const [sort, setSort] = useState('location.asc');
  const containers = useContainers({ q: '', chemicalId: id, sort, page, pageSize });
  const mayEditChemical = useCan('chemicals.write');

  if (chemical.isPending) return <PageSpinner label="Loading the chemical…" />;
  if (chemical.isError) {
    return (
      <div className="flex flex-col gap-4">
        {back}
        {isApiError(chemical.error) && chemical.error.status === 404 ? (
          <Notice tone="warn" title="No such chemical">
            There is no chemical with the number {params.id}.
          </Notice>
        ) : (
          <ErrorState
            title="The chemical could not be loaded"
            error={chemical.error}
            onRetry={() => void chemical.refetch()}
          />
        )}
      </div>
    );
  }
  const c = chemical.data;
  const stock = item.data;

  return (
    <div className="flex flex-col gap-5">
      {back}
      <header className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h1 className="text-xl font-semibold text-ink-900">{c.name}</h1>
          <p className="text-sm text-ink-600 tabular-nums">
            <Formula value={c.formula} />
            {c.casNumber && <> · CAS RN {c.casNumber}</>}
          </p>
          <Link
            to={paths.chemical(c.id)}
            className="mt-1 inline-flex items-center gap-1 text-sm text-accent-700 underline-offset-2 hover:underline"
          >
            <FlaskConical aria-hidden="true" className="size-4" />
            Chemical details
          </Link>
        </div>
        <div className="text-right" aria-live="polite">
          <p className="text-xs font-semibold tracking-wide text-ink-600 uppercase">Usable now</p>
          <p
            className="text-2xl font-semibold text-ink-900 tabular-nums"
            data-testid="usable-total"
          >
            {stock ? stock.display.text : item.isPending ? '…' : '—'}
          </p>
          {stock && (
            <div className="flex flex-col items-end gap-1 text-sm text-ink-700">
              <span className="tabular-nums">
                in {formatCount(stock.usableContainerCount)}{' '}
                {stock.usableContainerCount === 1 ? 'container' : 'containers'}
              </span>
              <ReorderStatusBadge status={stock.reorderStatus} />
              {stock.reorderPoint !== null && (
                <span className="text-xs text-ink-600 tabular-nums">
                  reorder at {formatAmount(stock.reorderPoint, stock.unit)}
                </span>
              )}
            </div>
          )}
        </div>
      </header>

      <section
        aria-labelledby="chemical-hazards-heading"
        className="rounded-lg border border-ink-200 bg-white px-4 py-3"
      >
        <h2
          id="chemical-hazards-heading"
          className="mb-2 flex items-center gap-2 text-base font-semibold"
        >
          <TriangleAlert aria-hidden="true" className="size-4 text-ghs-red" />
          Hazards
        </h2>
        <div className="grid gap-4 lg:grid-cols-[2fr_3fr]">
          <div className="flex flex-col gap-2">
            <PictogramList codes={c.ghsPictograms} />
            <StorageGroupLabel group={c.storageGroup} withHint />
          </div>
          <HazardStatementList codes={c.hazardStatements} />
        </div>
        <SafetyCaution className="mt-3" />
      </section>

      <section
        aria-labelledby="sds-heading"
        className="rounded-lg border border-ink-200 bg-white px-4 py-3"
      >
        <h2 id="sds-heading" className="mb-1 flex items-center gap-2 text-base font-semibold">
          <FileText aria-hidden="true" className="size-4 text-ink-600" />
          Safety data sheet
        </h2>
        <p className="mb-3 text-sm text-ink-600">
          The supplier’s SDS is the reference for handling, storage, spills and first aid. Keep the
          current version here so anyone at the shelf can open it.
        </p>
        <StoredFilePanel
          what="safety data sheet"
          file={c.sds}
          url={storedFileUrls.sds(c.id)}
          kind="pdf"
          canChange={mayEditChemical}
          missingText={`No SDS uploaded for ${c.name} yet.${mayEditChemical ? ' Upload the supplier’s current PDF.' : ' Ask a manager to upload the supplier’s current PDF.'}`}
        />
      </section>

      {stock && stock.expiredContainerCount > 0 && (
        <Notice tone="warn" title="Expired stock is not counted as usable">
          {formatCount(stock.expiredContainerCount)}{' '}
          {stock.expiredContainerCount === 1 ? 'container is' : 'containers are'} past the lot’s
          expiry date.{' '}
          <Link
            to={withQuery(paths.stockContainers, { chemicalId: c.id, expired: 'true' })}
            className="underline underline-offset-2"
          >
            See which
          </Link>
        </Notice>
      )}
      {stock?.nextExpiresOn && (
        <p className="flex flex-wrap items-center gap-2 text-sm text-ink-700">
          Next usable container to expire:{' '}
          <ExpiryText expiresOn={stock.nextExpiresOn} expired={false} />
        </p>
      )}

      <section aria-labelledby="where-heading" className="flex flex-col gap-2">
        <h2 id="where-heading" className="text-base font-semibold">
          Where it is
        </h2>
        <p className="text-sm text-ink-600">
          Every container of {c.name}, including empty, expired and disposed ones (see Status).
        </p>
        {containers.isError && !containers.data ? (
          <ErrorState
            title="The containers could not be loaded"
            error={containers.error}
            onRetry={() => void containers.refetch()}
          />
        ) : (
          <ContainersTable
            label={`Containers of ${c.name}`}
            rows={containers.data?.items}
            total={containers.data?.total ?? 0}
            sort={sort}
            page={page}
            pageSize={pageSize}
            loading={containers.isPending}
            refreshing={containers.isPlaceholderData && containers.isFetching}
            onSortChange={(next) => {
              setSort(next);
              setPage(1);
            }}
            onPageChange={setPage}
            onPageSizeChange={(size) => {
              setPageSize(size);
              setPage(1);
            }}
            empty={
              <EmptyState icon={<Boxes />} title={`No containers of ${c.name}`}>
                None has been received yet.
              </EmptyState>
            }
          />
        )}
      </section>

      <StockHistorySection chemicalId={c.id} name={c.name} />
    </div>
  );
}
