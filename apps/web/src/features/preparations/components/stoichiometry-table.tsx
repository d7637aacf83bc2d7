import type { LineRole, Stoichiometry } from '@lotwise/shared';
import { formatAmount } from '../../../lib/format';
import { Target, TriangleAlert } from 'lucide-react';
import { Badge } from '../../../components/ui/badge';
import { roleLabels } from '../labels';
import { Equivalents, Mass, Moles, Volume } from './rounded';
import { TableScroll } from '../../../components/ui/table-scroll';

export interface StoichiometryRow {
  name: string;
  role: LineRole;
  /** The amount as written, e.g. "2 g" or "20 mL of 1 M solution". */
  amount: string;
  optional?: boolean;
  notes?: string;
}

/** The theoretical yield of the first product line, in g, when it can be worked out. */
export function theoreticalYieldOf(result: Stoichiometry) {
  const product = result.lines.find((line) => line.role === 'product' && line.theoretical);
  return product?.theoretical ? { index: product.index, ...product.theoretical } : null;
}

/**
 * Mass, volume and moles of every line, equivalents against the limiting reagent (marked),
 * and the theoretical yield — all as @lotwise/chem computed them.
 */
export function StoichiometryTable({
  result,
  rows,
  label,
}: {
  result: Stoichiometry;
  rows: readonly StoichiometryRow[];
  label: string;
}) {
  const theoretical = theoreticalYieldOf(result);
  return (
    <div className="flex flex-col gap-3">
      <TableScroll className="rounded-lg border border-ink-200 bg-white">
        <table aria-label={label} className="w-full text-sm">
          <thead className="border-b border-ink-200 bg-ink-50 text-left text-xs text-ink-600 uppercase">
            <tr>
              <th scope="col" className="px-3 py-2 font-medium">
                Chemical
              </th>
              <th scope="col" className="px-3 py-2 font-medium">
                Role
              </th>
              <th scope="col" className="px-3 py-2 font-medium">
                Amount
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
            {result.lines.map((line) => {
              const row = rows[line.index];
              const limiting = result.limitingIndex === line.index;
              return (
                <tr
                  key={line.index}
                  className="border-b border-ink-100 align-top last:border-b-0"
                  data-testid={`stoich-line-${line.index}`}
                >
                  <th scope="row" className="px-3 py-2 text-left font-medium text-ink-900">
                    {row?.name ?? line.name ?? `Line ${line.index + 1}`}
                    {row?.optional && <span className="ml-1 text-ink-600">(optional)</span>}
                    {limiting && (
                      <Badge
                        tone="accent"
                        icon={<Target aria-hidden="true" />}
                        className="ml-2 align-text-bottom"
                      >
                        Limiting
                      </Badge>
                    )}
                    {row?.notes && (
                      <span className="block text-xs font-normal text-ink-600">{row.notes}</span>
                    )}
                  </th>
                  <td className="px-3 py-2 text-ink-800">{roleLabels[line.role]}</td>
                  <td className="px-3 py-2 text-ink-800 tabular-nums">{row?.amount ?? '—'}</td>
                  <td className="px-3 py-2 text-right">
                    {line.role === 'product' && line.massG === undefined ? (
                      <span className="text-ink-500">—</span>
                    ) : (
                      <Mass g={line.massG} />
                    )}
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
              );
            })}
          </tbody>
        </table>
      </TableScroll>
      <p className="text-sm text-ink-800" data-testid="theoretical-yield">
        <span className="font-semibold">Theoretical yield: </span>
        {theoretical && theoretical.massG !== undefined ? (
          <>
            <strong className="font-semibold">
              <Mass g={theoretical.massG} testId="theoretical-yield-mass" inline />
            </strong>{' '}
            of {rows[theoretical.index]?.name ?? 'product'} (
            <Moles mol={theoretical.amountMol} inline secondary={false} />)
          </>
        ) : (
          <span className="text-ink-600">
            not yet known — it needs a limiting reagent with an amount and a product line with a
            formula.
          </span>
        )}
      </p>
      {result.warnings.length > 0 && (
        <ul aria-label="Calculation warnings" className="flex flex-col gap-1 text-sm">
          {result.warnings.map((warning, index) => (
            <li key={`${warning.code}-${index}`} className="flex items-start gap-2 text-warn-700">
              <TriangleAlert aria-hidden="true" className="mt-0.5 size-4 shrink-0" />
              <span>{warning.message}</span>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

/** "2 g", "20 mL of 1 M solution", "2.5 g dissolved in 50 mL Water". */
export function amountText(line: {
  quantity: number | null;
  unit: string | null;
  concentration: { molarity: number } | { percentWw: number } | null;
  dissolvedIn?: { chemicalName: string; quantity: number; unit: string } | null;
}): string {
  if (line.quantity === null || !line.unit) return '—';
  let text = formatAmount(line.quantity, line.unit);
  if (line.concentration) {
    text +=
      'molarity' in line.concentration
        ? ` of ${line.concentration.molarity} M solution`
        : ` of ${line.concentration.percentWw} % w/w solution`;
  }
  if (line.dissolvedIn) {
    text += ` in ${formatAmount(line.dissolvedIn.quantity, line.dissolvedIn.unit)} ${line.dissolvedIn.chemicalName}`;
  }
  return text;
}
