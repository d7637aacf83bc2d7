import { Link } from 'react-router';
import { CalendarClock, CircleMinus, PackageCheck, TriangleAlert } from 'lucide-react';
import {
  formatMoney,
  formatPricePerUnit,
  type PackOffer,
  type ReorderSuggestion,
} from '@lotwise/shared';
import { HazardCodes } from '../../../components/hazards/hazard-codes';
import { Badge } from '../../../components/ui/badge';
import { Checkbox } from '../../../components/ui/input';
import { paths } from '../../../config/paths';
import { formatAmount, formatDate } from '../../../lib/format';
import { daysText, wholeDays } from './restock-format';
import { TableScroll } from '../../../components/ui/table-scroll';

/** When to reorder, in words and an icon (never colour alone). */
function WhenBadge({ suggestion }: { suggestion: ReorderSuggestion }) {
  if (suggestion.due) {
    return (
      <Badge tone="danger" icon={<TriangleAlert aria-hidden="true" />}>
        Reorder now
      </Badge>
    );
  }
  if (suggestion.daysToReorderPoint === null) {
    return (
      <Badge tone="neutral" icon={<CircleMinus aria-hidden="true" />}>
        Not being used
      </Badge>
    );
  }
  const days = wholeDays(suggestion.daysToReorderPoint);
  return (
    <Badge tone={days <= 14 ? 'warn' : 'ok'} icon={<CalendarClock aria-hidden="true" />}>
      {days === 0 ? 'Reorder today' : `Reorder in ${daysText(days)}`}
    </Badge>
  );
}

function OfferCell({
  offer,
  suggestion,
  currency,
}: {
  offer: PackOffer | null;
  suggestion: ReorderSuggestion;
  currency: string;
}) {
  if (!offer) {
    return <span className="text-ink-600">{suggestion.notes[0] ?? 'No offer'}</span>;
  }
  const fees = offer.shippingFeeMinor + offer.hazardousFeeMinor;
  return (
    <div className="flex flex-col gap-0.5">
      <span className="font-medium text-ink-900">{offer.supplier.name}</span>
      <span>
        {offer.packs
          .map(
            (pack) =>
              `${pack.count} × ${formatAmount(pack.packSize, pack.packUnit)}${pack.hazardous ? ' (hazardous goods)' : ''}`,
          )
          .join(' + ')}
      </span>
      <span className="tabular-nums">
        <strong>{formatMoney(offer.totalMinor, currency)}</strong>{' '}
        <span className="text-ink-600">
          incl. {formatMoney(fees, currency)} fees ·{' '}
          {formatPricePerUnit(offer.pricePerUnitMinor, currency, suggestion.unit)}
        </span>
      </span>
      {offer.belowMinimumOrder && (
        <span className="text-xs text-warn-700">
          Below the supplier’s minimum order of {formatMoney(offer.minimumOrderMinor, currency)} by{' '}
          {formatMoney(offer.minimumOrderShortMinor, currency)}: add other lines.
        </span>
      )}
      {suggestion.alternatives.length > 0 && (
        <span className="text-xs text-ink-600">
          Next:{' '}
          {suggestion.alternatives
            .map(
              (other) =>
                `${other.supplier.name} ${formatMoney(other.totalMinor, currency)} (${formatPricePerUnit(other.pricePerUnitMinor, currency, suggestion.unit)})`,
            )
            .join('; ')}
        </span>
      )}
    </div>
  );
}

/**
 * The reorder worklist: per chemical with a reorder point, stock, use, days left, what to
 * buy and the best offer with fees. With `selected`, rows with an offer can be picked.
 */
export function SuggestionsTable({
  items,
  currency,
  windowWeeks,
  selected,
  onToggle,
}: {
  items: ReorderSuggestion[];
  currency: string;
  windowWeeks: number;
  selected?: ReadonlySet<number>;
  onToggle?: (chemicalId: number) => void;
}) {
  const selectable = selected !== undefined && onToggle !== undefined;
  return (
    <TableScroll className="rounded-lg border border-ink-200 bg-white">
      <table aria-label="Reorder suggestions" className="w-full text-sm">
        <thead className="border-b border-ink-200 bg-ink-50 text-left text-xs text-ink-600 uppercase">
          <tr>
            {selectable && (
              <th scope="col" className="w-10 px-3 py-2 font-medium">
                <span className="sr-only">Choose</span>
              </th>
            )}
            <th scope="col" className="px-3 py-2 font-medium">
              Chemical and hazards
            </th>
            <th scope="col" className="px-3 py-2 text-right font-medium">
              On hand
            </th>
            <th scope="col" className="px-3 py-2 text-right font-medium">
              Use ({windowWeeks} weeks)
            </th>
            <th scope="col" className="px-3 py-2 font-medium">
              When
            </th>
            <th scope="col" className="px-3 py-2 text-right font-medium">
              To buy
            </th>
            <th scope="col" className="px-3 py-2 font-medium">
              Best offer, fees included
            </th>
          </tr>
        </thead>
        <tbody>
          {items.map((item) => {
            const id = item.chemical.id;
            const checkboxId = `restock-pick-${id}`;
            return (
              <tr key={id} className="border-b border-ink-200 align-top last:border-b-0">
                {selectable && (
                  <td className="px-3 py-2">
                    <Checkbox
                      id={checkboxId}
                      aria-label={`Choose ${item.chemical.name}`}
                      checked={selected.has(id)}
                      disabled={!item.offer}
                      onChange={() => onToggle(id)}
                    />
                  </td>
                )}
                <th scope="row" className="px-3 py-2 text-left font-medium text-ink-900">
                  <Link
                    to={paths.stockChemical(id)}
                    className="text-accent-700 underline-offset-2 hover:underline"
                  >
                    {item.chemical.name}
                  </Link>
                  {item.chemical.restricted && (
                    <span className="ml-1 text-xs font-normal text-warn-700">
                      (restricted: a manager approves)
                    </span>
                  )}
                  <div className="mt-1 font-normal">
                    <HazardCodes
                      pictograms={item.chemical.ghsPictograms}
                      statements={item.chemical.hazardStatements}
                    />
                  </div>
                </th>
                <td className="px-3 py-2 text-right tabular-nums">
                  <span className="whitespace-nowrap">{formatAmount(item.onHand, item.unit)}</span>
                  <span className="block text-xs text-ink-600">
                    reorder at {formatAmount(item.reorderPoint, item.unit)}
                  </span>
                  {item.onOrder > 0 && (
                    <span className="mt-0.5 inline-flex items-center gap-1 text-xs text-accent-800">
                      <PackageCheck aria-hidden="true" className="size-3.5" />
                      {formatAmount(item.onOrder, item.unit)} on order
                    </span>
                  )}
                </td>
                <td className="px-3 py-2 text-right tabular-nums">
                  {item.ratePerDay === null ? (
                    <span className="text-ink-600">none drawn</span>
                  ) : (
                    <>
                      <span className="whitespace-nowrap">
                        {formatAmount(item.ratePerDay * 7, item.unit)}/week
                      </span>
                      <span className="block text-xs text-ink-600">
                        {formatAmount(item.consumed, item.unit)} in{' '}
                        {daysText(wholeDays(item.rateDays))}
                      </span>
                    </>
                  )}
                </td>
                <td className="px-3 py-2">
                  <WhenBadge suggestion={item} />
                  {item.reorderPointOn && !item.due && (
                    <span className="mt-0.5 block text-xs text-ink-600">
                      on {formatDate(item.reorderPointOn)}
                    </span>
                  )}
                  {item.daysLeft !== null && (
                    <span className="block text-xs text-ink-600 tabular-nums">
                      empty in about {daysText(wholeDays(item.daysLeft))}
                    </span>
                  )}
                </td>
                <td className="px-3 py-2 text-right tabular-nums">
                  {item.quantityToBuy === null ? (
                    <span className="text-ink-600">no reorder quantity</span>
                  ) : (
                    <span className="whitespace-nowrap">
                      {formatAmount(item.quantityToBuy, item.unit)}
                    </span>
                  )}
                </td>
                <td className="min-w-60 px-3 py-2">
                  <OfferCell offer={item.offer} suggestion={item} currency={currency} />
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </TableScroll>
  );
}
