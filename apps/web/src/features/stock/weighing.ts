import { measuringDensity, type UnitSymbol, unitsOf, weighByDifference } from '@lotwise/chem';
import type { StockUnit } from '@lotwise/shared';
import { formatAmount } from '../../lib/format';

/**
 * The chemical facts a draw needs: what it is counted in and, to cross mass and volume, its
 * density (for a solid, its bulk density only).
 */
export interface DrawChemical {
  stockUnit: StockUnit;
  density: number | null;
  physicalState?: string;
  bulkDensity?: number | null;
}

/**
 * Units a person may enter a draw in: the stock unit's kind, and the other kind when the
 * density allows converting (a liquid weighed; a solid by volume only with a bulk density).
 */
export function drawUnits(chemical: DrawChemical): UnitSymbol[] {
  const masses = unitsOf('mass').filter((u) => u !== 'µg');
  const volumes = unitsOf('volume');
  if (measuringDensity(chemical) !== null)
    return chemical.stockUnit === 'mL' ? [...volumes, ...masses] : [...masses, ...volumes];
  return chemical.stockUnit === 'mL' ? volumes : masses;
}

export type WeighingPreview =
  | { ok: true; netMass: number; net: number; drawn: number }
  | {
      ok: false;
      reason: 'no_tare' | 'below_tare' | 'above_balance' | 'no_density' | 'bad_unit';
      message: string;
      netMass?: number;
      net?: number;
    };

const problemMessages = {
  no_tare:
    'This container has no tare mass recorded, so a gross mass cannot be turned into its contents. Enter the amount taken instead.',
  not_a_mass: 'A gross mass is weighed: use g, mg or kg.',
  no_density:
    'The chemical has no density recorded (for a solid: no bulk density), so a mass cannot be turned into mL. Enter the volume taken instead.',
  above_balance:
    'The container now holds more than its balance: a draw cannot add stock. Ask someone with the manager role to record an adjustment.',
} as const;

/**
 * What a gross mass means for a container, in its stock unit — `weighByDifference` from
 * packages/chem, the same rule the server applies when the draw is saved (its answer is the
 * record). This only words the problems for the form.
 */
export function previewWeighing(input: {
  grossMass: number;
  unit: string;
  tareMass: number | null;
  balance: number;
  chemical: DrawChemical;
}): WeighingPreview {
  const { tareMass, chemical } = input;
  const result = weighByDifference({
    grossMass: input.grossMass,
    unit: input.unit,
    tareMass,
    balance: input.balance,
    stockUnit: chemical.stockUnit,
    density: measuringDensity(chemical),
  });
  if (result.ok) return result;
  const { problem, netMass, net } = result;
  if (problem === 'below_tare') {
    return {
      ok: false,
      reason: problem,
      netMass,
      message: `That is less than the tare of ${formatAmount(tareMass, 'g')}: weigh again with the cap on.`,
    };
  }
  return {
    ok: false,
    reason: problem === 'not_a_mass' ? 'bad_unit' : problem,
    message: problemMessages[problem],
    ...(netMass !== undefined && { netMass }),
    ...(net !== undefined && { net }),
  };
}
