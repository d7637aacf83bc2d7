import { useState, type FormEvent } from 'react';
import { Link, useNavigate } from 'react-router';
import { ChevronLeft } from 'lucide-react';
import { feeRules, type FeeRule } from '@lotwise/shared';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { Button } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { Input, Select, Textarea } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { Spinner } from '../../../components/ui/spinner';
import { paths } from '../../../config/paths';
import { errorMessage, isApiError } from '../../../lib/api-client';
import { formatAmount } from '../../../lib/format';
import { useCatalogue, useCreateOrder, useSupplierOptions, type CatalogueItem } from '../api';
import { feeRuleExplanations, feeRuleLabel, money } from '../labels';
import { TableScroll } from '../../../components/ui/table-scroll';

function CatalogueLines({
  items,
  packs,
  onChange,
}: {
  items: CatalogueItem[];
  packs: Record<number, string>;
  onChange: (id: number, value: string) => void;
}) {
  if (items.length === 0) {
    return <p className="text-sm text-ink-600">This supplier’s catalogue is empty.</p>;
  }
  return (
    <TableScroll className="rounded-lg border border-ink-200 bg-white">
      <table className="w-full text-sm">
        <thead className="bg-ink-50 text-left text-xs text-ink-600">
          <tr>
            <th className="px-3 py-2 font-semibold">Chemical</th>
            <th className="px-3 py-2 font-semibold">Pack</th>
            <th className="px-3 py-2 text-right font-semibold">Price a pack</th>
            <th className="px-3 py-2 font-semibold">Packs</th>
          </tr>
        </thead>
        <tbody>
          {items.map((item) => (
            <tr key={item.id} className="border-t border-ink-100">
              <td className="px-3 py-2">
                <span className="font-medium">{item.chemicalName}</span>
                <span className="block text-xs text-ink-600">
                  {item.sku}
                  {item.hazardous ? ' · ships as hazardous goods' : ''}
                </span>
              </td>
              <td className="px-3 py-2 tabular-nums">
                {formatAmount(item.packSize, item.packUnit)}
                <span className="block text-xs text-ink-600">
                  {item.splittable ? 'members may claim part' : 'whole packs only'}
                </span>
              </td>
              <td className="px-3 py-2 text-right tabular-nums">
                {money(item.priceMinor, item.currency)}
              </td>
              <td className="px-3 py-2">
                <div className="w-20">
                  <Input
                    type="number"
                    min={0}
                    step={1}
                    aria-label={`Packs of ${item.chemicalName} (${item.sku})`}
                    value={packs[item.id] ?? ''}
                    onChange={(e) => onChange(item.id, e.target.value)}
                  />
                </div>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </TableScroll>
  );
}

/** A coordinator drafts a shared order: supplier, title, fee rule, deadline and lines. */
export function OrderNewPage() {
  const navigate = useNavigate();
  const suppliers = useSupplierOptions();
  const create = useCreateOrder();
  const [supplierId, setSupplierId] = useState<number | null>(null);
  const [title, setTitle] = useState('');
  const [feeRule, setFeeRule] = useState<FeeRule>('value');
  const [deadline, setDeadline] = useState('');
  const [notes, setNotes] = useState('');
  const [packs, setPacks] = useState<Record<number, string>>({});
  const catalogue = useCatalogue(supplierId);
  const fields = isApiError(create.error) ? create.error.fields : {};

  function submit(event: FormEvent) {
    event.preventDefault();
    if (supplierId === null) return;
    const lines = Object.entries(packs)
      .map(([id, value]) => ({ catalogItemId: Number(id), packs: Number(value) }))
      .filter((line) => Number.isInteger(line.packs) && line.packs > 0);
    create.mutate(
      {
        supplierId,
        title,
        feeRule,
        claimDeadline: deadline || null,
        lines,
        notes,
      },
      { onSuccess: (order) => navigate(paths.order(order.id)) },
    );
  }

  const supplierItems = (suppliers.data?.items ?? []).filter((item) => !item.archived);
  const catalogueItems = (catalogue.data?.items ?? []).filter((item) => !item.discontinued);

  return (
    <div className="flex max-w-4xl flex-col gap-5">
      <Link
        to={paths.orders}
        className="inline-flex items-center gap-1 self-start text-sm text-ink-600 hover:text-ink-900"
      >
        <ChevronLeft aria-hidden="true" className="size-4" />
        All orders
      </Link>
      <header>
        <h1 className="text-xl font-semibold text-ink-900">New shared order</h1>
        <p className="text-sm text-ink-600">
          The order starts as a draft: fees are copied from the supplier and members see it once you
          open it for claims.
        </p>
      </header>
      <form onSubmit={submit} className="flex flex-col gap-4">
        <div className="grid gap-4 sm:grid-cols-2">
          <Field label="Supplier" error={fields.supplierId}>
            {(control) =>
              suppliers.isPending ? (
                <Spinner size="sm" />
              ) : (
                <Select
                  {...control}
                  required
                  value={supplierId ?? ''}
                  onChange={(e) => {
                    setSupplierId(e.target.value ? Number(e.target.value) : null);
                    setPacks({});
                  }}
                >
                  <option value="">Choose a supplier</option>
                  {supplierItems.map((item) => (
                    <option key={item.id} value={item.id}>
                      {item.name}
                    </option>
                  ))}
                </Select>
              )
            }
          </Field>
          <Field label="Title" error={fields.title} hint="e.g. Spring club order">
            {(control) => (
              <Input
                {...control}
                required
                value={title}
                onChange={(e) => setTitle(e.target.value)}
              />
            )}
          </Field>
          <Field label="Fees shared" hint={feeRuleExplanations[feeRule]} error={fields.feeRule}>
            {(control) => (
              <Select
                {...control}
                value={feeRule}
                onChange={(e) => setFeeRule(e.target.value as FeeRule)}
              >
                {feeRules.map((rule) => (
                  <option key={rule} value={rule}>
                    {feeRuleLabel(rule)}
                  </option>
                ))}
              </Select>
            )}
          </Field>
          <Field
            label="Claims until"
            optional
            hint="Needed before the order opens."
            error={fields.claimDeadline}
          >
            {(control) => (
              <Input
                {...control}
                type="date"
                value={deadline}
                onChange={(e) => setDeadline(e.target.value)}
              />
            )}
          </Field>
        </div>
        {suppliers.isError && (
          <Notice tone="danger" title="The suppliers could not be loaded">
            {errorMessage(suppliers.error)}
          </Notice>
        )}
        <Field label="Notes" optional error={fields.notes}>
          {(control) => (
            <Textarea
              {...control}
              rows={2}
              value={notes}
              onChange={(e) => setNotes(e.target.value)}
            />
          )}
        </Field>
        {supplierId !== null && (
          <section aria-label="Lines" className="flex flex-col gap-2">
            <h2 className="text-base font-semibold text-ink-900">Lines from the catalogue</h2>
            <SafetyCaution />
            {catalogue.isPending ? (
              <Spinner />
            ) : catalogue.isError ? (
              <Notice tone="danger">{errorMessage(catalogue.error)}</Notice>
            ) : (
              <CatalogueLines
                items={catalogueItems}
                packs={packs}
                onChange={(id, value) => setPacks((old) => ({ ...old, [id]: value }))}
              />
            )}
          </section>
        )}
        {create.isError && <Notice tone="danger">{errorMessage(create.error)}</Notice>}
        <div>
          <Button
            type="submit"
            variant="primary"
            busy={create.isPending}
            disabled={supplierId === null}
          >
            Save draft
          </Button>
        </div>
      </form>
    </div>
  );
}
