import type { OrderDetail } from '@lotwise/shared';
import { PictogramList } from '../../../components/hazards/pictogram-badge';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { formatAmount, formatPercent } from '../../../lib/format';
import { money } from '../labels';
import { LinePacksEditor } from './line-packs-editor';
import { TableScroll } from '../../../components/ui/table-scroll';

/** What the order buys: each line's chemical with its hazards, pack, price and what is claimed. */
export function OrderLinesTable({ order }: { order: OrderDetail }) {
  return (
    <section aria-labelledby="order-lines-heading" className="flex flex-col gap-2">
      <h2 id="order-lines-heading" className="text-base font-semibold text-ink-900">
        What the order buys
      </h2>
      <SafetyCaution />
      <TableScroll className="rounded-lg border border-ink-200 bg-white">
        <table className="w-full text-sm">
          <thead className="bg-ink-50 text-left text-xs text-ink-600">
            <tr>
              <th className="px-3 py-2 font-semibold">Chemical and hazards</th>
              <th className="px-3 py-2 font-semibold">Pack</th>
              <th className="px-3 py-2 text-right font-semibold">Price</th>
              <th className="px-3 py-2 text-right font-semibold">Claimed</th>
              <th className="px-3 py-2 text-right font-semibold">Unclaimed</th>
            </tr>
          </thead>
          <tbody>
            {order.lines.map((line) => (
              <tr
                key={line.id}
                data-testid={`order-line-${line.id}`}
                className="border-t border-ink-100 align-top"
              >
                <td className="px-3 py-2">
                  <p className="font-medium text-ink-900">{line.chemical.name}</p>
                  <p className="text-xs text-ink-600 tabular-nums">
                    {line.chemical.casNumber ? `CAS ${line.chemical.casNumber} · ` : ''}
                    {line.sku}
                  </p>
                  <div className="mt-1 flex flex-col gap-1">
                    <PictogramList codes={line.chemical.ghsPictograms} />
                    {line.chemical.hazardStatements.length > 0 && (
                      <ul className="text-xs text-ink-700">
                        {line.chemical.hazardStatements.map(({ code, text }) => (
                          <li key={code}>
                            <span className="font-semibold tabular-nums">{code}</span>{' '}
                            {text ?? 'text not held in Lotwise — see SDS'}
                          </li>
                        ))}
                      </ul>
                    )}
                  </div>
                </td>
                <td className="px-3 py-2 tabular-nums">
                  <p>
                    {line.packs} × {formatAmount(line.packSize, line.packUnit)}
                  </p>
                  <p className="text-xs text-ink-600">
                    {[
                      line.grade,
                      line.purityPercent !== null ? formatPercent(line.purityPercent) : null,
                      line.splittable
                        ? `may be split (steps of ${formatAmount(line.claimStep, line.packUnit)})`
                        : 'whole packs only',
                      line.hazardous ? 'ships as hazardous goods' : null,
                    ]
                      .filter(Boolean)
                      .join(' · ')}
                  </p>
                  {order.abilities.mayEditLines && <LinePacksEditor order={order} line={line} />}
                </td>
                <td className="px-3 py-2 text-right whitespace-nowrap tabular-nums">
                  <p>{money(line.totalMinor, order.currency)}</p>
                  <p className="text-xs text-ink-600">
                    {money(line.unitPriceMinor, order.currency)} a pack
                  </p>
                </td>
                <td className="px-3 py-2 text-right whitespace-nowrap tabular-nums">
                  {formatAmount(line.claimedQuantity, line.packUnit)}
                  <p className="text-xs text-ink-600">
                    of {formatAmount(line.orderedQuantity, line.packUnit)}
                  </p>
                </td>
                <td className="px-3 py-2 text-right whitespace-nowrap tabular-nums">
                  {line.unclaimedQuantity > 0 ? (
                    <>
                      <span className="font-medium">
                        {formatAmount(line.unclaimedQuantity, line.packUnit)}
                      </span>
                      <p className="text-xs text-ink-600">
                        {money(line.unclaimedMinor, order.currency)} with fees
                      </p>
                    </>
                  ) : (
                    <span className="text-ink-600">None</span>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
        {order.lines.length === 0 && (
          <p className="px-3 py-4 text-sm text-ink-600">No lines yet.</p>
        )}
      </TableScroll>
    </section>
  );
}
