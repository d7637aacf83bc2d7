import { Link } from 'react-router';
import type { LabAreaDetail } from '@lotwise/shared';
import { TableScroll } from '../../../components/ui/table-scroll';
import { paths } from '../../../config/paths';
import { formatLitres } from '../../../lib/format';

const link = 'text-accent-700 underline underline-offset-2';

/** Ignitable liquid waste the area's totals include (shown only when there is some). */
export function CountedWaste({ area }: { area: LabAreaDetail }) {
  if (area.countedWaste.length === 0) return null;
  return (
    <section aria-labelledby="counted-waste-heading" className="flex flex-col gap-2">
      <h2 id="counted-waste-heading" className="text-base font-semibold">
        Ignitable waste counted
      </h2>
      <p className="text-sm text-ink-600">
        Waste ignitable liquids count toward the totals above, under the most severe class of what
        went in. Amounts are the estimates entered with each addition.
      </p>
      <TableScroll label="Ignitable waste counted">
        <table className="w-full text-sm">
          <thead className="text-left text-xs text-ink-600 uppercase">
            <tr>
              <th scope="col" className="py-1 pr-3">
                Waste container
              </th>
              <th scope="col" className="py-1 pr-3">
                Class
              </th>
              <th scope="col" className="py-1 pr-3 text-right">
                Litres
              </th>
              <th scope="col" className="py-1">
                Where
              </th>
            </tr>
          </thead>
          <tbody>
            {area.countedWaste.map((w) => (
              <tr key={w.wasteContainerId} className="border-t border-ink-100 align-top">
                <td className="py-1.5 pr-3">
                  <Link
                    to={paths.stockWasteContainer(w.wasteContainerId)}
                    className={`font-mono ${link}`}
                  >
                    {w.labelCode}
                  </Link>{' '}
                  {w.title}
                </td>
                <td className="py-1.5 pr-3">
                  <span className="whitespace-nowrap">{w.liquidClass}</span>
                  {w.liquidClassNote && (
                    <span className="block text-xs text-ink-600">{w.liquidClassNote}</span>
                  )}
                </td>
                <td className="py-1.5 pr-3 text-right tabular-nums">{formatLitres(w.litres)}</td>
                <td className="py-1.5 text-xs">
                  <span className="block">{w.locationPath}</span>
                  <span className="text-ink-600">
                    {w.inStorage ? 'In approved storage' : 'Not in approved storage'}
                  </span>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </TableScroll>
    </section>
  );
}
