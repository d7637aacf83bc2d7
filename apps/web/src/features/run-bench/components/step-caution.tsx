import type { StepCaution } from '@lotwise/shared';
import { Flame, Skull, ThermometerSun, Wind, type LucideIcon } from 'lucide-react';

const cautions: Record<StepCaution, { icon: LucideIcon; words: string }> = {
  exothermicAddition: {
    icon: ThermometerSun,
    words: 'Exothermic: add slowly with cooling; the temperature sets the pace.',
  },
  flammableSolvent: {
    icon: Flame,
    words: 'Flammable solvent: no open flames; heat on a water bath or heating mantle.',
  },
  toxicGas: { icon: Skull, words: 'A toxic gas may be given off: work in a fume hood.' },
  fumeHood: { icon: Wind, words: 'Work in a fume hood.' },
};

/** A step's caution as icon and words. */
export function StepCautionLine({ caution }: { caution: StepCaution }) {
  const { icon: Icon, words } = cautions[caution];
  return (
    <p className="flex items-start gap-2 rounded-md border border-warn-200 bg-warn-50 px-3 py-2 font-medium text-warn-700">
      <Icon aria-hidden="true" className="mt-0.5 size-5 shrink-0" />
      <span>
        <span className="sr-only">Caution: </span>
        {words}
      </span>
    </p>
  );
}
