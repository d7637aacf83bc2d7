import { casCheckDigit } from '@lotwise/chem';

/** How big a generated lab is; `labSize(1)` is the size the bench measures. */
export interface LabSize {
  chemicals: number;
  lotsPerChemical: number;
  containers: number;
  procedures: number;
}

/** 100,000 containers, 5,000 chemicals, ~1,000,000 ledger rows, 300 procedures at scale 1. */
export function labSize(scale = 1): LabSize {
  return {
    chemicals: Math.max(20, Math.round(5_000 * scale)),
    lotsPerChemical: 4,
    containers: Math.max(200, Math.round(100_000 * scale)),
    procedures: Math.max(3, Math.round(300 * scale)),
  };
}

/** The accounts of a generated lab; every one signs in with `benchPassword`. */
export const benchUsers = [
  { email: 'admin@example.test', displayName: 'Bench admin', role: 'admin' },
  { email: 'technician@example.test', displayName: 'Bench technician', role: 'manager' },
  { email: 'member.one@example.test', displayName: 'Bench member one', role: 'member' },
  { email: 'member.two@example.test', displayName: 'Bench member two', role: 'member' },
  { email: 'member.three@example.test', displayName: 'Bench member three', role: 'member' },
] as const;
export const benchPassword = 'bench-password-2026';
/** The signed-in account the bench measures with (a manager: draws, runs, imports). */
export const benchTechnician = benchUsers[1];

/** A small deterministic random source (mulberry32), so two runs generate the same lab. */
export function seededRandom(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * The CAS RN of generated chemical `i`: `5xxxx-yy-c`, the check digit by the CAS rule, unique
 * per `i`, so the ten chemicals `10i…10i+9` share the prefix `5xxx` (a CAS-prefix search).
 */
export function benchCasNumber(i: number): string {
  const first = String(50_000 + i);
  const second = String(i % 100).padStart(2, '0');
  return `${first}-${second}-${casCheckDigit(first + second)}`;
}

const prefixes = ['Methyl', 'Ethyl', 'Propyl', 'Butyl', 'Phenyl', 'Benzyl', 'Isopropyl', 'Allyl'];
const cores = [
  'acetate',
  'benzoate',
  'chloride',
  'bromide',
  'salicylate',
  'formate',
  'oxalate',
  'sulfate',
  'nitrate',
  'carbonate',
  'citrate',
  'lactate',
];

/** An invented but chemical-looking name, unique per `i` (`Ethyl benzoate 0042`). */
export function benchChemicalName(i: number): string {
  const prefix = prefixes[i % prefixes.length]!;
  const core = cores[Math.floor(i / prefixes.length) % cores.length]!;
  return `${prefix} ${core} ${String(i).padStart(4, '0')}`;
}

/** Formulas the generated chemicals carry, so molar masses and stoichiometry work. */
export const benchFormulas = [
  'C4H8O2',
  'C9H10O2',
  'NaCl',
  'KBr',
  'C8H8O3',
  'C2H4O2',
  'C2H2O4',
  'CuSO4',
  'KNO3',
  'Na2CO3',
  'C6H8O7',
  'C3H6O3',
  'C7H6O3',
  'C2H6O',
];

/** Location tree: buildings › rooms › cabinets › shelves. */
export const locationTree = {
  buildings: 2,
  roomsPerBuilding: 5,
  cabinetsPerRoom: 4,
  shelvesPerCabinet: 5,
};
