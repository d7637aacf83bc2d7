import { ChemError } from './errors';
import { convert, type Quantity, toBaseUnit } from './units';
import { requireNonNegative, requirePercent, requirePositive, show } from './validation';

/** What a chemical brings to a conversion. All optional: each conversion says what it needs. */
export interface ChemicalProperties {
  /** g/mol of the pure substance. */
  molarMass?: number;
  /** g/mL of the material as measured (at 20 °C by convention); for a solid, of the crystal. */
  density?: number;
  /** Mass % of the substance in the material as weighed; 100 when left out. */
  purityPercent?: number;
  /** "solid" makes a volume go through `bulkDensity`, never `density`. */
  physicalState?: string;
  /** g/mL of the poured solid, air between the grains included. */
  bulkDensity?: number;
}

/** What {@link measuringDensity} looks at; nulls read as unknown. */
export interface MeasuredMaterial {
  physicalState?: string | null;
  density?: number | null;
  bulkDensity?: number | null;
}

/**
 * The density that turns a measured volume of a material into a mass and back: for a solid
 * its bulk (poured) density, since a spoonful of powder holds air and its crystal density
 * would weigh out far too much (10 mL of table salt is about 12 g, not 21.65 g); for
 * anything else its density. Null when that density is not known: a solid without a bulk
 * density cannot be measured by volume. // common practice, no source
 */
export function measuringDensity(material: MeasuredMaterial): number | null {
  const density = material.physicalState === 'solid' ? material.bulkDensity : material.density;
  return density === undefined || density === null ? null : density;
}

/**
 * Why a volume of a solid cannot be turned into a mass (or a mass into a volume) without a
 * bulk density: `amount` is what was asked ("10 mL of sodium chloride"), `target` what it
 * was to become ("g", "a mass").
 */
export function bulkDensityMissingMessage(amount: string, target: string): string {
  return `bulk density missing: ${amount} cannot be turned into ${target}, since a solid measured by volume needs its bulk (poured) density in g/mL; the crystal density is not used, as it would count the air between the grains as solid. Weigh it instead, or record the bulk density on the chemical`;
}

/**
 * Volume (mL) of a mass (g) of material with a density (g/mL): m / ρ.
 *
 * @throws ChemError `negative_quantity`, `not_a_number`, `not_positive` (density)
 */
export function massToVolume(massG: number, densityGPerMl: number): number {
  requireNonNegative(massG, 'mass');
  requirePositive(densityGPerMl, 'density');
  return massG / densityGPerMl;
}

/**
 * Mass (g) of a volume (mL) of material with a density (g/mL): V × ρ.
 *
 * @throws ChemError `negative_quantity`, `not_a_number`, `not_positive` (density)
 */
export function volumeToMass(volumeMl: number, densityGPerMl: number): number {
  requireNonNegative(volumeMl, 'volume');
  requirePositive(densityGPerMl, 'density');
  return volumeMl * densityGPerMl;
}

/**
 * Moles of pure substance in a mass of material: m × (purity / 100) / M.
 *
 * @param purityPercent mass % of the substance, (0, 100], default 100
 * @throws ChemError `negative_quantity`, `not_a_number`, `not_positive`, `out_of_range`
 */
export function massToAmount(massG: number, molarMass: number, purityPercent = 100): number {
  requireNonNegative(massG, 'mass');
  requirePositive(molarMass, 'molar mass');
  requirePercent(purityPercent, 'purity');
  return (massG * (purityPercent / 100)) / molarMass;
}

/**
 * Mass of material to weigh for an amount of pure substance: n × M / (purity / 100).
 * At 98 % purity you weigh more than at 100 %.
 *
 * @throws ChemError `negative_quantity`, `not_a_number`, `not_positive`, `out_of_range`
 */
export function amountToMass(amountMol: number, molarMass: number, purityPercent = 100): number {
  requireNonNegative(amountMol, 'amount');
  requirePositive(molarMass, 'molar mass');
  requirePercent(purityPercent, 'purity');
  return (amountMol * molarMass) / (purityPercent / 100);
}

function checkedQuantity(quantity: Quantity) {
  const base = toBaseUnit(quantity);
  if (base.value < 0) {
    throw new ChemError(
      'negative_quantity',
      `quantity cannot be negative (got ${show(quantity.value)} ${quantity.unit}): enter how much as a positive number`,
    );
  }
  return base;
}

function needDensity(quantity: Quantity, target: string, properties: ChemicalProperties): number {
  if (properties.physicalState === 'solid') {
    const bulk = measuringDensity(properties);
    if (bulk === null) {
      throw new ChemError(
        'bulk_density_missing',
        bulkDensityMissingMessage(`${show(quantity.value)} ${quantity.unit} of a solid`, target),
      );
    }
    return bulk;
  }
  if (properties.density === undefined || properties.density === null) {
    throw new ChemError(
      'density_missing',
      `density missing: converting ${show(quantity.value)} ${quantity.unit} to ${target} needs the density in g/mL`,
    );
  }
  return properties.density;
}

function needMolarMass(quantity: Quantity, target: string, properties: ChemicalProperties): number {
  if (properties.molarMass === undefined || properties.molarMass === null) {
    throw new ChemError(
      'molar_mass_missing',
      `molar mass missing: converting ${show(quantity.value)} ${quantity.unit} to ${target} needs the molar mass in g/mol (or a formula)`,
    );
  }
  return properties.molarMass;
}

/**
 * Mass of material for a quantity given in any unit: a mass is converted, a volume goes
 * through the density, an amount through the molar mass and the purity.
 *
 * @param unit result unit, default "g"
 * @throws ChemError `density_missing`, `molar_mass_missing`, `negative_quantity`,
 *   `not_a_number`, `unknown_unit`, `incompatible_units` (unit is not a mass)
 */
export function toMass(
  quantity: Quantity,
  properties: ChemicalProperties = {},
  unit = 'g',
): number {
  const base = checkedQuantity(quantity);
  let grams: number;
  if (base.dimension === 'mass') grams = base.value;
  else if (base.dimension === 'volume') {
    grams = volumeToMass(base.value, needDensity(quantity, 'a mass', properties));
  } else {
    grams = amountToMass(
      base.value,
      needMolarMass(quantity, 'a mass', properties),
      properties.purityPercent ?? 100,
    );
  }
  return convert(grams, 'g', unit);
}

/**
 * Volume of material for a quantity given in any unit (mass and amount go through the
 * density; an amount also through the molar mass and purity).
 *
 * @param unit result unit, default "mL"
 * @throws ChemError as {@link toMass}
 */
export function toVolume(
  quantity: Quantity,
  properties: ChemicalProperties = {},
  unit = 'mL',
): number {
  const base = checkedQuantity(quantity);
  if (base.dimension === 'volume') return convert(base.value, 'mL', unit);
  const density = needDensity(quantity, 'a volume', properties);
  const grams = toMass(quantity, properties);
  return convert(massToVolume(grams, density), 'mL', unit);
}

/**
 * Amount of pure substance (mol by default) in a quantity of material given in any unit.
 *
 * @param unit result unit, default "mol"
 * @throws ChemError as {@link toMass}
 */
export function toAmount(
  quantity: Quantity,
  properties: ChemicalProperties = {},
  unit = 'mol',
): number {
  const base = checkedQuantity(quantity);
  if (base.dimension === 'amount') return convert(base.value, 'mol', unit);
  const molar = needMolarMass(quantity, 'an amount', properties);
  const grams = toMass(quantity, properties);
  return convert(massToAmount(grams, molar, properties.purityPercent ?? 100), 'mol', unit);
}
