import { useId, useState } from 'react';
import { scaleFactorInputSchema, type Procedure, type ScaledProcedure } from '@lotwise/shared';
import { Ruler, Target } from 'lucide-react';
import { Badge } from '../../../components/ui/badge';
import { Field } from '../../../components/ui/field';
import { AmountInput } from '../../../components/ui/amount-input';
import { Select } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { Spinner } from '../../../components/ui/spinner';
import { errorMessage } from '../../../lib/api-client';
import { parseDecimal } from '../../../lib/numbers';
import { useDebouncedValue } from '../../../lib/use-debounced-value';
import { useScaledProcedure, type ScaleRequest } from '../api';
import { roleLabels } from '../labels';
import { Equivalents, fullPrecision, Mass, Moles, Rounded, Volume } from './rounded';
import { formatRoundedAmount } from '../../../lib/format';
import { TableScroll } from '../../../components/ui/table-scroll';

type Mode = 'factor' | 'limiting' | 'product' | 'product-expected';

const modeLabels: Record<Mode, string> = {
  factor: 'By a factor',
  limiting: 'So the limiting reagent is…',
  product: 'So the theoretical yield is…',
  'product-expected': 'So the expected yield is…',
};

function requestFor(mode: Mode, text: string, unit: string): ScaleRequest | string | null {
  if (text.trim() === '') return null;
  if (mode === 'factor') {
    const parsed = scaleFactorInputSchema.safeParse(text.trim());
    return parsed.success ? { factor: text.trim() } : 'Type a factor such as 2, 0.5 or 1/6.';
  }
  const value = parseDecimal(text);
  if (value === null || Number.isNaN(value) || value <= 0) return 'Type an amount above 0.';
  if (mode === 'limiting') return { targetLimitingMass: value, unit };
  return {
    targetProductMass: value,
    unit,
    basis: mode === 'product-expected' ? 'expected' : 'theoretical',
  };
}

/** The procedure at another scale, worked out by the server with the same rules as plans. */
export function ScalePanel({ procedure }: { procedure: Procedure }) {
  const [mode, setMode] = useState<Mode>('factor');
  const [text, setText] = useState('1/2');
  const [unit, setUnit] = useState('g');
  const debounced = useDebouncedValue(text, 300);
  const request = requestFor(mode, debounced, unit);
  const scaled = useScaledProcedure(
    procedure.id,
    typeof request === 'string' || request === null ? null : request,
  );
  const modeId = useId();

  return (
    <section
      aria-labelledby="scale-heading"
      className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-white px-4 py-3"
    >
      <h2 id="scale-heading" className="flex items-center gap-2 text-base font-semibold">
        <Ruler aria-hidden="true" className="size-4 text-accent-600" />
        Scale it
      </h2>
      <div className="flex flex-wrap items-start gap-3">
        <div className="flex flex-col gap-1">
          <label htmlFor={modeId} className="text-sm font-medium text-ink-800">
            How
          </label>
          <Select
            id={modeId}
            className="w-64"
            value={mode}
            onChange={(event) => {
              const next = event.target.value as Mode;
              setMode(next);
              setText(next === 'factor' ? '1/2' : '');
            }}
          >
            {(Object.keys(modeLabels) as Mode[]).map((key) => (
              <option key={key} value={key}>
                {modeLabels[key]}
              </option>
            ))}
          </Select>
        </div>
        <Field
          label={mode === 'factor' ? 'Factor' : 'Target amount'}
          hint={mode === 'factor' ? 'e.g. 2, 0.5 or 1/6' : undefined}
          error={typeof request === 'string' ? request : undefined}
          className="w-40"
        >
          {(control) => (
            <AmountInput
              {...control}
              value={text}
              onChange={(event) => setText(event.target.value)}
            />
          )}
        </Field>
        {mode !== 'factor' && (
          <Field label="Unit" className="w-24">
            {(control) => (
              <Select {...control} value={unit} onChange={(event) => setUnit(event.target.value)}>
                {['g', 'mg', 'kg', 'mL', 'mmol', 'mol'].map((u) => (
                  <option key={u}>{u}</option>
                ))}
              </Select>
            )}
          </Field>
        )}
        {scaled.isFetching && (
          <span className="mt-8 flex items-center gap-2 text-sm text-ink-600">
            <Spinner size="sm" /> Working it out…
          </span>
        )}
      </div>
      {scaled.isError ? (
        <Notice tone="danger" title="Lotwise could not scale this">
          {errorMessage(scaled.error)}
        </Notice>
      ) : scaled.data ? (
        <ScaledView scaled={scaled.data} />
      ) : null}
    </section>
  );
}

function ScaledView({ scaled }: { scaled: ScaledProcedure }) {
  const yieldView = scaled.theoreticalYield;
  return (
    <div className="flex flex-col gap-3">
      <p className="text-sm text-ink-800">
        Factor{' '}
        <strong className="tabular-nums" data-testid="scaled-factor">
          {fullPrecision(scaled.factor)}
        </strong>
        {scaled.basis !== 'factor' && (
          <span className="text-ink-600">
            {' '}
            (worked out from the{' '}
            {scaled.basis === 'product'
              ? `product at its ${scaled.yieldBasis === 'expected' ? 'expected' : 'theoretical'} yield`
              : 'limiting reagent'}
            )
          </span>
        )}
        .
      </p>
      {scaled.notice && (
        <Notice
          tone="warn"
          title={
            scaled.yieldBasis === 'theoretical'
              ? 'Worked out from the theoretical yield'
              : 'About this factor'
          }
        >
          <span data-testid="scale-notice">{scaled.notice}</span>
        </Notice>
      )}
      <TableScroll className="rounded-lg border border-ink-200">
        <table aria-label="Scaled lines" className="w-full text-sm">
          <thead className="border-b border-ink-200 bg-ink-50 text-left text-xs text-ink-600 uppercase">
            <tr>
              <th scope="col" className="px-3 py-2 font-medium">
                Chemical
              </th>
              <th scope="col" className="px-3 py-2 font-medium">
                Role
              </th>
              <th scope="col" className="px-3 py-2 text-right font-medium">
                Measure out
              </th>
              <th scope="col" className="px-3 py-2 text-right font-medium">
                Mass
              </th>
              <th scope="col" className="px-3 py-2 text-right font-medium">
                Volume
              </th>
              <th scope="col" className="px-3 py-2 text-right font-medium">
                Moles
              </th>
              <th scope="col" className="px-3 py-2 text-right font-medium">
                Equivalents
              </th>
            </tr>
          </thead>
          <tbody>
            {scaled.lines.map((line) => (
              <tr key={line.index} className="border-b border-ink-100 align-top last:border-b-0">
                <th scope="row" className="px-3 py-2 text-left font-medium text-ink-900">
                  {line.name}
                  {line.optional && <span className="ml-1 text-ink-600">(optional)</span>}
                  {scaled.stoichiometry.limitingIndex === line.index && (
                    <Badge
                      tone="accent"
                      icon={<Target aria-hidden="true" />}
                      className="ml-2 align-text-bottom"
                    >
                      Limiting
                    </Badge>
                  )}
                  {line.dissolvedIn && (
                    <span className="block text-xs font-normal text-ink-600">
                      dissolved in {formatRoundedAmount(line.dissolvedIn.display)}{' '}
                      {line.dissolvedIn.chemicalName}
                    </span>
                  )}
                </th>
                <td className="px-3 py-2">{roleLabels[line.role]}</td>
                <td className="px-3 py-2 text-right font-semibold">
                  {line.display && line.quantity ? (
                    <Rounded
                      text={formatRoundedAmount(line.display)}
                      value={line.quantity.value}
                      unit={line.quantity.unit}
                      rule={line.display.rule}
                    />
                  ) : (
                    '—'
                  )}
                </td>
                <td className="px-3 py-2 text-right">
                  <Mass g={line.massG} />
                </td>
                <td className="px-3 py-2 text-right">
                  <Volume mL={line.volumeMl} />
                </td>
                <td className="px-3 py-2 text-right">
                  <Moles mol={line.amountMol} />
                </td>
                <td className="px-3 py-2 text-right">
                  <Equivalents value={line.equivalents} />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </TableScroll>
      {yieldView && (
        <p className="text-sm text-ink-800">
          <span className="font-semibold">Theoretical yield at this scale: </span>
          {yieldView.display && yieldView.massG !== null ? (
            <Rounded
              text={formatRoundedAmount(yieldView.display)}
              value={yieldView.massG}
              unit="g"
              rule={yieldView.display.rule}
              inline
            />
          ) : (
            <Moles mol={yieldView.amountMol} inline />
          )}{' '}
          of {yieldView.name}
          {yieldView.expectedMassG !== null && (
            <>
              ; at the expected yield about <Mass g={yieldView.expectedMassG} inline />
            </>
          )}
          .
        </p>
      )}
      <div className="rounded-md bg-ink-50 px-3 py-2 text-xs leading-5 text-ink-700">
        <p className="font-semibold text-ink-800">How amounts are rounded</p>
        <ul className="list-disc pl-4">
          <li>{scaled.rules.balance}</li>
          <li>{scaled.rules.glassware}</li>
          <li>{scaled.rules.amount}</li>
        </ul>
        <p className="mt-1">
          The calculation keeps full precision; the small grey figure under each amount (and its
          tooltip) shows it.
        </p>
      </div>
    </div>
  );
}
