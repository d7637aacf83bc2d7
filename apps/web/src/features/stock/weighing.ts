import { convert, toMass, toVolume, tryParseUnit, type UnitSymbol, unitsOf } from '@lotwise/chem';
import type { StockUnit } from '@lotwise/shared';

/** The chemical facts a draw needs: what it is counted in and, to cross mass and volume, its density. */
export interface DrawChemical {
  stockUnit: StockUnit;
  density: number | null;
}

/**
 * Units a person may enter a draw in: the stock unit's kind, and the other kind when the
 * density allows converting (a liquid weighed, or a solid's volume never offered without one).
 */
export function drawUnits(chemical: DrawChemical): UnitSymbol[] {
  const masses = unitsOf('mass').filter((u) => u !== 'µg');
  const volumes = unitsOf('volume');
  if (chemical.density !== null)
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

/**
 * What a gross mass means for a container, in its stock unit: net = gross − tare (converted
 * through the density for a volume-counted chemical) and drawn = balance − net. The
 * conversions are packages/chem's; the server applies the same rule when the draw is saved
 * and its answer is the record.
 */
export function previewWeighing(input: {
  grossMass: number;
  unit: string;
  tareMass: number | null;
  balance: number;
  chemical: DrawChemical;
}): WeighingPreview {
  const { grossMass, unit, tareMass, balance, chemical } = input;
  if (tareMass === null) {
    return {
      ok: false,
      reason: 'no_tare',
      message:
        'This container has no tare mass recorded, so a gross mass cannot be turned into its contents. Enter the amount taken instead.',
    };
  }
  const parsed = tryParseUnit(unit);
  if (!parsed.ok || parsed.value.dimension !== 'mass') {
    return { ok: false, reason: 'bad_unit', message: 'A gross mass is weighed: use g, mg or kg.' };
  }
  const grossG = convert(grossMass, unit, 'g');
  const netMass = grossG - tareMass;
  if (netMass < 0) {
    return {
      ok: false,
      reason: 'below_tare',
      netMass,
      message: `That is less than the tare of ${tareMass} g: weigh again with the cap on.`,
    };
  }
  let net: number;
  if (chemical.stockUnit === 'g') net = toMass({ value: netMass, unit: 'g' });
  else if (chemical.density === null) {
    return {
      ok: false,
      reason: 'no_density',
      netMass,
      message:
        'The chemical has no density recorded, so a mass cannot be turned into mL. Enter the volume taken instead.',
    };
  } else net = toVolume({ value: netMass, unit: 'g' }, { density: chemical.density });
  const drawn = balance - net;
  if (drawn < 0) {
    return {
      ok: false,
      reason: 'above_balance',
      netMass,
      net,
      message:
        'The container now holds more than its balance: a draw cannot add stock. Ask someone with the manager role to record an adjustment.',
    };
  }
  return { ok: true, netMass, net, drawn };
}
