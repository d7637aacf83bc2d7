import { Link, useParams } from 'react-router';
import type { ChemicalUsage } from '@lotwise/shared';
import { formatDate } from '../../../lib/format';
import { paths } from '../../../config/paths';
import { useChemicalUsage } from '../api';
import { ChemicalHazards } from '../components/chemical-hazards';
import { BackLink, PageHeader, QueryState, Section } from '../components/page-parts';
import { StockAmount } from '../components/stock-amount';
import { roleLabels } from '../labels';
import { TableScroll } from '../../../components/ui/table-scroll';

const useLabels: Record<ChemicalUsage['runs'][number]['use'], string> = {
  input: 'Drawn for a line',
  extra: 'Extra draw',
  product: 'Made by the run',
};

function UsageView({ usage }: { usage: ChemicalUsage }) {
  return (
    <div className="flex flex-col gap-5">
      <BackLink to={paths.stockChemical(usage.chemical.id)}>
        Stock of {usage.chemical.name}
      </BackLink>
      <PageHeader title={`Where ${usage.chemical.name} is used`}>
        The procedures that list it and every recorded run that drew or made it.
      </PageHeader>
      <ChemicalHazards chemicalId={usage.chemical.id} />
      <Section id="usage-procedures-heading" title="In procedures">
        {usage.procedures.length === 0 ? (
          <p className="text-sm text-ink-600">No procedure lists it.</p>
        ) : (
          <ul className="flex flex-col gap-1 text-sm">
            {usage.procedures.map((p) => (
              <li key={p.id}>
                <Link
                  to={paths.procedure(p.id)}
                  className="text-accent-700 underline-offset-2 hover:underline"
                >
                  {p.title}
                </Link>{' '}
                <span className="text-ink-600">
                  as{' '}
                  {p.roles
                    .map((role) => roleLabels[role as keyof typeof roleLabels] ?? role)
                    .join(', ')
                    .toLowerCase()}
                </span>
              </li>
            ))}
          </ul>
        )}
      </Section>
      <Section id="usage-runs-heading" title="In runs">
        {usage.runs.length === 0 ? (
          <p className="text-sm text-ink-600">No recorded run drew or made it.</p>
        ) : (
          <TableScroll className="rounded-lg border border-ink-200 bg-white">
            <table aria-label="Runs that used it" className="w-full text-sm">
              <thead className="border-b border-ink-200 bg-ink-50 text-left text-xs text-ink-600 uppercase">
                <tr>
                  <th className="px-3 py-2 font-medium">Run</th>
                  <th className="px-3 py-2 font-medium">Performed</th>
                  <th className="px-3 py-2 font-medium">Procedure</th>
                  <th className="px-3 py-2 font-medium">How</th>
                  <th className="px-3 py-2 text-right font-medium">Amount</th>
                </tr>
              </thead>
              <tbody>
                {usage.runs.map((run, index) => (
                  <tr
                    key={`${run.runId}-${run.use}-${index}`}
                    className="border-b border-ink-100 last:border-b-0"
                  >
                    <td className="px-3 py-1.5">
                      <Link
                        to={paths.run(run.runId)}
                        className="text-accent-700 underline-offset-2 hover:underline"
                      >
                        Run #{run.runId}
                      </Link>
                    </td>
                    <td className="px-3 py-1.5 whitespace-nowrap">{formatDate(run.performedOn)}</td>
                    <td className="px-3 py-1.5">{run.procedureTitle}</td>
                    <td className="px-3 py-1.5">{useLabels[run.use]}</td>
                    <td className="px-3 py-1.5 text-right">
                      <StockAmount value={run.quantity} unit={run.unit} />
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </TableScroll>
        )}
      </Section>
    </div>
  );
}

export function ChemicalUsagePage() {
  const id = Number(useParams().chemicalId);
  const usage = useChemicalUsage(id);
  return (
    <QueryState query={usage} what="chemical">
      {(data) => <UsageView usage={data} />}
    </QueryState>
  );
}
