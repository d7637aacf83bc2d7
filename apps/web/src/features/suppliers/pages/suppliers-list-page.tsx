import { useCallback, useState } from 'react';
import { useNavigate } from 'react-router';
import { Plus, SearchX, Truck } from 'lucide-react';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { Checkbox, Input } from '../../../components/ui/input';
import { useCan } from '../../../lib/auth';
import { paths } from '../../../config/paths';
import { useSuppliers } from '../api';
import { SupplierFormDialog } from '../components/supplier-form-dialog';
import { SuppliersTable } from '../components/suppliers-table';
import { useSupplierListParams } from '../list-params';

/** `/purchasing/suppliers`: the shops the lab buys from, with their fees. */
export function SuppliersListPage() {
  const { query, filtered, update, clear } = useSupplierListParams();
  const suppliers = useSuppliers(query);
  const mayManage = useCan('orders.manage');
  const navigate = useNavigate();
  const [adding, setAdding] = useState(false);
  const currency = suppliers.data?.currency;

  const handleSearch = useCallback((q: string) => update({ q }, { replace: true }), [update]);

  const addButton = mayManage && currency && (
    <Button
      variant="primary"
      onClick={() => setAdding(true)}
      icon={<Plus aria-hidden="true" className="size-4" />}
    >
      Add a supplier
    </Button>
  );

  const empty = filtered ? (
    <EmptyState
      icon={<SearchX />}
      title={`No suppliers match “${query.q}”`}
      action={<Button onClick={clear}>Clear the search</Button>}
    >
      Try part of the name, the contact person or the e-mail address.
    </EmptyState>
  ) : (
    <EmptyState icon={<Truck />} title="No suppliers yet" action={addButton || undefined}>
      {mayManage
        ? 'Add the shops the lab buys from, with their shipping and hazardous-goods fees; then their price lists.'
        : 'Someone with the manager or admin role adds the lab’s suppliers. They will appear here.'}
    </EmptyState>
  );

  return (
    <div className="flex flex-col gap-5">
      <header className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-xl font-semibold text-ink-900">Suppliers</h1>
          <p className="max-w-3xl text-sm text-ink-600">
            The shops the lab buys from: what each charges for shipping and for hazardous goods, and
            the packs it sells. Shared orders are placed with one supplier at a time.
          </p>
        </div>
        {addButton}
      </header>

      <div className="flex flex-wrap items-center gap-4">
        <label className="w-80 text-sm">
          <span className="sr-only">Search suppliers</span>
          <Input
            type="search"
            placeholder="Search: name, contact or e-mail"
            defaultValue={query.q}
            onChange={(event) => handleSearch(event.target.value)}
          />
        </label>
        <label className="flex items-center gap-2 text-sm text-ink-700">
          <Checkbox
            checked={query.archived === 'true'}
            onChange={(event) =>
              update({ filters: { archived: event.target.checked ? 'true' : undefined } })
            }
          />
          Show archived suppliers instead
        </label>
      </div>

      {suppliers.isError && !suppliers.data ? (
        <ErrorState
          title="The suppliers could not be loaded"
          error={suppliers.error}
          onRetry={() => void suppliers.refetch()}
        />
      ) : (
        <SuppliersTable
          rows={suppliers.data?.items}
          total={suppliers.data?.total ?? 0}
          sort={query.sort}
          page={query.page}
          pageSize={query.pageSize}
          loading={suppliers.isPending}
          refreshing={suppliers.isPlaceholderData && suppliers.isFetching}
          onSortChange={(sort) => update({ sort })}
          onPageChange={(page) => update({ page })}
          onPageSizeChange={(pageSize) => update({ pageSize })}
          empty={empty}
        />
      )}
      {currency && adding && (
        <SupplierFormDialog
          open
          onClose={() => setAdding(false)}
          supplier={null}
          currency={currency}
          onSaved={(supplier) => void navigate(paths.supplier(supplier.id))}
        />
      )}
      <SafetyCaution compact />
    </div>
  );
}
