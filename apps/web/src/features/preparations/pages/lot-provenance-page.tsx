import { Link, useParams } from 'react-router';
import type { LotProvenance } from '@lotwise/shared';
import { formatAmount, formatDate, formatDateTime } from '../../../lib/format';
import { paths } from '../../../config/paths';
import { useLotProvenance } from '../api';
import { ChemicalHazards } from '../components/chemical-hazards';
import { BackLink, PageHeader, Property, QueryState, Section } from '../components/page-parts';
import { Mass } from '../components/rounded';
import { StockAmount } from '../components/stock-amount';
import { YieldText } from '../components/yield-text';
import { TableScroll } from '../../../components/ui/table-scroll';

function ProvenanceView({ provenance: p }: { provenance: LotProvenance }) {
  return (
    <div className="flex flex-col gap-5">
      <BackLink to={paths.stockChemical(p.lot.chemicalId)}>Stock of {p.lot.chemicalName}</BackLink>
      <PageHeader eyebrow={`Lot #${p.lot.id}`} title={`Where this ${p.lot.chemicalName} came from`}>
        {p.lot.source === 'prepared' ? 'Prepared' : 'Received'} on {formatDate(p.lot.receivedOn)}.
      </PageHeader>
      <ChemicalHazards chemicalId={p.lot.chemicalId} />
      <Section id="made-by-heading" title="Made by">
        {p.run ? (
          <div className="rounded-lg border border-ink-200 bg-white px-4 py-3">
            <dl>
              <Property term="Run">
                <Link to={paths.run(p.run.id)} className="text-accent-700 underline">
                  Run #{p.run.id}
                </Link>{' '}
                of {p.run.procedure.title}
              </Property>
              <Property term="Performed">
                {formatDate(p.run.performedOn)} by {p.run.performedBy?.displayName ?? '—'}
              </Property>
              <Property term="Yield">
                <YieldText percent={p.run.percentYield} /> (
                <Mass g={p.run.productMassG} inline secondary={false} /> of{' '}
                <Mass g={p.run.theoreticalYieldG} inline secondary={false} /> theoretical)
              </Property>
            </dl>
          </div>
        ) : (
          <p className="text-sm text-ink-600">This lot was not made by a run in Lotwise.</p>
        )}
      </Section>
      {p.inputs.length > 0 && (
        <Section id="inputs-heading" title="Made from">
          <TableScroll className="rounded-lg border border-ink-200 bg-white">
            <table aria-label="Input lots" className="w-full text-sm">
              <thead className="border-b border-ink-200 bg-ink-50 text-left text-xs text-ink-600 uppercase">
                <tr>
                  <th className="px-3 py-2 font-medium">Chemical</th>
                  <th className="px-3 py-2 font-medium">Lot</th>
                  <th className="px-3 py-2 font-medium">Container</th>
                  <th className="px-3 py-2 text-right font-medium">Used</th>
                </tr>
              </thead>
              <tbody>
                {p.inputs.map((input) => (
                  <tr
                    key={`${input.lotId}-${input.labelCode}-${input.lineIndex}`}
                    className="border-b border-ink-100 last:border-b-0"
                  >
                    <td className="px-3 py-1.5">{input.chemicalName}</td>
                    <td className="px-3 py-1.5 text-ink-700">
                      {input.source === 'prepared' ? (
                        <Link
                          to={paths.lotProvenance(input.lotId)}
                          className="text-accent-700 underline"
                        >
                          Prepared lot #{input.lotId}
                        </Link>
                      ) : (
                        <>
                          {input.supplierName ?? 'Supplier not recorded'}
                          {input.supplierLotNumber && ` · lot ${input.supplierLotNumber}`}
                        </>
                      )}
                    </td>
                    <td className="px-3 py-1.5 font-mono text-xs font-semibold">
                      {input.labelCode}
                    </td>
                    <td className="px-3 py-1.5 text-right">
                      <StockAmount value={input.quantity} unit={input.unit} />
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </TableScroll>
        </Section>
      )}
      <Section id="containers-heading" title="Its containers and where they went">
        <ul className="flex flex-col gap-3">
          {p.containers.map((c) => (
            <li key={c.id} className="rounded-lg border border-ink-200 bg-white px-4 py-3 text-sm">
              <p>
                <Link
                  to={paths.stockContainer(c.id)}
                  className="font-mono font-semibold text-accent-700 underline"
                >
                  {c.labelCode}
                </Link>{' '}
                · {c.status} · holds <StockAmount value={c.quantity} unit={c.unit} /> ·{' '}
                {c.locationPath}
              </p>
              {c.usedBy.length > 0 && (
                <p className="mt-1">
                  Used by:{' '}
                  {c.usedBy.map((use, index) => (
                    <span key={`${use.runId}-${index}`}>
                      {index > 0 && ', '}
                      <Link to={paths.run(use.runId)} className="text-accent-700 underline">
                        run #{use.runId}
                      </Link>{' '}
                      ({use.procedureTitle}, {formatAmount(use.quantity, c.unit)})
                    </span>
                  ))}
                </p>
              )}
              <ol className="mt-2 flex flex-col gap-0.5 text-xs text-ink-700">
                {c.movements.map((m, index) => (
                  <li key={index} className="tabular-nums">
                    {formatDateTime(m.createdAt)} · {m.reason} {formatAmount(m.quantity, c.unit)} →
                    balance {formatAmount(m.balanceAfter, c.unit)}
                    {m.note && ` · ${m.note}`}
                  </li>
                ))}
              </ol>
            </li>
          ))}
        </ul>
      </Section>
    </div>
  );
}

export function LotProvenancePage() {
  const id = Number(useParams().id);
  const provenance = useLotProvenance(id);
  return (
    <QueryState query={provenance} what="lot">
      {(data) => <ProvenanceView provenance={data} />}
    </QueryState>
  );
}
