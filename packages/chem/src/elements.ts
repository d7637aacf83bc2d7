/**
 * The periodic table as packages/chem needs it: symbol, name, atomic number and the
 * standard atomic weight used for molar masses.
 *
 * Atomic weights: CIAAW, Standard atomic weights of the elements 2021 (Prohaska et al.,
 * Pure Appl. Chem. 94, 573-600, 2022), abridged values. Rows marked "reference" were copied
 * from the Lotwise handout (atomic-weights.tsv, key CIAAW2021); rows marked
 * "CIAAW 2021 abridged, from memory" were recalled, not read from the table. Elements with
 * no stable isotope and no characteristic terrestrial isotopic composition have no standard
 * atomic weight (null).
 */

/** One element of the periodic table. */
export interface Element {
  /** Symbol as written in a formula, e.g. "Cl". */
  symbol: string;
  /** English name, e.g. "chlorine". */
  name: string;
  /** Atomic number Z (0 is used for deuterium, which is an isotope label, not an element). */
  atomicNumber: number;
  /** Abridged standard atomic weight (CIAAW 2021), or null when the element has none. */
  atomicWeight: number | null;
}

type Row = [symbol: string, name: string, weight: number | null];

// Index + 1 = atomic number.
const ROWS: Row[] = [
  ['H', 'hydrogen', 1.008], // reference
  ['He', 'helium', 4.0026], // CIAAW 2021 abridged, from memory
  ['Li', 'lithium', 6.94], // reference
  ['Be', 'beryllium', 9.0122], // CIAAW 2021 abridged, from memory
  ['B', 'boron', 10.81], // reference
  ['C', 'carbon', 12.011], // reference
  ['N', 'nitrogen', 14.007], // reference
  ['O', 'oxygen', 15.999], // reference
  ['F', 'fluorine', 18.998], // reference
  ['Ne', 'neon', 20.18], // CIAAW 2021 abridged, from memory
  ['Na', 'sodium', 22.99], // reference
  ['Mg', 'magnesium', 24.305], // reference
  ['Al', 'aluminium', 26.982], // reference
  ['Si', 'silicon', 28.085], // reference
  ['P', 'phosphorus', 30.974], // reference
  ['S', 'sulfur', 32.06], // reference
  ['Cl', 'chlorine', 35.45], // reference
  ['Ar', 'argon', 39.95], // CIAAW 2021 abridged, from memory
  ['K', 'potassium', 39.098], // reference
  ['Ca', 'calcium', 40.078], // reference
  ['Sc', 'scandium', 44.956], // CIAAW 2021 abridged, from memory
  ['Ti', 'titanium', 47.867], // CIAAW 2021 abridged, from memory
  ['V', 'vanadium', 50.942], // CIAAW 2021 abridged, from memory
  ['Cr', 'chromium', 51.996], // CIAAW 2021 abridged, from memory
  ['Mn', 'manganese', 54.938], // reference
  ['Fe', 'iron', 55.845], // reference
  ['Co', 'cobalt', 58.933], // reference
  ['Ni', 'nickel', 58.693], // reference
  ['Cu', 'copper', 63.546], // reference
  ['Zn', 'zinc', 65.38], // reference
  ['Ga', 'gallium', 69.723], // CIAAW 2021 abridged, from memory
  ['Ge', 'germanium', 72.63], // CIAAW 2021 abridged, from memory
  ['As', 'arsenic', 74.922], // CIAAW 2021 abridged, from memory
  ['Se', 'selenium', 78.971], // CIAAW 2021 abridged, from memory
  ['Br', 'bromine', 79.904], // reference
  ['Kr', 'krypton', 83.798], // CIAAW 2021 abridged, from memory
  ['Rb', 'rubidium', 85.468], // CIAAW 2021 abridged, from memory
  ['Sr', 'strontium', 87.62], // CIAAW 2021 abridged, from memory
  ['Y', 'yttrium', 88.906], // CIAAW 2021 abridged, from memory
  ['Zr', 'zirconium', 91.224], // CIAAW 2021 abridged, from memory
  ['Nb', 'niobium', 92.906], // CIAAW 2021 abridged, from memory
  ['Mo', 'molybdenum', 95.95], // CIAAW 2021 abridged, from memory
  ['Tc', 'technetium', null],
  ['Ru', 'ruthenium', 101.07], // CIAAW 2021 abridged, from memory
  ['Rh', 'rhodium', 102.91], // CIAAW 2021 abridged, from memory
  ['Pd', 'palladium', 106.42], // CIAAW 2021 abridged, from memory
  ['Ag', 'silver', 107.87], // reference
  ['Cd', 'cadmium', 112.41], // CIAAW 2021 abridged, from memory
  ['In', 'indium', 114.82], // CIAAW 2021 abridged, from memory
  ['Sn', 'tin', 118.71], // reference
  ['Sb', 'antimony', 121.76], // CIAAW 2021 abridged, from memory
  ['Te', 'tellurium', 127.6], // CIAAW 2021 abridged, from memory
  ['I', 'iodine', 126.9], // reference
  ['Xe', 'xenon', 131.29], // CIAAW 2021 abridged, from memory
  ['Cs', 'caesium', 132.91], // CIAAW 2021 abridged, from memory
  ['Ba', 'barium', 137.33], // reference
  ['La', 'lanthanum', 138.91], // CIAAW 2021 abridged, from memory
  ['Ce', 'cerium', 140.12], // CIAAW 2021 abridged, from memory
  ['Pr', 'praseodymium', 140.91], // CIAAW 2021 abridged, from memory
  ['Nd', 'neodymium', 144.24], // CIAAW 2021 abridged, from memory
  ['Pm', 'promethium', null],
  ['Sm', 'samarium', 150.36], // CIAAW 2021 abridged, from memory
  ['Eu', 'europium', 151.96], // CIAAW 2021 abridged, from memory
  ['Gd', 'gadolinium', 157.25], // CIAAW 2021 abridged, from memory
  ['Tb', 'terbium', 158.93], // CIAAW 2021 abridged, from memory
  ['Dy', 'dysprosium', 162.5], // CIAAW 2021 abridged, from memory
  ['Ho', 'holmium', 164.93], // CIAAW 2021 abridged, from memory
  ['Er', 'erbium', 167.26], // CIAAW 2021 abridged, from memory
  ['Tm', 'thulium', 168.93], // CIAAW 2021 abridged, from memory
  ['Yb', 'ytterbium', 173.05], // CIAAW 2021 abridged, from memory
  ['Lu', 'lutetium', 174.97], // CIAAW 2021 abridged, from memory
  ['Hf', 'hafnium', 178.49], // CIAAW 2021 abridged, from memory
  ['Ta', 'tantalum', 180.95], // CIAAW 2021 abridged, from memory
  ['W', 'tungsten', 183.84], // CIAAW 2021 abridged, from memory
  ['Re', 'rhenium', 186.21], // CIAAW 2021 abridged, from memory
  ['Os', 'osmium', 190.23], // CIAAW 2021 abridged, from memory
  ['Ir', 'iridium', 192.22], // CIAAW 2021 abridged, from memory
  ['Pt', 'platinum', 195.08], // CIAAW 2021 abridged, from memory
  ['Au', 'gold', 196.97], // CIAAW 2021 abridged, from memory
  ['Hg', 'mercury', 200.59], // CIAAW 2021 abridged, from memory
  ['Tl', 'thallium', 204.38], // CIAAW 2021 abridged, from memory
  ['Pb', 'lead', 207.2], // reference
  ['Bi', 'bismuth', 208.98], // CIAAW 2021 abridged, from memory
  ['Po', 'polonium', null],
  ['At', 'astatine', null],
  ['Rn', 'radon', null],
  ['Fr', 'francium', null],
  ['Ra', 'radium', null],
  ['Ac', 'actinium', null],
  ['Th', 'thorium', 232.04], // CIAAW 2021 abridged, from memory
  ['Pa', 'protactinium', 231.04], // CIAAW 2021 abridged, from memory
  ['U', 'uranium', 238.03], // CIAAW 2021 abridged, from memory
  ['Np', 'neptunium', null],
  ['Pu', 'plutonium', null],
  ['Am', 'americium', null],
  ['Cm', 'curium', null],
  ['Bk', 'berkelium', null],
  ['Cf', 'californium', null],
  ['Es', 'einsteinium', null],
  ['Fm', 'fermium', null],
  ['Md', 'mendelevium', null],
  ['No', 'nobelium', null],
  ['Lr', 'lawrencium', null],
  ['Rf', 'rutherfordium', null],
  ['Db', 'dubnium', null],
  ['Sg', 'seaborgium', null],
  ['Bh', 'bohrium', null],
  ['Hs', 'hassium', null],
  ['Mt', 'meitnerium', null],
  ['Ds', 'darmstadtium', null],
  ['Rg', 'roentgenium', null],
  ['Cn', 'copernicium', null],
  ['Nh', 'nihonium', null],
  ['Fl', 'flerovium', null],
  ['Mc', 'moscovium', null],
  ['Lv', 'livermorium', null],
  ['Ts', 'tennessine', null],
  ['Og', 'oganesson', null],
];

/** All 118 elements in order of atomic number. */
export const ELEMENTS: readonly Element[] = ROWS.map(([symbol, name, atomicWeight], index) => ({
  symbol,
  name,
  atomicNumber: index + 1,
  atomicWeight,
}));

/**
 * Deuterium, written "D" in formulas such as D2O or CDCl3 (NMR solvents). Not an element
 * and not in the CIAAW table: the weight is the atomic mass of 2H, from memory
 * (2.014101778 u, AME), rounded to 5 decimals.
 */
export const DEUTERIUM: Element = {
  symbol: 'D',
  name: 'deuterium',
  atomicNumber: 0,
  atomicWeight: 2.0141,
};

const BY_SYMBOL = new Map<string, Element>(
  [...ELEMENTS, DEUTERIUM].map((element) => [element.symbol, element]),
);

/** The element (or "D") with this exact, case-sensitive symbol, or undefined. */
export function findElement(symbol: string): Element | undefined {
  return BY_SYMBOL.get(symbol);
}

/** True when `symbol` is an element symbol (case-sensitive) or "D". */
export function isElementSymbol(symbol: string): boolean {
  return BY_SYMBOL.has(symbol);
}
