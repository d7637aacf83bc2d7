import { Link } from 'react-router';
import { FlaskConical } from 'lucide-react';
import type { StockCheck, StockCheckLine, StockSuggestion } from '@lotwise/shared';
import { ReorderShortfall } from '../../../components/purchasing/reorder-shortfall';
import { buttonClasses } from '../../../components/ui/button';
import { withQuery } from '../../../lib/api-client';
import { formatAmount, formatDate, formatPercent, formatRoundedAmount } from '../../../lib/format';
import { paths } from '../../../config/paths';
import { roleLabels, StatusBadge, stockLineLooks } from '../labels';
import { fullPrecision, Rounded } from './rounded';
import { StockAmount, TakeAmount } from './stock-amount';
import { TableScroll } from '../../../components/ui/table-scroll';

function Suggestion({ suggestion, line }: { suggestion: StockSuggestion; line: StockCheckLine }) {
  if (suggestion.kind === 'reorder') {
    return (
      <li className="flex flex-wrap items-center gap-2" data-testid="reorder-suggestion">
        <ReorderShortfall
          chemicalId={suggestion.chemicalId}
          chemicalName={line.chemical.name}
          shortfall={suggestion.shortfall}
          unit={suggestion.unit}
          note="Short for a planned preparation"
        />
        <Link
          to={paths.stockChemical(suggestion.chemicalId)}
          className="text-xs text-accent-700 underline-offset-2 hover:underline"
        >
          Stock of {line.chemical.name}
        </Link>
      </li>
    );
  }
  return (
    <li className="flex items-start gap-2" data-testid="prepare-suggestion">
      <FlaskConical aria-hidden="true" className="mt-0.5 size-4 shrink-0 text-accent-600" />
      <div className="flex flex-col items-start gap-1">
        <p>
          <strong>Prepare it first:</strong>{' '}
          <Link
            to={paths.procedure(suggestion.procedureId)}
            className="text-accent-700 underline-offset-2 hover:underline"
          >
            {suggestion.procedureTitle}
          </Link>{' '}
          at factor <strong className="tabular-nums">{suggestion.roundedFactor}</strong>{' '}
          <span className="text-ink-600">
            (exactly {fullPrecision(suggestion.factor)} covers the shortfall); at its expected{' '}
            {formatPercent(suggestion.expectedYieldPercent)} yield that makes about{' '}
            <StockAmount value={suggestion.expectedAmount} unit={suggestion.unit} />.
          </span>
        </p>
        <Link
          to={withQuery(paths.planNew, {
            procedureId: suggestion.procedureId,
            factor: suggestion.roundedFactor,
          })}
          className={buttonClasses('secondary', 'sm')}
        >
          Plan that preparation
        </Link>
      </div>
    </li>
  );
}

/** Every line of the stock check: what is needed, what is usable, what is short, where it is. */
export function StockCheckTable({ check }: { check: StockCheck }) {
  return (
    <div className="flex flex-col gap-2">
      <TableScroll className="stack-table rounded-lg border border-ink-200 bg-white">
        <table aria-label="Stock check" className="w-full text-sm">
          <thead className="border-b border-ink-200 bg-ink-50 text-left text-xs text-ink-600 uppercase">
            <tr>
              <th scope="col" className="px-3 py-2 font-medium">
                Chemical
              </th>
              <th scope="col" className="px-3 py-2 text-right font-medium">
                Per bench
              </th>
              <th scope="col" className="px-3 py-2 text-right font-medium">
                Required
              </th>
              <th scope="col" className="px-3 py-2 text-right font-medium">
                Usable stock
              </th>
              <th scope="col" className="px-3 py-2 font-medium">
                Shortfall
              </th>
              <th scope="col" className="px-3 py-2 font-medium">
                Take from
              </th>
            </tr>
          </thead>
          {check.lines.map((line) => (
            <tbody
              key={line.index}
              className="border-b border-ink-200 last:border-b-0"
              data-testid={`stock-line-${line.index}`}
            >
              <tr className="align-top">
                <th scope="row" className="px-3 py-2 text-left font-medium text-ink-900">
                  {line.chemical.name}
                  <span className="block text-xs font-normal text-ink-600">
                    {line.purpose === 'dissolving'
                      ? `to dissolve line ${line.lineIndex + 1}`
                      : roleLabels[line.role]}
                    {line.optional && ' · optional'}
                    {line.chemical.defaultPurityPercent !== 100 &&
                      ` · as supplied at ${line.chemical.defaultPurityPercent} %`}
                  </span>
                </th>
                <td data-label="Per bench" className="px-3 py-2 text-right">
                  {line.perBenchDisplay && line.perBench !== null ? (
                    <Rounded
                      text={formatRoundedAmount(line.perBenchDisplay)}
                      value={line.perBench}
                      unit={line.unit}
                      rule={line.perBenchDisplay.rule}
                    />
                  ) : (
                    '—'
                  )}
                </td>
                <td data-label="Required" className="px-3 py-2 text-right">
                  {line.requiredDisplay && line.required !== null ? (
                    <span className="font-semibold">
                      <Rounded
                        text={formatRoundedAmount(line.requiredDisplay)}
                        value={line.required}
                        unit={line.unit}
                        rule={line.requiredDisplay.rule}
                      />
                    </span>
                  ) : (
                    '—'
                  )}
                  {line.requiredPure !== null && line.requiredPure !== line.required && (
                    <span className="block text-xs text-ink-600">
                      pure: <StockAmount value={line.requiredPure} unit={line.unit} />
                    </span>
                  )}
                  {line.requiredPureG !== null && line.unit !== 'g' && (
                    <span className="block text-xs text-ink-600">
                      pure substance {formatAmount(line.requiredPureG, 'g')}
                    </span>
                  )}
                </td>
                <td data-label="Usable stock" className="px-3 py-2 text-right">
                  <StockAmount value={line.available} unit={line.unit} />
                  {line.availablePure !== line.available && (
                    <span className="block text-xs text-ink-600">
                      pure: <StockAmount value={line.availablePure} unit={line.unit} />
                    </span>
                  )}
                </td>
                <td data-label="Shortfall" className="px-3 py-2">
                  <StatusBadge look={stockLineLooks[line.status]} />
                  {line.status === 'short' && (
                    <span className="mt-1 block font-semibold text-danger-700">
                      short by{' '}
                      <StockAmount
                        value={line.shortfall}
                        unit={line.unit}
                        testId={`shortfall-${line.index}`}
                      />
                    </span>
                  )}
                  {line.problem && (
                    <span className="mt-1 block text-xs text-warn-700">{line.problem}</span>
                  )}
                </td>
                <td data-label="Take from" data-wide className="px-3 py-2">
                  {line.take.length === 0 ? (
                    <span className="text-ink-600">No usable container</span>
                  ) : (
                    <ul className="flex flex-col gap-1">
                      {line.take.map((take) => (
                        <li key={take.containerId} className="leading-5">
                          <Link
                            to={paths.stockContainer(take.containerId)}
                            className="font-mono text-xs font-semibold text-accent-700 underline-offset-2 hover:underline"
                          >
                            {take.labelCode}
                          </Link>{' '}
                          take{' '}
                          <TakeAmount take={take.take} holds={take.quantity} unit={line.unit} />
                          <span className="block text-xs text-ink-600">
                            {take.locationPath} · {take.status} · holds{' '}
                            {formatAmount(take.quantity, line.unit)}
                            {take.purityPercent !== 100 && ` · ${take.purityPercent} %`}
                            {take.expiresOn && ` · expires ${formatDate(take.expiresOn)}`}
                            {take.reservedByOthers > 0 &&
                              ` · ${formatAmount(take.reservedByOthers, line.unit)} held by other plans`}
                          </span>
                        </li>
                      ))}
                    </ul>
                  )}
                </td>
              </tr>
              {line.status === 'short' && line.suggestions.length > 0 && (
                <tr>
                  <td colSpan={6} className="bg-warn-50/60 px-3 py-2">
                    <p className="mb-1 text-xs font-semibold text-ink-700 uppercase">
                      What to do about {line.chemical.name}
                    </p>
                    <ul className="flex flex-col gap-1.5 text-sm">
                      {line.suggestions.map((suggestion, index) => (
                        <Suggestion
                          key={`${suggestion.kind}-${index}`}
                          suggestion={suggestion}
                          line={line}
                        />
                      ))}
                    </ul>
                  </td>
                </tr>
              )}
            </tbody>
          ))}
        </table>
      </TableScroll>
      <p className="text-xs leading-5 text-ink-600">
        {check.rule} Amounts are checked as of {formatDate(check.asOf)}.
      </p>
    </div>
  );
}
