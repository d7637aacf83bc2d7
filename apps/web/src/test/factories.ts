import type { Chemical, Role, User } from '@lotwise/shared';

let nextId = 1;

export function makeUser(overrides: Partial<User> = {}): User {
  const id = nextId++;
  return {
    id,
    email: `person${id}@example.test`,
    displayName: `Person ${id}`,
    role: 'member' as Role,
    active: true,
    invitePending: false,
    lastLoginAt: null,
    createdAt: '2025-09-01T08:00:00.000Z',
    updatedAt: '2025-09-01T08:00:00.000Z',
    ...overrides,
  };
}

export function makeChemical(overrides: Partial<Chemical> = {}): Chemical {
  const id = nextId++;
  return {
    id,
    name: `Reagent ${id}`,
    synonyms: [],
    casNumber: null,
    formula: null,
    molarMass: null,
    physicalState: 'solid',
    density: null,
    defaultPurityPercent: 100,
    ghsPictograms: [],
    hazardStatements: [],
    storageGroup: 'low-hazard',
    peroxideClass: null,
    stockUnit: 'g',
    reorderPoint: null,
    reorderQuantity: null,
    restricted: false,
    notes: '',
    createdAt: '2025-09-01T08:00:00.000Z',
    updatedAt: '2025-09-01T08:00:00.000Z',
    ...overrides,
  };
}

export function page<T>(items: T[], total = items.length, pageNumber = 1, pageSize = 25) {
  return { items, total, page: pageNumber, pageSize };
}
