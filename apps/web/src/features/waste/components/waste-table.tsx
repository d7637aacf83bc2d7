import { Link } from 'react-router';
import { liquidClassLabels, wasteStatusLabels, type WasteContainer } from '@lotwise/shared';
import { formatAmount, formatCount, formatDate } from '../../../lib/format';
import { paths } from '../../../config/paths';

/** "2.1 L of 5 L (42 %)", or the capacity alone when the amounts cannot be added up. */
export function fillText(c: WasteContainer): string {
  if (c.filled === null || c.fillFraction === null) {
    return `capacity ${formatAmount(c.capacity, c.capacityUnit)}`;
  }
  return `${formatAmount(c.filled, c.capacityUnit)} of ${formatAmount(c.capacity, c.capacityUnit)} (${Math.round(c.fillFraction * 100)} %)`;
}

/** "12 days (since 3 Nov 2026)", or "nothing added yet". */
export function ageText(c: WasteContainer, maxDays?: number | null): string {
  if (c.ageDays === null || c.accumulationStartOn === null) return 'nothing added yet';
  const limit = maxDays ? ` of ${formatCount(maxDays)} allowed` : '';
  return `${formatCount(c.ageDays)} ${c.ageDays === 1 ? 'day' : 'days'}${limit} (since ${formatDate(c.accumulationStartOn)})`;
}

/** Waste containers as a table that stacks on a phone. */
export function WasteTable({
  containers,
  maxAccumulationDays,
  caption,
}: {
  containers: readonly WasteContainer[];
  maxAccumulationDays?: number | null;
  caption: string;
}) {
  return (
    <div className="stack-table overflow-x-auto">
      <table className="w-full text-left text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead className="text-xs text-ink-600 uppercase">
          <tr>
            <th scope="col" className="px-3 py-2">
              Label
            </th>
            <th scope="col" className="px-3 py-2">
              Collects
            </th>
            <th scope="col" className="px-3 py-2">
              Characteristics
            </th>
            <th scope="col" className="px-3 py-2">
              Fill (approximate)
            </th>
            <th scope="col" className="px-3 py-2">
              Accumulating for
            </th>
            <th scope="col" className="px-3 py-2">
              Status
            </th>
          </tr>
        </thead>
        <tbody>
          {containers.map((c) => (
            <tr key={c.id} className="border-t border-ink-100">
              <td data-label="Label" className="px-3 py-2 font-mono">
                <Link
                  to={paths.stockWasteContainer(c.id)}
                  className="text-accent-700 underline-offset-2 hover:underline"
                >
                  {c.labelCode}
                </Link>
              </td>
              <td data-label="Collects" className="px-3 py-2 text-ink-900">
                {c.title}
                {c.acutelyHazardous && (
                  <span className="ml-2 rounded bg-danger-50 px-1.5 py-0.5 text-xs font-medium text-danger-700">
                    Acutely hazardous
                  </span>
                )}
              </td>
              <td data-label="Characteristics" className="px-3 py-2 text-ink-800">
                {c.characteristics.length ? c.characteristics.join(', ') : 'none marked'}
                {c.liquidClass && (
                  <span className="block text-xs text-ink-600">
                    counts as {liquidClassLabels[c.liquidClass]}
                    {c.liquidClassNote ? ' (assumed)' : ''}
                  </span>
                )}
              </td>
              <td data-label="Fill" className="px-3 py-2 tabular-nums text-ink-800">
                {fillText(c)}
              </td>
              <td data-label="Accumulating for" className="px-3 py-2 text-ink-800">
                {ageText(c, maxAccumulationDays)}
              </td>
              <td data-label="Status" className="px-3 py-2 text-ink-800">
                {wasteStatusLabels[c.status]}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
