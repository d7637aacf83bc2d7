import type { DefaultValues } from 'react-hook-form';
import {
  chemicalCreateSchema,
  numberIssueMessage,
  type Chemical,
  type ChemicalCreateParsed,
} from '@lotwise/shared';
import { parseDecimal } from '../../../lib/numbers';

/** Every editable field of a chemical, all present (the form always holds the whole record). */
export type ChemicalFormValues = ChemicalCreateParsed;

/**
 * A new chemical: the schema's own defaults (parsed with stand-in required values), with
 * name and physical state left for the person to fill in.
 */
const { physicalState: _stateStandIn, ...schemaDefaults } = chemicalCreateSchema.parse({
  name: 'new',
  physicalState: 'solid',
});
export const emptyChemical: DefaultValues<ChemicalFormValues> = { ...schemaDefaults, name: '' };

export function chemicalToFormValues(chemical: Chemical): ChemicalFormValues {
  return {
    name: chemical.name,
    synonyms: chemical.synonyms,
    casNumber: chemical.casNumber,
    formula: chemical.formula,
    physicalState: chemical.physicalState,
    density: chemical.density,
    bulkDensity: chemical.bulkDensity,
    defaultPurityPercent: chemical.defaultPurityPercent,
    ghsPictograms: chemical.ghsPictograms,
    hazardStatements: chemical.hazardStatements,
    storageGroup: chemical.storageGroup,
    peroxideClass: chemical.peroxideClass,
    stockUnit: chemical.stockUnit,
    reorderPoint: chemical.reorderPoint,
    reorderQuantity: chemical.reorderQuantity,
    restricted: chemical.restricted,
    notes: chemical.notes,
    flashPointC: chemical.flashPointC ?? null,
    boilingPointC: chemical.boilingPointC ?? null,
    flashPointSource: chemical.flashPointSource ?? '',
    boilingPointSource: chemical.boilingPointSource ?? '',
  };
}

export const labels: Record<keyof ChemicalFormValues, string> = {
  name: 'Name',
  synonyms: 'Synonyms',
  casNumber: 'CAS RN',
  formula: 'Formula',
  physicalState: 'Physical state',
  density: 'Density',
  bulkDensity: 'Bulk density',
  defaultPurityPercent: 'Default purity',
  ghsPictograms: 'Pictograms',
  hazardStatements: 'Hazard statements',
  storageGroup: 'Storage group',
  peroxideClass: 'Peroxide-former class',
  stockUnit: 'Stock unit',
  reorderPoint: 'Reorder point',
  reorderQuantity: 'Reorder quantity',
  restricted: 'Restricted',
  notes: 'Notes',
  flashPointC: 'Flash point',
  boilingPointC: 'Boiling point',
  flashPointSource: 'Source of the flash point',
  boilingPointSource: 'Source of the boiling point',
};
export const fieldNames = Object.keys(labels) as Array<keyof ChemicalFormValues>;

// Schema messages stay as written; numbers get the one wording of `@lotwise/shared`.
export const schemaOptions = { error: numberIssueMessage };

export const emptyToNull = (value: unknown) =>
  typeof value === 'string' && value.trim() === '' ? null : value;
/** A temperature as typed: a decimal comma and a typographic minus read as the reader writes them. */
export const toTemperature = (value: unknown) => {
  if (value === null || value === undefined) return null;
  if (typeof value === 'number') return value;
  return parseDecimal(String(value));
};
export const toNumber = (value: unknown) => {
  if (value === null || value === undefined) return null;
  if (typeof value === 'number') return value;
  const text = String(value).trim().replace(',', '.');
  return text === '' ? null : Number(text);
};

export const splitLines = (text: string) =>
  text
    .split('\n')
    .map((line) => line.trim())
    .filter(Boolean);
export const joinLines = (items: readonly string[]) => items.join('\n');
export const splitCodes = (text: string) =>
  text
    .split(/[\s,;]+/)
    .filter(Boolean)
    .map((code) => code.replace(/^h/, 'H'));
export const joinCodes = (items: readonly string[]) => items.join(', ');
