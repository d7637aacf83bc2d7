import type { ReactNode } from 'react';
import { useQuery } from '@tanstack/react-query';
import { CirclePlus, Equal, RefreshCw } from 'lucide-react';
import {
  formatMoney,
  priceListActionLabels,
  supplierPageSchema,
  type PriceListAction,
  type PriceListSummary,
} from '@lotwise/shared';
import { Badge } from '../../../components/ui/badge';
import { Field } from '../../../components/ui/field';
import { Select } from '../../../components/ui/input';
import { api } from '../../../lib/api-client';
import { formatAmount, formatCount } from '../../../lib/format';
import { TableScroll } from '../../../components/ui/table-scroll';

const actionIcons: Record<PriceListAction, ReactNode> = {
  create: <CirclePlus aria-hidden="true" />,
  update: <RefreshCw aria-hidden="true" />,
  unchanged: <Equal aria-hidden="true" />,
};
const actionTones = { create: 'ok', update: 'accent', unchanged: 'neutral' } as const;

/** Suppliers still in use, to choose whose price list a file is. */
function useSupplierChoices() {
  return useQuery({
    queryKey: ['suppliers', 'list', 'choices'],
    queryFn: ({ signal }) =>
      api.get('/api/suppliers?archived=false&pageSize=200', supplierPageSchema, signal),
  });
}

/** Which supplier the price list is for; the supplier page links here with it chosen. */
export function SupplierChoice({
  supplierId,
  onChange,
}: {
  supplierId: number | null;
  onChange: (id: number) => void;
}) {
  const suppliers = useSupplierChoices();
  const items = suppliers.data?.items ?? [];
  return (
    <Field
      label="Supplier"
      hint="Rows with an SKU this supplier already has update that item; new SKUs are added."
      error={suppliers.isError ? 'The suppliers could not be loaded.' : undefined}
    >
      {(control) => (
        <Select
          {...control}
          className="max-w-md"
          value={supplierId ?? ''}
          disabled={suppliers.isPending}
          onChange={(event) => onChange(Number(event.target.value))}
        >
          <option value="" disabled>
            {suppliers.isPending ? 'Loading suppliers…' : 'Choose the supplier'}
          </option>
          {items.map((supplier) => (
            <option key={supplier.id} value={supplier.id}>
              {supplier.name}
            </option>
          ))}
        </Select>
      )}
    </Field>
  );
}

/** What a price list adds and changes, with every row's price before and after. */
export function PriceListSummaryView({
  summary,
  done = false,
}: {
  summary: PriceListSummary;
  done?: boolean;
}) {
  const money = (minor: number) => formatMoney(minor, summary.currency, undefined);
  const { items } = summary;
  const tiles: [PriceListAction, number, string][] = [
    ['create', items.new, done ? 'added to the catalogue' : 'to add to the catalogue'],
    ['update', items.updated, done ? 'updated' : 'to update (price or details changed)'],
    ['unchanged', items.unchanged, 'already as in the file'],
  ];
  return (
    <div className="flex flex-col gap-3">
      <p className="text-sm text-ink-700">
        Price list of <strong className="font-semibold">{summary.supplier.name}</strong>, in{' '}
        {summary.currency}.
      </p>
      <div className="grid gap-2 sm:grid-cols-3">
        {tiles.map(([action, count, detail]) => (
          <div
            key={action}
            className="flex gap-3 rounded-lg border border-ink-200 bg-white px-3 py-2.5"
          >
            <span className="mt-0.5 text-accent-700 [&_svg]:size-5">{actionIcons[action]}</span>
            <div>
              <p className="text-xs font-semibold tracking-wide text-ink-600 uppercase">
                {priceListActionLabels[action]}
              </p>
              <p className="text-lg font-semibold text-ink-900 tabular-nums">
                {formatCount(count)}
              </p>
              <p className="text-xs text-ink-600">{detail}</p>
            </div>
          </div>
        ))}
      </div>
      {summary.changes.length > 0 && (
        <TableScroll className="rounded-lg border border-ink-200 bg-white">
          <table className="w-full text-left text-sm">
            <caption className="sr-only">What each row of the file does</caption>
            <thead className="border-b border-ink-200 text-xs tracking-wide text-ink-600 uppercase">
              <tr>
                <th className="px-3 py-2 text-right">Row</th>
                <th className="px-3 py-2">SKU</th>
                <th className="px-3 py-2">Chemical</th>
                <th className="px-3 py-2 text-right">Pack</th>
                <th className="px-3 py-2 text-right">Price before</th>
                <th className="px-3 py-2 text-right">Price in the file</th>
                <th className="px-3 py-2">Does</th>
              </tr>
            </thead>
            <tbody>
              {summary.changes.map((change) => (
                <tr key={change.row} className="border-b border-ink-100 last:border-b-0">
                  <td className="px-3 py-1.5 text-right tabular-nums">{change.row}</td>
                  <td className="px-3 py-1.5 font-mono text-xs">{change.sku}</td>
                  <td className="px-3 py-1.5">{change.chemical}</td>
                  <td className="px-3 py-1.5 text-right whitespace-nowrap tabular-nums">
                    {formatAmount(change.packSize, change.packUnit)}
                  </td>
                  <td className="px-3 py-1.5 text-right whitespace-nowrap tabular-nums">
                    {change.previousPriceMinor === null ? '—' : money(change.previousPriceMinor)}
                  </td>
                  <td className="px-3 py-1.5 text-right whitespace-nowrap tabular-nums">
                    {money(change.priceMinor)}
                  </td>
                  <td className="px-3 py-1.5">
                    <Badge tone={actionTones[change.action]} icon={actionIcons[change.action]}>
                      {priceListActionLabels[change.action]}
                    </Badge>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          {items.new + items.updated + items.unchanged > summary.changes.length && (
            <p className="px-3 py-2 text-xs text-ink-600">
              The first {formatCount(summary.changes.length)} rows are listed; the counts above
              cover every row.
            </p>
          )}
        </TableScroll>
      )}
    </div>
  );
}
