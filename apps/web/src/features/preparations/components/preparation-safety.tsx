import type { ReactNode } from 'react';
import {
  hazardStatementTexts,
  type CautionFlags,
  type GhsCode,
  type PlanHazard,
  type Procedure,
  type StepCaution,
} from '@lotwise/shared';
import {
  Flame,
  Skull,
  ThermometerSnowflake,
  ThermometerSun,
  TriangleAlert,
  Wind,
  type LucideIcon,
} from 'lucide-react';
import { PictogramList } from '../../../components/hazards/pictogram-badge';
import { SafetyCaution } from '../../../components/hazards/safety-caution';

interface FlagItem {
  key: string;
  icon: LucideIcon;
  text: string;
}

/**
 * The cautions a procedure (or one of its steps) can carry: the icon, the short words the
 * procedure form and each step use, and the sentence shown when the server words none.
 */
export const cautionMeta: Record<
  StepCaution,
  { icon: LucideIcon; label: string; sentence: string }
> = {
  exothermicAddition: {
    icon: ThermometerSun,
    label: 'Exothermic addition',
    sentence: 'Exothermic addition: add slowly with cooling; the temperature sets the pace.',
  },
  flammableSolvent: {
    icon: Flame,
    label: 'Flammable solvent',
    sentence: 'Flammable solvent: no open flames; heat on a water bath or heating mantle.',
  },
  toxicGas: {
    icon: Skull,
    label: 'Gives off a toxic gas',
    sentence: 'A toxic gas may be given off: work in a fume hood.',
  },
  fumeHood: { icon: Wind, label: 'Needs a fume hood', sentence: 'Work in a fume hood.' },
};

/**
 * The structured cautions as icon + words, in the order the server words them for plans
 * and dispensing sheets (`items`). A procedure's answer carries no such words, so the
 * same sentences are kept here (the shared contract does not export them yet).
 */
export function cautionFlagItems(flags: CautionFlags, items?: readonly string[]): FlagItem[] {
  const list: { key: string; icon: LucideIcon; fallback: string }[] = [];
  const flag = (key: string, caution: StepCaution) =>
    list.push({ key, icon: cautionMeta[caution].icon, fallback: cautionMeta[caution].sentence });
  if (flags.exothermicAddition) flag('exothermic', 'exothermicAddition');
  if (flags.keepBelowC !== null)
    list.push({
      key: 'keep-below',
      icon: ThermometerSnowflake,
      fallback: `Keep the mixture below ${flags.keepBelowC} °C.`,
    });
  if (flags.flammableSolvent) flag('flammable', 'flammableSolvent');
  if (flags.toxicGas) flag('toxic-gas', 'toxicGas');
  if (flags.fumeHood) flag('fume-hood', 'fumeHood');
  return list.map((item, index) => ({
    key: item.key,
    icon: item.icon,
    text: items?.[index] ?? item.fallback,
  }));
}

export function CautionList({
  text,
  flags,
  items,
}: {
  text: string;
  flags: CautionFlags;
  items?: readonly string[];
}) {
  const flagItems = cautionFlagItems(flags, items);
  if (!text && flagItems.length === 0) {
    return <p className="text-sm text-ink-600">No cautions written for this procedure.</p>;
  }
  return (
    <div className="flex flex-col gap-2 text-sm">
      {flagItems.length > 0 && (
        <ul aria-label="Caution flags" className="flex flex-col gap-1">
          {flagItems.map(({ key, icon: Icon, text: words }) => (
            <li key={key} className="flex items-start gap-2 font-medium text-ink-900">
              <Icon aria-hidden="true" className="mt-0.5 size-4 shrink-0 text-warn-700" />
              <span>{words}</span>
            </li>
          ))}
        </ul>
      )}
      {text && <p className="whitespace-pre-line text-ink-800">{text}</p>}
    </div>
  );
}

/** Hazards of every chemical in a procedure, once each, in the shape plans use. */
export function procedureHazards(procedure: Pick<Procedure, 'lines'>): PlanHazard[] {
  const seen = new Map<number, PlanHazard>();
  for (const line of procedure.lines) {
    if (seen.has(line.chemicalId)) continue;
    seen.set(line.chemicalId, {
      chemicalId: line.chemicalId,
      name: line.chemical.name,
      ghsPictograms: line.chemical.ghsPictograms,
      hazardStatements: line.chemical.hazardStatements.map((code) => ({
        code,
        text: hazardStatementTexts[code] ?? null,
      })),
    });
  }
  return [...seen.values()].sort((a, b) => a.name.localeCompare(b.name));
}

export function allPictograms(hazards: readonly PlanHazard[]): GhsCode[] {
  const codes = new Set<GhsCode>();
  for (const hazard of hazards) for (const code of hazard.ghsPictograms) codes.add(code);
  return [...codes].sort();
}

/** One chemical's H-statements: code and words (or a pointer to the SDS). */
export function StatementLines({ statements }: { statements: PlanHazard['hazardStatements'] }) {
  if (statements.length === 0) return <span className="text-ink-600">None recorded — see SDS</span>;
  return (
    <ul className="flex flex-col">
      {statements.map(({ code, text }) => (
        <li key={code}>
          <span className="font-semibold tabular-nums">{code}</span>{' '}
          <span className={text ? 'text-ink-800' : 'text-ink-600 italic'}>
            {text ?? 'text not held in Lotwise — see SDS'}
          </span>
        </li>
      ))}
    </ul>
  );
}

/**
 * What goes at the top of every procedure, plan and dispensing sheet: the deferral to the
 * SDS, the cautions, and the hazards of every chemical involved.
 */
export function PreparationSafety({
  hazards,
  cautions,
  title = 'Hazards and cautions',
  extra,
}: {
  hazards: readonly PlanHazard[];
  cautions: { text: string; flags: CautionFlags; items?: readonly string[] };
  title?: string;
  extra?: ReactNode;
}) {
  const pictograms = allPictograms(hazards);
  return (
    <section
      aria-labelledby="prep-safety-heading"
      className="rounded-lg border border-ink-200 bg-white break-inside-avoid"
    >
      <h2
        id="prep-safety-heading"
        className="flex items-center gap-2 border-b border-ink-200 px-4 py-2.5 text-base font-semibold"
      >
        <TriangleAlert aria-hidden="true" className="size-4 text-ghs-red" />
        {title}
      </h2>
      <div className="flex flex-col gap-4 px-4 py-3">
        <SafetyCaution />
        <div className="flex flex-col gap-4">
          <div>
            <h3 className="mb-1.5 text-sm font-semibold text-ink-800">Cautions</h3>
            <CautionList {...cautions} />
            {extra}
          </div>
          <div>
            <h3 className="mb-1.5 text-sm font-semibold text-ink-800">
              Pictograms of the chemicals involved
            </h3>
            <PictogramList codes={pictograms} size="lg" />
          </div>
        </div>
        <div className="stack-table">
          <table className="w-full text-sm">
            <caption className="sr-only">Hazards of each chemical</caption>
            <thead className="text-left text-xs text-ink-600 uppercase">
              <tr className="border-b border-ink-200">
                <th scope="col" className="py-1.5 pr-3 font-medium">
                  Chemical
                </th>
                <th scope="col" className="py-1.5 pr-3 font-medium">
                  Pictograms
                </th>
                <th scope="col" className="py-1.5 font-medium">
                  Hazard statements
                </th>
              </tr>
            </thead>
            <tbody>
              {hazards.map((hazard) => (
                <tr key={hazard.chemicalId} className="border-b border-ink-100 align-top">
                  <th scope="row" className="py-1.5 pr-3 text-left font-medium text-ink-900">
                    {hazard.name}
                  </th>
                  <td data-label="Pictograms" data-wide className="py-1.5 pr-3">
                    <PictogramList codes={hazard.ghsPictograms} />
                  </td>
                  <td data-label="Hazard statements" data-wide className="py-1.5 text-ink-800">
                    <StatementLines statements={hazard.hazardStatements} />
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </div>
    </section>
  );
}
