import { isClassI, type LiquidClass } from '@lotwise/chem';
import { liquidClassCitation, liquidClassLabels, liquidClassMeanings } from '@lotwise/shared';
import { Flame } from 'lucide-react';
import { Badge } from '../ui/badge';

/**
 * The NFPA 30 class of a liquid as a small badge ("Class IB"), its meaning in the title and
 * for screen readers. Shown wherever a flammable or combustible liquid appears; nothing for
 * a chemical without a class.
 */
export function LiquidClassBadge({ liquidClass }: { liquidClass: LiquidClass | null | undefined }) {
  if (!liquidClass) return null;
  const meaning = `${liquidClassLabels[liquidClass]}: ${liquidClassMeanings[liquidClass]} (${liquidClassCitation})`;
  return (
    <span title={meaning}>
      <Badge tone={isClassI(liquidClass) ? 'warn' : 'neutral'} icon={<Flame aria-hidden="true" />}>
        Class {liquidClass}
        <span className="sr-only">: {meaning}</span>
      </Badge>
    </span>
  );
}
