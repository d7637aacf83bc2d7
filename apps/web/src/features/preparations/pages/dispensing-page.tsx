import { useParams } from 'react-router';
import { Printer } from 'lucide-react';
import { ghsPictograms, type DispensingSheet } from '@lotwise/shared';
import { PictogramSymbol } from '../../../components/hazards/pictogram-symbols';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { Button } from '../../../components/ui/button';
import { formatDate, formatPercent, formatRoundedAmount } from '../../../lib/format';
import { paths } from '../../../config/paths';
import { useDispensingSheet } from '../api';
import { roleLabels } from '../labels';
import { BackLink, QueryState } from '../components/page-parts';
import { CautionList, StatementLines } from '../components/preparation-safety';
import { ProcedureSteps, type StepLine } from '../components/procedure-steps';
import { fullPrecision, Rounded } from '../components/rounded';
import { BenchStockStatus, SessionStockSummary, SheetStockNote } from '../components/sheet-stock';
import { TakeAmount } from '../components/stock-amount';

/** Pictograms with code and meaning as words, small enough for paper. */
function PictogramWords({ codes }: { codes: DispensingSheet['lines'][number]['ghsPictograms'] }) {
  if (codes.length === 0) return <span className="text-xs text-ink-600">No pictograms</span>;
  return (
    <ul className="flex flex-wrap gap-x-3 gap-y-1">
      {codes.map((code) => (
        <li key={code} className="flex items-center gap-1 text-xs">
          <PictogramSymbol code={code} size={20} />
          <span>
            <span className="font-semibold tabular-nums">{code}</span> {ghsPictograms[code].meaning}
          </span>
        </li>
      ))}
    </ul>
  );
}

function SheetSafety({ sheet }: { sheet: DispensingSheet }) {
  return (
    <div className="flex flex-col gap-2 rounded-md border border-ink-300 px-3 py-2 break-inside-avoid">
      <SafetyCaution compact />
      <CautionList {...sheet.cautions} />
      <div className="stack-table">
        <table className="w-full text-xs">
          <caption className="sr-only">Hazards of each chemical</caption>
          <tbody>
            {sheet.hazards.map((hazard) => (
              <tr key={hazard.chemicalId} className="border-t border-ink-200 align-top">
                <th scope="row" className="w-40 py-1 pr-2 text-left font-semibold">
                  {hazard.name}
                </th>
                <td data-wide className="w-64 py-1 pr-2">
                  <PictogramWords codes={hazard.ghsPictograms} />
                </td>
                <td data-wide className="py-1">
                  <StatementLines statements={hazard.hazardStatements} />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}

function SheetHeading({ sheet, subtitle }: { sheet: DispensingSheet; subtitle: string }) {
  return (
    <header className="flex flex-wrap items-baseline justify-between gap-2 border-b-2 border-ink-800 pb-1">
      <div>
        <p className="text-xs text-ink-600">
          Lotwise dispensing sheet · plan #{sheet.planId} · {formatDate(sheet.plannedOn)}
        </p>
        <h2 className="text-lg font-semibold text-ink-900">{sheet.procedure.title}</h2>
      </div>
      <p className="text-sm font-semibold">{subtitle}</p>
    </header>
  );
}

function Sheet({ sheet }: { sheet: DispensingSheet }) {
  const benches = Array.from({ length: sheet.benches }, (_, i) => i + 1);
  // Every bench gets the same amounts: the steps repeat the bench table's own text.
  const stepLines: StepLine[] = sheet.lines
    .filter((line) => line.purpose === 'line')
    .map((line) => ({
      lineIndex: line.lineIndex,
      name: line.name,
      amount: line.perBenchDisplay?.text ?? null,
    }));
  return (
    <div className="flex flex-col gap-6 print:gap-0">
      {/* each printed page has its own visible heading; the page as a whole needs one too */}
      <h1 className="sr-only">Dispensing sheet: {sheet.procedure.title}</h1>
      <div className="flex flex-wrap items-center justify-between gap-2 print:hidden">
        <BackLink to={paths.plan(sheet.planId)}>Back to the plan</BackLink>
        <Button
          variant="primary"
          icon={<Printer aria-hidden="true" className="size-4" />}
          onClick={() => window.print()}
        >
          Print
        </Button>
      </div>

      <section
        aria-label="Session totals"
        className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-white p-4 print:break-after-page print:border-0 print:p-0"
      >
        <SheetHeading sheet={sheet} subtitle="Session totals — for the prep room" />
        <p className="text-sm text-ink-700 tabular-nums">
          {sheet.benches} benches × scale {fullPrecision(sheet.scaleFactor)} of the base scale (
          {sheet.procedure.baseScale || 'as written'}), totals with{' '}
          {formatPercent(sheet.overagePercent)} overage.
          {sheet.procedure.reference && (
            <span className="block text-xs">{sheet.procedure.reference}</span>
          )}
        </p>
        <SessionStockSummary sheet={sheet} />
        <SheetSafety sheet={sheet} />
        <div className="stack-table">
          <table className="w-full text-sm">
            <caption className="sr-only">What to dispense for the whole session</caption>
            <thead className="text-left text-xs text-ink-600 uppercase">
              <tr className="border-b border-ink-300">
                <th className="py-1 pr-2 font-medium">Chemical</th>
                <th className="py-1 pr-2 text-right font-medium">Per bench</th>
                <th className="py-1 pr-2 text-right font-medium">Session total</th>
                <th className="py-1 pr-2 font-medium">Dispense from</th>
                <th className="w-72 py-1 font-medium">Stock</th>
              </tr>
            </thead>
            <tbody>
              {sheet.lines.map((line) => (
                <tr
                  key={`${line.lineIndex}-${line.purpose}`}
                  className="border-b border-ink-200 align-top"
                >
                  <th scope="row" className="py-1.5 pr-2 text-left font-semibold">
                    {line.name}
                    <span className="block text-xs font-normal text-ink-600">
                      {line.purpose === 'dissolving' ? 'to dissolve in' : roleLabels[line.role]}
                      {line.optional && ' · optional'}
                    </span>
                  </th>
                  <td data-label="Per bench" className="py-1.5 pr-2 text-right">
                    {line.perBenchDisplay && line.perBench ? (
                      <Rounded
                        text={formatRoundedAmount(line.perBenchDisplay)}
                        value={line.perBench.value}
                        unit={line.perBench.unit}
                        rule={line.perBenchDisplay.rule}
                      />
                    ) : (
                      '—'
                    )}
                  </td>
                  <td data-label="Session total" className="py-1.5 pr-2 text-right font-semibold">
                    {line.totalDisplay && line.total !== null ? (
                      <Rounded
                        text={formatRoundedAmount(line.totalDisplay)}
                        value={line.total}
                        unit={line.totalDisplay.unit}
                        rule={line.totalDisplay.rule}
                      />
                    ) : (
                      '—'
                    )}
                  </td>
                  <td data-label="Dispense from" data-wide className="py-1.5 pr-2 text-xs">
                    {line.containers.length === 0 ? (
                      <span className="font-semibold">No container on hand</span>
                    ) : (
                      <ul>
                        {line.containers.map((c) => (
                          <li key={c.containerId}>
                            <span className="font-mono font-semibold">{c.labelCode}</span>{' '}
                            <TakeAmount take={c.take} holds={c.quantity} unit={c.unit} /> ·{' '}
                            {c.locationPath}
                          </li>
                        ))}
                      </ul>
                    )}
                  </td>
                  <td data-label="Stock" data-wide className="py-1.5">
                    <SheetStockNote line={line} benches={sheet.benches} />
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <ul className="list-disc pl-4 text-xs leading-5 text-ink-600">
          {sheet.rules.map((rule) => (
            <li key={rule}>{rule}</li>
          ))}
        </ul>
      </section>

      {benches.map((bench) => (
        <section
          key={bench}
          aria-label={`Bench ${bench}`}
          className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-white p-4 break-inside-avoid print:break-after-page print:border-0 print:p-0 print:last:break-after-auto"
        >
          <SheetHeading sheet={sheet} subtitle={`Bench ${bench} of ${sheet.benches}`} />
          <BenchStockStatus sheet={sheet} bench={bench} />
          <SheetSafety sheet={sheet} />
          <div className="stack-table">
            <table className="w-full text-sm">
              <caption className="sr-only">What bench {bench} gets</caption>
              <thead className="text-left text-xs text-ink-600 uppercase">
                <tr className="border-b border-ink-300">
                  <th className="w-8 py-1 font-medium">
                    <span className="sr-only">Given out</span>
                  </th>
                  <th className="py-1 pr-2 font-medium">Chemical</th>
                  <th className="py-1 pr-2 font-medium">Pictograms</th>
                  <th className="py-1 pr-2 text-right font-medium">Amount</th>
                  <th className="py-1 font-medium">Notes</th>
                </tr>
              </thead>
              <tbody>
                {sheet.lines
                  .filter((line) => line.role !== 'product')
                  .map((line) => (
                    <tr
                      key={`${line.lineIndex}-${line.purpose}`}
                      className="border-b border-ink-200 align-top"
                    >
                      <td data-stack-hidden className="py-1.5">
                        <span
                          aria-hidden="true"
                          className="inline-block size-4 border border-ink-700"
                        />
                      </td>
                      <th scope="row" className="py-1.5 pr-2 text-left font-semibold">
                        {line.name}
                        <span className="block text-xs font-normal text-ink-600">
                          {line.purpose === 'dissolving' ? 'to dissolve in' : roleLabels[line.role]}
                          {line.optional && ' · optional'}
                        </span>
                      </th>
                      <td data-label="Pictograms" className="py-1.5 pr-2">
                        <PictogramWords codes={line.ghsPictograms} />
                      </td>
                      <td
                        data-label="Amount"
                        className="py-1.5 pr-2 text-right text-base font-semibold whitespace-nowrap tabular-nums"
                      >
                        {line.perBenchDisplay?.text ?? '—'}
                      </td>
                      <td data-label="Notes" data-wide className="py-1.5 text-xs text-ink-700">
                        {line.notes}
                        {line.stock.status !== 'ok' && (
                          <span className={line.notes ? 'mt-1 block' : 'block'}>
                            <SheetStockNote line={line} benches={sheet.benches} />
                          </span>
                        )}
                      </td>
                    </tr>
                  ))}
              </tbody>
            </table>
          </div>
          <ProcedureSteps
            id={`bench-${bench}-steps`}
            title={`Steps at bench ${bench}`}
            steps={sheet.steps}
            lines={stepLines}
          />
        </section>
      ))}
    </div>
  );
}

export function DispensingPage() {
  const id = Number(useParams().id);
  const sheet = useDispensingSheet(id);
  return (
    <QueryState query={sheet} what="dispensing sheet">
      {(data) => <Sheet sheet={data} />}
    </QueryState>
  );
}
