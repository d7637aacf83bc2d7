import { z } from 'zod';

/**
 * GHS pictograms (UN GHS, Annex 1 / EU CLP Annex V). Code and meaning are the standard's;
 * the short descriptions are our own plain-language summaries.
 */
export const ghsPictograms = {
  GHS01: { symbol: 'Exploding bomb', meaning: 'Explosive, self-reactive or organic peroxide' },
  GHS02: { symbol: 'Flame', meaning: 'Flammable' },
  GHS03: { symbol: 'Flame over circle', meaning: 'Oxidizer: may cause or intensify fire' },
  GHS04: { symbol: 'Gas cylinder', meaning: 'Gas under pressure' },
  GHS05: { symbol: 'Corrosion', meaning: 'Corrosive to skin, eyes or metals' },
  GHS06: { symbol: 'Skull and crossbones', meaning: 'Acutely toxic (fatal or toxic)' },
  GHS07: { symbol: 'Exclamation mark', meaning: 'Harmful, irritant or narcotic' },
  GHS08: {
    symbol: 'Health hazard',
    meaning: 'Serious long-term health hazard (e.g. carcinogen, reproductive toxicant)',
  },
  GHS09: { symbol: 'Environment', meaning: 'Hazardous to the aquatic environment' },
} as const;
export type GhsCode = keyof typeof ghsPictograms;
export const ghsCodes = Object.keys(ghsPictograms) as [GhsCode, ...GhsCode[]];
export const ghsCodeSchema = z.enum(ghsCodes, {
  message: `must be a GHS pictogram code, GHS01 to GHS09`,
});

/**
 * Hazard statement texts, UN GHS wording (Annex 3), from memory: the SDS of the product in
 * hand is the authority. Codes not listed here are still accepted if well formed.
 */
export const hazardStatementTexts: Record<string, string> = {
  H200: 'Unstable explosive',
  H220: 'Extremely flammable gas',
  H222: 'Extremely flammable aerosol',
  H224: 'Extremely flammable liquid and vapour',
  H225: 'Highly flammable liquid and vapour',
  H226: 'Flammable liquid and vapour',
  H228: 'Flammable solid',
  H250: 'Catches fire spontaneously if exposed to air',
  H260: 'In contact with water releases flammable gases which may ignite spontaneously',
  H261: 'In contact with water releases flammable gas',
  H270: 'May cause or intensify fire; oxidizer',
  H271: 'May cause fire or explosion; strong oxidizer',
  H272: 'May intensify fire; oxidizer',
  H280: 'Contains gas under pressure; may explode if heated',
  H290: 'May be corrosive to metals',
  H300: 'Fatal if swallowed',
  H301: 'Toxic if swallowed',
  H302: 'Harmful if swallowed',
  H304: 'May be fatal if swallowed and enters airways',
  H310: 'Fatal in contact with skin',
  H311: 'Toxic in contact with skin',
  H312: 'Harmful in contact with skin',
  H314: 'Causes severe skin burns and eye damage',
  H315: 'Causes skin irritation',
  H317: 'May cause an allergic skin reaction',
  H318: 'Causes serious eye damage',
  H319: 'Causes serious eye irritation',
  H330: 'Fatal if inhaled',
  H331: 'Toxic if inhaled',
  H332: 'Harmful if inhaled',
  H334: 'May cause allergy or asthma symptoms or breathing difficulties if inhaled',
  H335: 'May cause respiratory irritation',
  H336: 'May cause drowsiness or dizziness',
  H340: 'May cause genetic defects',
  H341: 'Suspected of causing genetic defects',
  H350: 'May cause cancer',
  H351: 'Suspected of causing cancer',
  H360: 'May damage fertility or the unborn child',
  H361: 'Suspected of damaging fertility or the unborn child',
  H361d: 'Suspected of damaging the unborn child',
  H361f: 'Suspected of damaging fertility',
  H370: 'Causes damage to organs',
  H371: 'May cause damage to organs',
  H372: 'Causes damage to organs through prolonged or repeated exposure',
  H373: 'May cause damage to organs through prolonged or repeated exposure',
  H400: 'Very toxic to aquatic life',
  H410: 'Very toxic to aquatic life with long lasting effects',
  H411: 'Toxic to aquatic life with long lasting effects',
  H412: 'Harmful to aquatic life with long lasting effects',
  H413: 'May cause long lasting harmful effects to aquatic life',
};

/** `H` + three digits, optionally followed by up to two letters (e.g. H361d, H360FD). */
export const hazardStatementSchema = z
  .string()
  .trim()
  .regex(/^H\d{3}[A-Za-z]{0,2}$/, 'must be an H-statement code such as H225 or H361d');

/** The line shown wherever hazards appear. Lotwise never approves anything as safe. */
export const safetyDeferral =
  'Hazard information in Lotwise is a reminder, not a safety approval. The supplier’s SDS, local regulations and licensed practice take precedence.';

/**
 * Storage groups (grouping after Prudent Practices in the Laboratory, classes of
 * incompatible chemicals, and the CRC Handbook's incompatible-chemicals table; the names
 * are ours).
 */
export const storageGroups = {
  flammable: { label: 'Flammables', hint: 'Solvents and other flammable liquids and solids' },
  'organic-acid': { label: 'Organic acids', hint: 'e.g. glacial acetic acid, acetic anhydride' },
  'inorganic-acid': { label: 'Mineral acids', hint: 'e.g. hydrochloric, sulfuric, phosphoric' },
  base: { label: 'Bases', hint: 'e.g. sodium hydroxide' },
  oxidizer: { label: 'Oxidizers', hint: 'e.g. permanganates, nitrites, nitrates, peroxides' },
  reducer: { label: 'Reducing metals', hint: 'Zinc and other reactive metal powders' },
  'water-reactive': { label: 'Keep dry', hint: 'Alkali metals, hydrides, pyrophorics' },
  'gas-with-acid': {
    label: 'Toxic gas with acid',
    hint: 'Cyanides, sulfides, azides: release toxic gas with acids',
  },
  'low-hazard': { label: 'General', hint: 'Low-hazard salts, water, most solids' },
} as const;
export type StorageGroup = keyof typeof storageGroups;
export const storageGroupCodes = Object.keys(storageGroups) as [StorageGroup, ...StorageGroup[]];
export const storageGroupSchema = z.enum(storageGroupCodes, {
  message: `must be one of: ${storageGroupCodes.join(', ')}`,
});

/** Peroxide-former classes A-D (university EHS guidance after Jackson 1970 and Kelly 1996). */
export const peroxideClasses = {
  A: 'Forms dangerous peroxides without concentration: test or discard 3 months after opening',
  B: 'Dangerous on concentration (distilling, evaporating): test or discard 12 months after opening',
  C: 'Peroxide-initiated polymerization: inhibited 12 months, uninhibited 24 hours',
  D: 'Other or uncertain peroxide former: test or discard 12 months after opening',
} as const;
export type PeroxideClass = keyof typeof peroxideClasses;
export const peroxideClassSchema = z.enum(['A', 'B', 'C', 'D'], {
  message: 'must be a peroxide-former class A, B, C or D',
});
