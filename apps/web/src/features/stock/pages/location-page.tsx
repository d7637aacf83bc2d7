import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router';
import { Boxes, ChevronLeft, ClipboardList, Pencil, Plus, Trash2 } from 'lucide-react';
import { StorageGroupLabel } from '../../../components/hazards/storage-group-label';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { RoomRulesPanel } from '../../../components/room-rules/room-rules-panel';
import { Button, buttonClasses } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { Notice } from '../../../components/ui/notice';
import { PageSpinner } from '../../../components/ui/spinner';
import { isApiError } from '../../../lib/api-client';
import { useCan } from '../../../lib/auth';
import { formatCount } from '../../../lib/format';
import { paths } from '../../../config/paths';
import { useContainers, useLocation } from '../api';
import { ContainersTable } from '../components/containers-table';
import { DeleteLocationDialog } from '../components/delete-location-dialog';
import { LocationFormDialog } from '../components/location-form-dialog';
import { buildTree, LocationTree } from '../components/location-tree';
import { SegregationWarnings } from '../components/segregation-warnings';
import { locationKindLabels } from '../labels';

const back = (
  <Link
    to={paths.stockLocations}
    className="inline-flex items-center gap-1 text-sm text-ink-600 hover:text-ink-900"
  >
    <ChevronLeft aria-hidden="true" className="size-4" />
    All locations
  </Link>
);

export function LocationPage() {
  const params = useParams();
  const id = Number(params.id);
  const location = useLocation(id);
  const mayWrite = useCan('stock.write');
  const navigate = useNavigate();
  const [dialog, setDialog] = useState<'edit' | 'add' | 'delete' | null>(null);
  const [page, setPage] = useState(1);
  const [pageSize, setPageSize] = useState(25);
  const [sort, setSort] = useState('location.asc');
  const containers = useContainers({ q: '', locationId: id, sort, page, pageSize });

  if (location.isPending) return <PageSpinner label="Loading the location…" />;
  if (location.isError) {
    return (
      <div className="flex flex-col gap-4">
        {back}
        {isApiError(location.error) && location.error.status === 404 ? (
          <Notice tone="warn" title="No such location">
            There is no location with the number {params.id} — it may have been deleted.
          </Notice>
        ) : (
          <ErrorState
            title="The location could not be loaded"
            error={location.error}
            onRetry={() => void location.refetch()}
          />
        )}
      </div>
    );
  }
  const l = location.data;

  return (
    <div className="flex flex-col gap-5">
      {back}
      <header className="flex flex-wrap items-start justify-between gap-3">
        <div>
          {l.ancestors.length > 0 && (
            <nav aria-label="Inside" className="text-sm text-ink-600">
              {l.ancestors.map((ancestor) => (
                <span key={ancestor.id}>
                  <Link
                    to={paths.stockLocation(ancestor.id)}
                    className="underline-offset-2 hover:underline"
                  >
                    {ancestor.name}
                  </Link>
                  {' › '}
                </span>
              ))}
            </nav>
          )}
          <h1 className="text-xl font-semibold text-ink-900">
            {l.name}{' '}
            <span className="text-sm font-normal text-ink-600">{locationKindLabels[l.kind]}</span>
          </h1>
          <div className="mt-1 flex flex-wrap gap-x-3 text-sm text-ink-800">
            <span className="text-ink-600">Meant for:</span>
            {l.storageGroups.length === 0 ? (
              <span className="text-ink-600">any storage group (not set aside)</span>
            ) : (
              l.storageGroups.map((group) => (
                <StorageGroupLabel key={group} group={group} withHint={false} />
              ))
            )}
          </div>
          {l.notes && <p className="mt-1 text-sm whitespace-pre-line text-ink-700">{l.notes}</p>}
        </div>
        {mayWrite && (
          <div className="flex flex-wrap gap-2">
            <Link to={paths.stockStocktake(l.id)} className={buttonClasses('primary')}>
              <ClipboardList aria-hidden="true" className="size-4" />
              Stocktake
            </Link>
            <Button
              onClick={() => setDialog('add')}
              icon={<Plus aria-hidden="true" className="size-4" />}
            >
              Add inside
            </Button>
            <Button
              onClick={() => setDialog('edit')}
              icon={<Pencil aria-hidden="true" className="size-4" />}
            >
              Change or move
            </Button>
            <Button
              onClick={() => setDialog('delete')}
              icon={<Trash2 aria-hidden="true" className="size-4" />}
            >
              Delete
            </Button>
          </div>
        )}
      </header>

      <SegregationWarnings warnings={l.warnings} title="Storage warnings here" />

      <RoomRulesPanel location={l} />

      {l.children.length > 0 && (
        <section aria-labelledby="inside-heading" className="flex flex-col gap-2">
          <h2 id="inside-heading" className="text-base font-semibold">
            Places inside
          </h2>
          <LocationTree nodes={buildTree(l.children)} />
        </section>
      )}

      <section aria-labelledby="holds-heading" className="flex flex-col gap-2">
        <h2 id="holds-heading" className="text-base font-semibold">
          What it holds
        </h2>
        <p className="text-sm text-ink-600 tabular-nums">
          {formatCount(l.containerCount)} here directly, {formatCount(l.subtreeContainerCount)}{' '}
          including the places inside (disposed containers left out of these counts).
        </p>
        {containers.isError && !containers.data ? (
          <ErrorState
            title="The containers could not be loaded"
            error={containers.error}
            onRetry={() => void containers.refetch()}
          />
        ) : (
          <ContainersTable
            label={`Containers in ${l.name}`}
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
              <EmptyState icon={<Boxes />} title={`Nothing is stored in ${l.name}`}>
                Containers placed here or in the places inside show up in this list.
              </EmptyState>
            }
          />
        )}
      </section>
      <SafetyCaution compact />

      {dialog === 'edit' && <LocationFormDialog location={l} onClose={() => setDialog(null)} />}
      {dialog === 'add' && <LocationFormDialog parent={l} onClose={() => setDialog(null)} />}
      {dialog === 'delete' && (
        <DeleteLocationDialog
          location={l}
          onClose={() => setDialog(null)}
          onDeleted={() => navigate(paths.stockLocations, { replace: true })}
        />
      )}
    </div>
  );
}
