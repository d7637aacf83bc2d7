import { useCallback, useState, type ReactNode } from 'react';
import { Link, useNavigate, useParams } from 'react-router';
import {
  Archive,
  ArchiveRestore,
  ChevronLeft,
  FileUp,
  PackagePlus,
  Pencil,
  SearchX,
  Trash2,
} from 'lucide-react';
import type { CatalogItem, Supplier } from '@lotwise/shared';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { Badge } from '../../../components/ui/badge';
import { Button, buttonClasses } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/dialog';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { Checkbox, Input } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { PageSpinner } from '../../../components/ui/spinner';
import { errorMessage } from '../../../lib/api-client';
import { useCan } from '../../../lib/auth';
import { formatCount } from '../../../lib/format';
import { paths } from '../../../config/paths';
import { useCatalogItems, useDeleteSupplier, useSupplier, useUpdateSupplier } from '../api';
import { CatalogItemDialog } from '../components/catalog-item-dialog';
import { CatalogTable } from '../components/catalog-table';
import { SupplierFormDialog } from '../components/supplier-form-dialog';
import { useCatalogListParams } from '../list-params';
import { moneyText } from '../money';

function Fact({
  label,
  className,
  children,
}: {
  label: string;
  className?: string;
  children: ReactNode;
}) {
  // one <div> per term and its value: the only wrapper a <dl> may hold
  return (
    <div className={className}>
      <dt className="text-xs font-semibold tracking-wide text-ink-600 uppercase">{label}</dt>
      <dd className="mt-0.5 text-sm text-ink-900">{children}</dd>
    </div>
  );
}

function SupplierFacts({ supplier }: { supplier: Supplier }) {
  const money = (minor: number) => (
    <span className="text-base font-semibold tabular-nums">
      {moneyText(minor, supplier.currency)}
    </span>
  );
  return (
    <section
      aria-label="Contact and fees"
      className="grid gap-5 rounded-lg border border-ink-200 bg-white px-4 py-4 lg:grid-cols-[2fr_3fr]"
    >
      <dl className="grid content-start gap-3 sm:grid-cols-2">
        <Fact label="Contact">{supplier.contactName || '—'}</Fact>
        <Fact label="Order e-mail">
          {supplier.email ? (
            <a className="text-accent-700 underline" href={`mailto:${supplier.email}`}>
              {supplier.email}
            </a>
          ) : (
            '—'
          )}
        </Fact>
        <Fact label="Phone">{supplier.phone || '—'}</Fact>
        <Fact label="Website">{supplier.website || '—'}</Fact>
        <Fact label="How to order" className="sm:col-span-2">
          <span className="whitespace-pre-line">{supplier.orderingNotes || '—'}</span>
        </Fact>
      </dl>
      <dl className="grid content-start gap-3 sm:grid-cols-3">
        <Fact label="Minimum order">
          {supplier.minimumOrderMinor === 0 ? 'None' : money(supplier.minimumOrderMinor)}
          <span className="block text-xs text-ink-600">goods, before fees</span>
        </Fact>
        <Fact label="Shipping fee">
          {money(supplier.shippingFeeMinor)}
          <span className="block text-xs text-ink-600">once per order</span>
        </Fact>
        <Fact label="Hazardous-goods fee">
          {money(supplier.hazardousFeeMinor)}
          <span className="block text-xs text-ink-600">
            once per order holding any hazardous-goods item
          </span>
        </Fact>
      </dl>
    </section>
  );
}

function Catalogue({ supplier, mayManage }: { supplier: Supplier; mayManage: boolean }) {
  const { query, filtered, update, clear } = useCatalogListParams(supplier.id);
  const items = useCatalogItems(query);
  const [editing, setEditing] = useState<CatalogItem | 'new' | null>(null);
  const handleSearch = useCallback((q: string) => update({ q }, { replace: true }), [update]);

  const empty = filtered ? (
    <EmptyState
      icon={<SearchX />}
      title="No items match"
      action={<Button onClick={clear}>Clear search and filter</Button>}
    >
      Try part of the SKU, the chemical’s name or CAS RN, or the grade.
    </EmptyState>
  ) : (
    <EmptyState icon={<PackagePlus />} title="No catalogue items yet">
      {mayManage
        ? 'Add the packs this supplier sells one by one, or import the whole price list from a CSV file.'
        : 'A manager adds the packs this supplier sells. They will appear here.'}
    </EmptyState>
  );

  return (
    <section aria-labelledby="catalogue-heading" className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h2 id="catalogue-heading" className="text-base font-semibold">
            Catalogue
          </h2>
          <p className="text-sm text-ink-600">
            The packs {supplier.name} sells, with each chemical’s hazards. Prices are per pack, in{' '}
            {supplier.currency}.
          </p>
        </div>
        {mayManage && (
          <div className="flex flex-wrap gap-2">
            <Link to={paths.priceListImport(supplier.id)} className={buttonClasses('secondary')}>
              <FileUp aria-hidden="true" className="size-4" />
              Import price list
            </Link>
            <Button
              variant="primary"
              onClick={() => setEditing('new')}
              icon={<PackagePlus aria-hidden="true" className="size-4" />}
            >
              Add an item
            </Button>
          </div>
        )}
      </div>
      <div className="flex flex-wrap items-center gap-4">
        <label className="w-96 text-sm">
          <span className="sr-only">Search the catalogue</span>
          <Input
            type="search"
            placeholder="Search: SKU, chemical, CAS RN or grade"
            defaultValue={query.q}
            onChange={(event) => handleSearch(event.target.value)}
          />
        </label>
        <label className="flex items-center gap-2 text-sm text-ink-700">
          <Checkbox
            checked={query.discontinued === 'false'}
            onChange={(event) =>
              update({ filters: { discontinued: event.target.checked ? 'false' : undefined } })
            }
          />
          Only items still sold
        </label>
      </div>
      {items.isError && !items.data ? (
        <ErrorState
          title="The catalogue could not be loaded"
          error={items.error}
          onRetry={() => void items.refetch()}
        />
      ) : (
        <CatalogTable
          rows={items.data?.items}
          total={items.data?.total ?? 0}
          sort={query.sort}
          page={query.page}
          pageSize={query.pageSize}
          loading={items.isPending}
          refreshing={items.isPlaceholderData && items.isFetching}
          onSortChange={(sort) => update({ sort })}
          onPageChange={(page) => update({ page })}
          onPageSizeChange={(pageSize) => update({ pageSize })}
          empty={empty}
          onEdit={mayManage ? setEditing : null}
        />
      )}
      {editing !== null && (
        <CatalogItemDialog
          open
          onClose={() => setEditing(null)}
          supplierId={supplier.id}
          item={editing === 'new' ? null : editing}
          currency={supplier.currency}
        />
      )}
    </section>
  );
}

/** `/purchasing/suppliers/:id`: a supplier's contact, fees and catalogue. */
export function SupplierPage() {
  const id = Number(useParams().id);
  const supplier = useSupplier(id);
  const mayManage = useCan('orders.manage');
  const navigate = useNavigate();
  const update = useUpdateSupplier(id);
  const remove = useDeleteSupplier(id);
  const [editing, setEditing] = useState(false);
  const [deleting, setDeleting] = useState(false);

  const back = (
    <Link
      to={paths.suppliers}
      className="inline-flex items-center gap-1 text-sm text-ink-600 hover:text-ink-900"
    >
      <ChevronLeft aria-hidden="true" className="size-4" />
      All suppliers
    </Link>
  );

  if (supplier.isPending) return <PageSpinner label="Loading the supplier…" />;
  if (supplier.isError) {
    return (
      <div className="flex flex-col gap-4">
        {back}
        <ErrorState
          title="The supplier could not be loaded"
          error={supplier.error}
          onRetry={() => void supplier.refetch()}
        />
      </div>
    );
  }
  const data = supplier.data;

  return (
    <div className="flex flex-col gap-5">
      {back}
      <header className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h1 className="flex flex-wrap items-center gap-2 text-xl font-semibold text-ink-900">
            {data.name}
            {data.archived && (
              <Badge icon={<Archive aria-hidden="true" />}>
                Archived: not offered for new orders
              </Badge>
            )}
          </h1>
          <p className="text-sm text-ink-600 tabular-nums">
            {formatCount(data.catalogItemCount)} {data.catalogItemCount === 1 ? 'item' : 'items'}{' '}
            sold ·{' '}
            {data.orderCount === 0
              ? 'not in any order yet'
              : `in ${formatCount(data.orderCount)} ${data.orderCount === 1 ? 'order' : 'orders'}`}
          </p>
        </div>
        {mayManage && (
          <div className="flex flex-wrap gap-2">
            <Button
              onClick={() => setEditing(true)}
              icon={<Pencil aria-hidden="true" className="size-4" />}
            >
              Edit supplier
            </Button>
            <Button
              busy={update.isPending}
              onClick={() => update.mutate({ archived: !data.archived })}
              icon={
                data.archived ? (
                  <ArchiveRestore aria-hidden="true" className="size-4" />
                ) : (
                  <Archive aria-hidden="true" className="size-4" />
                )
              }
            >
              {data.archived ? 'Use again' : 'Archive'}
            </Button>
            <Button
              variant="danger"
              onClick={() => setDeleting(true)}
              icon={<Trash2 aria-hidden="true" className="size-4" />}
            >
              Delete
            </Button>
          </div>
        )}
      </header>
      {update.isError && (
        <Notice tone="danger" title="Nothing was changed">
          {errorMessage(update.error)}
        </Notice>
      )}
      <SupplierFacts supplier={data} />
      <Catalogue supplier={data} mayManage={mayManage} />
      <SafetyCaution />
      {editing && (
        <SupplierFormDialog
          open
          onClose={() => setEditing(false)}
          supplier={data}
          currency={data.currency}
        />
      )}
      <ConfirmDialog
        open={deleting}
        onCancel={() => {
          setDeleting(false);
          remove.reset();
        }}
        title={`Delete ${data.name}?`}
        confirmLabel="Delete supplier and catalogue"
        busy={remove.isPending}
        error={
          remove.isError && (
            <Notice tone="danger" title="Not deleted">
              {errorMessage(remove.error)}
            </Notice>
          )
        }
        onConfirm={() =>
          remove.mutate(undefined, { onSuccess: () => void navigate(paths.suppliers) })
        }
      >
        Its {formatCount(data.catalogItemCount)} catalogue items go with it. A supplier named by an
        order cannot be deleted: archive it instead.
      </ConfirmDialog>
    </div>
  );
}
