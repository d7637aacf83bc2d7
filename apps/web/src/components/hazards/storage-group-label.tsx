import { storageGroups, type StorageGroup } from '@lotwise/shared';
import {
  Box,
  CircleDot,
  CloudFog,
  Droplet,
  DropletOff,
  Flame,
  FlaskConical,
  FlaskRound,
  Zap,
  type LucideIcon,
} from 'lucide-react';

/** Storage groups are told apart by name and icon, never by a colour code. */
export const storageGroupIcons: Record<StorageGroup, LucideIcon> = {
  flammable: Flame,
  'organic-acid': FlaskConical,
  'inorganic-acid': FlaskRound,
  base: Droplet,
  oxidizer: CircleDot,
  reducer: Zap,
  'water-reactive': DropletOff,
  'gas-with-acid': CloudFog,
  'low-hazard': Box,
};

export function StorageGroupLabel({
  group,
  withHint,
}: {
  group: StorageGroup;
  withHint?: boolean;
}) {
  const Icon = storageGroupIcons[group];
  const { label, hint } = storageGroups[group];
  return (
    <span className="inline-flex items-start gap-1.5" title={withHint ? undefined : hint}>
      <Icon aria-hidden="true" className="mt-0.5 size-4 shrink-0 text-ink-600" />
      <span>
        <span className="whitespace-nowrap">{label}</span>
        {withHint && <span className="block text-sm text-ink-600">{hint}</span>}
      </span>
    </span>
  );
}
