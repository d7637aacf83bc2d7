import { ChemError } from './errors';

/**
 * Storage groups that segregation knows about. The names are Lotwise's; the grouping follows
 * the classes of incompatible chemicals in Prudent Practices in the Laboratory (PP) and the
 * CRC Handbook's table of incompatible chemicals (CRC). `@lotwise/shared` lists the same
 * codes with labels for people.
 */
export const SEGREGATION_GROUPS = [
  'flammable',
  'organic-acid',
  'inorganic-acid',
  'base',
  'oxidizer',
  'reducer',
  'water-reactive',
  'gas-with-acid',
  'low-hazard',
] as const;

/** One of {@link SEGREGATION_GROUPS}. */
export type SegregationGroup = (typeof SEGREGATION_GROUPS)[number];

/** Where a row of the compatibility table comes from. */
export type SegregationSource = 'Prudent Practices' | 'CRC Handbook' | 'common practice, no source';

/** Two groups to keep apart, why, and where the rule comes from. */
export interface IncompatiblePair {
  a: SegregationGroup;
  b: SegregationGroup;
  /** Plain words a person can act on. */
  reason: string;
  source: SegregationSource;
}

/**
 * The compatibility table: every pair of groups to store apart. A pair not listed may share a
 * shelf as far as this table knows; the SDS of each product is the authority.
 */
export const INCOMPATIBLE_PAIRS: readonly IncompatiblePair[] = [
  {
    a: 'flammable',
    b: 'base',
    reason: 'Keep bases away from flammable solvents (a spill or a reaction can start a fire).',
    source: 'common practice, no source', // common practice, no source
  },
  {
    a: 'flammable',
    b: 'oxidizer',
    reason: 'Oxidizers feed and intensify fires of flammable materials.',
    source: 'Prudent Practices', // PP: oxidizers with flammables
  },
  {
    a: 'organic-acid',
    b: 'inorganic-acid',
    reason: 'Oxidizing mineral acids react violently with organic acids and anhydrides.',
    source: 'CRC Handbook', // CRC: oxidizing acids with organic acids
  },
  {
    a: 'organic-acid',
    b: 'base',
    reason: 'Acids and bases neutralise each other with heat and spattering.',
    source: 'Prudent Practices', // PP: acids with bases
  },
  {
    a: 'organic-acid',
    b: 'oxidizer',
    reason: 'Organic acids are combustible and react with oxidizers.',
    source: 'Prudent Practices', // PP: organic materials with oxidizers
  },
  {
    a: 'organic-acid',
    b: 'water-reactive',
    reason: 'Acids react with water-reactive materials, releasing flammable gas and heat.',
    source: 'Prudent Practices', // PP: acids with water-reactives
  },
  {
    a: 'organic-acid',
    b: 'gas-with-acid',
    reason: 'Acids release toxic gas from cyanides, sulfides, azides and nitrites.',
    source: 'Prudent Practices', // PP: acids with cyanides, sulfides
  },
  {
    a: 'inorganic-acid',
    b: 'base',
    reason: 'Acids and bases neutralise each other with heat and spattering.',
    source: 'Prudent Practices', // PP: acids with bases
  },
  {
    a: 'inorganic-acid',
    b: 'oxidizer',
    reason: 'Mineral acids with oxidizers can release toxic gases or start fires.',
    source: 'Prudent Practices', // PP: acids with oxidizers
  },
  {
    a: 'inorganic-acid',
    b: 'reducer',
    reason: 'Acids attack reactive metal powders, releasing hydrogen.',
    source: 'Prudent Practices', // PP: acids with active metals
  },
  {
    a: 'inorganic-acid',
    b: 'water-reactive',
    reason: 'Aqueous acids react with water-reactive materials, releasing flammable gas and heat.',
    source: 'Prudent Practices', // PP: acids with water-reactives
  },
  {
    a: 'inorganic-acid',
    b: 'gas-with-acid',
    reason: 'Acids release toxic gas from cyanides, sulfides, azides and nitrites.',
    source: 'Prudent Practices', // PP: acids with cyanides, sulfides
  },
  {
    a: 'base',
    b: 'reducer',
    reason: 'Strong bases attack metal powders such as zinc, releasing hydrogen.',
    source: 'Prudent Practices', // PP: metal powders release hydrogen with bases
  },
  {
    a: 'base',
    b: 'water-reactive',
    reason: 'Aqueous or hygroscopic bases bring water to water-reactive materials.',
    source: 'Prudent Practices', // PP: water-reactives kept dry
  },
  {
    a: 'oxidizer',
    b: 'reducer',
    reason: 'Oxidizers and reducing metals can react violently or ignite.',
    source: 'Prudent Practices', // PP: oxidizers with reducing agents
  },
  {
    a: 'oxidizer',
    b: 'water-reactive',
    reason: 'Oxidizers with water-reactive or pyrophoric materials can ignite.',
    source: 'Prudent Practices', // PP: oxidizers with water-reactives
  },
  {
    a: 'oxidizer',
    b: 'gas-with-acid',
    reason: 'Oxidizers react with cyanides and sulfides.',
    source: 'Prudent Practices', // PP: oxidizers with cyanides, sulfides
  },
  {
    a: 'reducer',
    b: 'water-reactive',
    reason: 'Keep water-reactive materials dry and apart from reactive metal powders.',
    source: 'Prudent Practices', // PP: water-reactives stored apart
  },
];

function requireGroup(group: string): SegregationGroup {
  if (!(SEGREGATION_GROUPS as readonly string[]).includes(group)) {
    throw new ChemError(
      'out_of_range',
      `unknown storage group "${group}": use one of ${SEGREGATION_GROUPS.join(', ')}`,
    );
  }
  return group as SegregationGroup;
}

/**
 * The rule that keeps two groups apart, or null when the table lists none. Symmetric:
 * `incompatibility('base', 'organic-acid')` finds the organic-acid/base row.
 *
 * @throws ChemError `out_of_range` for a group the table does not know
 */
export function incompatibility(first: string, second: string): IncompatiblePair | null {
  const a = requireGroup(first);
  const b = requireGroup(second);
  return (
    INCOMPATIBLE_PAIRS.find(
      (pair) => (pair.a === a && pair.b === b) || (pair.a === b && pair.b === a),
    ) ?? null
  );
}

/** Something stored somewhere, with every group whose incompatibilities it carries. */
export interface StoredItem<K> {
  key: K;
  /** The item's storage group first, then any extra groups (e.g. sodium nitrite: oxidizer and gas-with-acid). */
  groups: readonly string[];
}

/** Two stored items that should not share a place, with the rule. */
export interface StorageConflict<K> {
  first: K;
  second: K;
  rule: IncompatiblePair;
}

/**
 * Every rule broken between two items (each may carry several groups). Empty when they may
 * share a place as far as the table knows.
 */
export function rulesBetween(
  first: readonly string[],
  second: readonly string[],
): IncompatiblePair[] {
  const found: IncompatiblePair[] = [];
  for (const a of first) {
    for (const b of second) {
      const rule = incompatibility(a, b);
      if (rule && !found.includes(rule)) found.push(rule);
    }
  }
  return found;
}

/** Every incompatible pair among the items kept in one place (each pair of items once per rule). */
export function findStorageConflicts<K>(items: readonly StoredItem<K>[]): StorageConflict<K>[] {
  const conflicts: StorageConflict<K>[] = [];
  for (let i = 0; i < items.length; i++) {
    for (let j = i + 1; j < items.length; j++) {
      for (const rule of rulesBetween(items[i]!.groups, items[j]!.groups)) {
        conflicts.push({ first: items[i]!.key, second: items[j]!.key, rule });
      }
    }
  }
  return conflicts;
}
