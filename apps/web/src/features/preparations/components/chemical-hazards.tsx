import { hazardStatementTexts } from '@lotwise/shared';
import { TriangleAlert } from 'lucide-react';
import { PictogramList } from '../../../components/hazards/pictogram-badge';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { useChemical } from '../api';
import { StatementLines } from './preparation-safety';

/** One chemical's pictograms and H-statements, with the deferral to the SDS. */
export function ChemicalHazards({ chemicalId }: { chemicalId: number }) {
  const chemical = useChemical(chemicalId);
  return (
    <section
      aria-labelledby="chemical-hazards-heading"
      className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-white px-4 py-3"
    >
      <h2 id="chemical-hazards-heading" className="flex items-center gap-2 text-base font-semibold">
        <TriangleAlert aria-hidden="true" className="size-4 text-ghs-red" />
        Hazards{chemical.data ? ` of ${chemical.data.name}` : ''}
      </h2>
      <SafetyCaution />
      {chemical.data && (
        <div className="flex flex-col gap-3">
          <PictogramList codes={chemical.data.ghsPictograms} size="lg" />
          <div className="text-sm">
            <StatementLines
              statements={chemical.data.hazardStatements.map((code) => ({
                code,
                text: hazardStatementTexts[code] ?? null,
              }))}
            />
          </div>
        </div>
      )}
    </section>
  );
}
