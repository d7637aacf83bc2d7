import {
  flammableStatementMismatch,
  ghsCategoryCitation,
  ghsFlammableCategoryMeanings,
  ghsFlammableHazardStatements,
  ghsFlammableHazardTexts,
  hasLiquidClass,
  liquidClassCitation,
  liquidClassLabels,
  liquidClassMeanings,
  type Chemical,
} from '@lotwise/shared';
import { Flame } from 'lucide-react';
import type { ReactNode } from 'react';
import { LiquidClassBadge } from '../../../components/hazards/liquid-class-badge';
import { Notice } from '../../../components/ui/notice';
import { formatTemperature } from '../../../lib/format';

function Row({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="flex flex-col gap-0.5 border-b border-ink-100 py-2 sm:flex-row sm:gap-4">
      <dt className="w-44 shrink-0 text-sm text-ink-600">{term}</dt>
      <dd className="text-sm text-ink-900">{children}</dd>
    </div>
  );
}

function Figure({ value, source }: { value: number | null | undefined; source?: string }) {
  if (value === null || value === undefined) {
    return <span className="text-ink-600">Not recorded</span>;
  }
  return (
    <span>
      <span className="tabular-nums">{formatTemperature(value)}</span>
      <span className="block text-xs text-ink-600">
        {source ? `Source: ${source}` : 'Source not given'}
      </span>
    </span>
  );
}

/** Why there is no class or category, in words a newcomer can act on. */
function missingReason(chemical: Chemical): string {
  if (!hasLiquidClass(chemical.physicalState)) {
    return 'Only liquids and solutions get one; the flash point of a solid or gas is kept as a figure.';
  }
  if (chemical.flashPointC === null || chemical.flashPointC === undefined) {
    return 'Needs the flash point: copy it from the SDS (section 9).';
  }
  return 'Needs the boiling point as well: a flash point this low is split by it.';
}

/**
 * Flash point and boiling point with their sources, and what Lotwise works out from them: the
 * NFPA 30 liquid class and the GHS flammable-liquid category. A notice when the chemical's own
 * H-statements say otherwise. Everything here is a reminder; the SDS decides.
 */
export function FireDataSection({ chemical }: { chemical: Chemical }) {
  const liquidClass = chemical.liquidClass ?? null;
  const category = chemical.ghsFlammableCategory ?? null;
  const mismatch = flammableStatementMismatch(chemical.hazardStatements, category);
  // Class IIIB without a category: a flash point above GHS's last category.
  const flashAboveGhs = category === null && liquidClass === 'IIIB';

  return (
    <section
      aria-labelledby="fire-data-heading"
      className="rounded-lg border border-ink-200 bg-white px-4 py-3"
    >
      <h2
        id="fire-data-heading"
        className="mb-1 flex items-center gap-2 text-base font-semibold text-ink-900"
      >
        <Flame aria-hidden="true" className="size-4 text-ghs-red" />
        Fire data
      </h2>
      <dl>
        <Row term="Flash point">
          <Figure value={chemical.flashPointC} source={chemical.flashPointSource} />
        </Row>
        <Row term="Boiling point">
          <Figure value={chemical.boilingPointC} source={chemical.boilingPointSource} />
        </Row>
        <Row term="NFPA 30 liquid class">
          {liquidClass ? (
            <span className="flex flex-col gap-1">
              <LiquidClassBadge liquidClass={liquidClass} />
              <span>
                {liquidClassLabels[liquidClass]}: {liquidClassMeanings[liquidClass]} —{' '}
                {liquidClassCitation}
              </span>
            </span>
          ) : (
            <span className="text-ink-600">None worked out. {missingReason(chemical)}</span>
          )}
        </Row>
        <Row term="GHS flammable category">
          {category ? (
            <span>
              Category {category}, {ghsFlammableHazardStatements[category]}{' '}
              {ghsFlammableHazardTexts[category]}
              <span className="block text-xs text-ink-600">
                {ghsFlammableCategoryMeanings[category]} — {ghsCategoryCitation}
              </span>
            </span>
          ) : flashAboveGhs ? (
            <span className="text-ink-600">
              Not a flammable liquid under GHS: flash point above 93 °C — {ghsCategoryCitation}
            </span>
          ) : (
            <span className="text-ink-600">None worked out. {missingReason(chemical)}</span>
          )}
        </Row>
      </dl>
      {mismatch && category && (
        <Notice tone="warn" title="The hazard statements and the figures disagree" className="mt-3">
          The hazard statements list {mismatch.listed.join(', ')}, but the figures give category{' '}
          {category} ({mismatch.expected}): check the figures against the SDS.
        </Notice>
      )}
      <p className="mt-2 text-xs text-ink-600">
        Worked out from the figures above as a reminder, not an approval: the supplier’s SDS, local
        regulations and the authority having jurisdiction decide.
      </p>
    </section>
  );
}
