import { hazardStatementTexts, type GhsCode, type Procedure } from '@lotwise/shared';
import { TriangleAlert } from 'lucide-react';
import { PictogramList } from '../../../components/hazards/pictogram-badge';
import { SafetyCaution } from '../../../components/hazards/safety-caution';

/** The hazards of every chemical in the procedure, once each, with the deferral to the SDS. */
export function BenchHazards({ procedure }: { procedure: Pick<Procedure, 'lines' | 'cautions'> }) {
  const chemicals = new Map<number, Procedure['lines'][number]['chemical']>();
  for (const line of procedure.lines) chemicals.set(line.chemicalId, line.chemical);
  const list = [...chemicals.entries()].sort((a, b) => a[1].name.localeCompare(b[1].name));
  return (
    <section
      aria-labelledby="bench-hazards-heading"
      className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-white px-4 py-3"
    >
      <h2 id="bench-hazards-heading" className="flex items-center gap-2 text-base font-semibold">
        <TriangleAlert aria-hidden="true" className="size-4 text-ghs-red" />
        Hazards of the chemicals in this procedure
      </h2>
      <SafetyCaution />
      {procedure.cautions && (
        <p className="text-sm whitespace-pre-line text-ink-800">{procedure.cautions}</p>
      )}
      <ul className="flex flex-col gap-3">
        {list.map(([id, chemical]) => (
          <li
            key={id}
            className="flex flex-col gap-1.5 border-t border-ink-100 pt-2 first:border-0"
          >
            <p className="font-medium text-ink-900">{chemical.name}</p>
            <PictogramList codes={chemical.ghsPictograms} />
            {chemical.hazardStatements.length === 0 ? (
              <p className="text-sm text-ink-600">No hazard statements recorded — see the SDS.</p>
            ) : (
              <ul aria-label={`Hazard statements of ${chemical.name}`} className="text-sm">
                {chemical.hazardStatements.map((code) => (
                  <li key={code}>
                    <span className="font-semibold tabular-nums">{code}</span>{' '}
                    <span className={hazardStatementTexts[code] ? 'text-ink-800' : 'text-ink-600'}>
                      {hazardStatementTexts[code] ?? 'text not held in Lotwise — see the SDS'}
                    </span>
                  </li>
                ))}
              </ul>
            )}
          </li>
        ))}
      </ul>
    </section>
  );
}

/** Every pictogram of the procedure's chemicals at a glance, pointing to the hazards in full. */
export function BenchHazardStrip({ procedure }: { procedure: Pick<Procedure, 'lines'> }) {
  const codes = new Set<GhsCode>();
  for (const line of procedure.lines)
    for (const code of line.chemical.ghsPictograms) codes.add(code);
  return (
    <div className="flex flex-wrap items-center gap-x-3 gap-y-1 text-sm">
      <PictogramList codes={[...codes].sort()} />
      <a href="#bench-hazards-heading" className="text-accent-700 underline underline-offset-2">
        Hazards of each chemical
      </a>
    </div>
  );
}
