import { Link } from 'react-router';
import { CircleCheck, GitBranch, Printer, TriangleAlert } from 'lucide-react';
import type { Run } from '@lotwise/shared';
import { buttonClasses } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { TableScroll } from '../../../components/ui/table-scroll';
import { withQuery } from '../../../lib/api-client';
import { cn } from '../../../lib/cn';
import { formatPercent } from '../../../lib/format';
import { paths } from '../../../config/paths';
import { Property, Section } from './page-parts';
import { Mass } from './rounded';
import { StockAmount } from './stock-amount';
import { YieldText } from './yield-text';

/*
 * What a recorded run holds: its yield, the product put into stock, the draws and the
 * observations. Shown on the run page and on its printable notebook page.
 */

export function YieldSummary({ run }: { run: Run }) {
  return (
    <section
      aria-labelledby="yield-heading"
      className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-white px-4 py-3"
    >
      <h2 id="yield-heading" className="text-base font-semibold">
        Yield
      </h2>
      <div className="flex flex-wrap gap-x-10 gap-y-3">
        <div>
          <p className="text-xs text-ink-600 uppercase">Purified yield</p>
          <p className="text-2xl font-semibold tabular-nums" data-testid="percent-yield">
            <YieldText percent={run.percentYield} />
          </p>
          <p className="text-xs text-ink-600">expected {formatPercent(run.expectedYieldPercent)}</p>
        </div>
        <div>
          <p className="text-xs text-ink-600 uppercase">Obtained (all portions)</p>
          <p className="text-2xl font-semibold">
            <Mass g={run.productMassG} />
          </p>
        </div>
        <div>
          <p className="text-xs text-ink-600 uppercase">Theoretical yield</p>
          <p className="text-2xl font-semibold">
            <Mass g={run.theoreticalYieldG} />
          </p>
          <p className="text-xs text-ink-600">from the amounts really used</p>
        </div>
        {run.crudeMassG !== null && (
          <div>
            <p className="text-xs text-ink-600 uppercase">Crude</p>
            <p className="text-2xl font-semibold">
              <Mass g={run.crudeMassG} />
            </p>
            <p className="text-xs text-ink-600" data-testid="crude-yield">
              crude yield <YieldText percent={run.crudePercentYield} />
            </p>
          </div>
        )}
      </div>
      {run.crudeYieldFlag && (
        <Notice tone="danger" title="Crude above 100 %: probably wet or impure">
          {run.crudeYieldFlag}
        </Notice>
      )}
      {run.yieldFlag && (
        <Notice tone="danger" title="Above 100 %: probably wet or impure">
          {run.yieldFlag}
        </Notice>
      )}
    </section>
  );
}

export function Portions({ run }: { run: Run }) {
  if (run.portions.length === 0) {
    return <p className="text-sm text-ink-600">No product was put into stock.</p>;
  }
  const ids = run.portions.map((p) => p.containerId).join(',');
  return (
    <div className="flex flex-col gap-2">
      <TableScroll className="rounded-lg border border-ink-200 bg-white">
        <table aria-label="Product put into stock" className="w-full text-sm">
          <thead className="border-b border-ink-200 bg-ink-50 text-left text-xs text-ink-600 uppercase">
            <tr>
              <th className="px-3 py-2 font-medium">Portion</th>
              <th className="px-3 py-2 font-medium">New container</th>
              <th className="px-3 py-2 font-medium">Location</th>
              <th className="px-3 py-2 text-right font-medium">Amount</th>
              <th className="px-3 py-2 text-right font-medium">Yield</th>
              <th className="px-3 py-2 font-medium">Lot</th>
            </tr>
          </thead>
          <tbody>
            {run.portions.map((portion) => (
              <tr key={portion.id} className="border-b border-ink-100 last:border-b-0">
                <td className="px-3 py-2">{portion.label}</td>
                <td className="px-3 py-2">
                  <Link
                    to={paths.stockContainer(portion.containerId)}
                    className="font-mono text-xs font-semibold text-accent-700 underline-offset-2 hover:underline"
                  >
                    {portion.labelCode}
                  </Link>
                  <span className="block text-xs text-ink-600">{portion.chemicalName}</span>
                </td>
                <td className="px-3 py-2 text-ink-700">{portion.locationPath}</td>
                <td className="px-3 py-2 text-right">
                  <StockAmount value={portion.quantity} unit={portion.unit} />
                </td>
                <td className="px-3 py-2 text-right">
                  <YieldText percent={portion.percentYield} />
                </td>
                <td className="px-3 py-2">
                  <Link
                    to={paths.lotProvenance(portion.lotId)}
                    className="inline-flex items-center gap-1 text-accent-700 underline-offset-2 hover:underline"
                  >
                    <GitBranch aria-hidden="true" className="size-3.5" />
                    Provenance
                  </Link>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </TableScroll>
      <Link
        to={withQuery(paths.stockLabels, { ids })}
        className={`${buttonClasses('secondary')} self-start`}
      >
        <Printer aria-hidden="true" className="size-4" />
        Print labels
      </Link>
    </div>
  );
}

/** What was drawn from stock for the run, line by line. */
export function RunDraws({ run }: { run: Run }) {
  return (
    <Section id="draws-heading" title="Drawn from stock">
      {run.draws.length === 0 ? (
        <p className="text-sm text-ink-600">No draws recorded.</p>
      ) : (
        <TableScroll className="rounded-lg border border-ink-200 bg-white">
          <table aria-label="Drawn from stock" className="w-full text-sm">
            <thead className="border-b border-ink-200 bg-ink-50 text-left text-xs text-ink-600 uppercase">
              <tr>
                <th className="px-3 py-2 font-medium">For</th>
                <th className="px-3 py-2 font-medium">Chemical</th>
                <th className="px-3 py-2 font-medium">Container</th>
                <th className="px-3 py-2 text-right font-medium">Drawn</th>
                <th className="px-3 py-2 text-right font-medium">Lot purity</th>
              </tr>
            </thead>
            <tbody>
              {run.draws.map((draw) => (
                <tr key={draw.id} className="border-b border-ink-100 last:border-b-0">
                  <td className="px-3 py-1.5 text-ink-700">
                    {draw.lineIndex === null
                      ? `Extra: ${draw.purpose || 'not a line'}`
                      : `Line ${draw.lineIndex + 1}`}
                  </td>
                  <td className="px-3 py-1.5">
                    <Link
                      to={paths.chemicalUsage(draw.chemicalId)}
                      className="underline-offset-2 hover:underline"
                    >
                      {draw.chemicalName}
                    </Link>
                  </td>
                  <td className="px-3 py-1.5">
                    <Link
                      to={paths.stockContainer(draw.containerId)}
                      className="font-mono text-xs font-semibold text-accent-700 underline-offset-2 hover:underline"
                    >
                      {draw.labelCode}
                    </Link>
                  </td>
                  <td className="px-3 py-1.5 text-right">
                    <StockAmount value={draw.quantity} unit={draw.unit} />
                  </td>
                  <td className="px-3 py-1.5 text-right tabular-nums">
                    {formatPercent(draw.purityPercent)}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </TableScroll>
      )}
    </Section>
  );
}

/** The melting range (with its comparison to the literature), appearance and notes. */
export function RunObservations({ run }: { run: Run }) {
  return (
    <section
      aria-labelledby="observations-heading"
      className="rounded-lg border border-ink-200 bg-white px-4 py-3 break-inside-avoid"
    >
      <h2 id="observations-heading" className="mb-1 text-base font-semibold">
        Observations
      </h2>
      <dl>
        <Property term="Melting range">
          <span className="tabular-nums">
            {run.observations.meltingRangeC
              ? `${run.observations.meltingRangeC.low}–${run.observations.meltingRangeC.high} °C`
              : '—'}
          </span>
          {run.observations.literatureMeltingC && (
            <span className="block text-xs text-ink-600 tabular-nums">
              literature {run.observations.literatureMeltingC.low}–
              {run.observations.literatureMeltingC.high} °C
            </span>
          )}
          {run.observations.meltingComparison && (
            <span
              data-testid="melting-comparison"
              className={cn(
                'flex items-start gap-1 text-xs',
                run.observations.meltingComparison.agrees ? 'text-ok-700' : 'text-warn-700',
              )}
            >
              {run.observations.meltingComparison.agrees ? (
                <CircleCheck aria-hidden="true" className="mt-px size-3.5 shrink-0" />
              ) : (
                <TriangleAlert aria-hidden="true" className="mt-px size-3.5 shrink-0" />
              )}
              {run.observations.meltingComparison.text}
            </span>
          )}
        </Property>
        <Property term="Appearance">{run.observations.appearance || '—'}</Property>
        <Property term="Notes">
          <span className="whitespace-pre-line">
            {[run.observations.notes, run.notes].filter(Boolean).join('\n') || '—'}
          </span>
        </Property>
      </dl>
    </section>
  );
}
