import type { PhysicalState } from '@lotwise/shared';

export const physicalStateLabels: Record<PhysicalState, string> = {
  solid: 'Solid',
  liquid: 'Liquid',
  gas: 'Gas',
  solution: 'Solution',
};
