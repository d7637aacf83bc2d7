import { toVolume } from './conversions';
import { convert, tryParseUnit } from './units';

/** Why a gross mass cannot be read as a draw. */
export type WeighingProblem =
  'no_tare' | 'not_a_mass' | 'below_tare' | 'no_density' | 'above_balance';

/** The result of weighing a container by difference, in its stock unit. */
export type Weighing =
  | {
      ok: true;
      /** Contents by mass now: gross − tare, in g. */
      netMass: number;
      /** Contents now in the stock unit (converted through the density for mL). */
      net: number;
      /** Balance before − contents now, in the stock unit. */
      drawn: number;
    }
  | { ok: false; problem: WeighingProblem; netMass?: number; net?: number };

/**
 * Weighing by difference: a person puts the container (cap on) on a balance and reads the
 * gross mass. Contents now = gross − tare; drawn = balance before − contents now. A container
 * counted in mL is converted through the density. Float noise within `tolerance` (in the
 * stock unit) is not a problem: a gross a hair under the tare reads as empty.
 * // common practice, no source
 */
export function weighByDifference(input: {
  grossMass: number;
  unit: string;
  /** Mass of the empty container with its cap, in g; null when never recorded. */
  tareMass: number | null;
  /** Balance before the draw, in the stock unit. */
  balance: number;
  stockUnit: 'g' | 'mL';
  /** g/mL, needed when the stock unit is mL. */
  density: number | null;
  tolerance?: number;
}): Weighing {
  const { grossMass, unit, tareMass, balance, stockUnit, density } = input;
  const tolerance = input.tolerance ?? 1e-6;
  if (tareMass === null) return { ok: false, problem: 'no_tare' };
  const parsed = tryParseUnit(unit);
  if (!parsed.ok || parsed.value.dimension !== 'mass') return { ok: false, problem: 'not_a_mass' };
  const grossG = convert(grossMass, unit, 'g');
  const rawNet = grossG - tareMass;
  if (rawNet < -tolerance) return { ok: false, problem: 'below_tare', netMass: rawNet };
  const netMass = Math.max(0, rawNet);
  let net: number;
  if (stockUnit === 'g') net = netMass;
  else if (density === null) return { ok: false, problem: 'no_density', netMass };
  else net = toVolume({ value: netMass, unit: 'g' }, { density });
  const drawn = balance - net;
  if (drawn < -tolerance) return { ok: false, problem: 'above_balance', netMass, net };
  return { ok: true, netMass, net, drawn: Math.max(0, drawn) };
}
