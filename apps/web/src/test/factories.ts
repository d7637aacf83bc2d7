import type { Chemical, ContainerDetail, LedgerEntry, Role, User } from '@lotwise/shared';

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
    bulkDensity: null,
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

export function makeContainer(overrides: Partial<ContainerDetail> = {}): ContainerDetail {
  const id = overrides.id ?? nextId++;
  return {
    id,
    labelCode: `LW-${String(id).padStart(5, '0')}`,
    status: 'open',
    quantity: 250,
    unit: 'g',
    tareMass: 150,
    capacity: 500,
    capacityUnit: 'g',
    material: null,
    openedOn: '2026-09-01',
    expiresOn: '2028-06-30',
    expired: false,
    peroxide: null,
    notes: '',
    chemical: {
      id: 900,
      name: 'Sodium chloride',
      formula: 'NaCl',
      casNumber: '7647-14-5',
      density: null,
      storageGroup: 'low-hazard',
      extraHazardGroups: [],
      ghsPictograms: [],
      hazardStatements: [],
      peroxideClass: null,
      stockUnit: 'g',
    },
    lot: {
      id: 70,
      source: 'purchased',
      supplierName: 'Example Supply',
      supplierLotNumber: 'EX-2261',
      grade: 'reagent',
      purityPercent: 99.5,
      receivedOn: '2026-08-20',
      expiresOn: '2028-06-30',
    },
    location: { id: 5, name: 'Shelf 2', path: 'Room 101 › Cabinet A › Shelf 2' },
    holds: [],
    createdAt: '2026-08-20T09:00:00.000Z',
    updatedAt: '2026-09-01T09:00:00.000Z',
    warnings: [],
    sds: null,
    ...overrides,
  };
}

export function makeLedgerEntry(overrides: Partial<LedgerEntry> = {}): LedgerEntry {
  return {
    id: nextId++,
    containerId: 1,
    reason: 'received',
    quantity: 250,
    unit: 'g',
    balanceAfter: 250,
    note: '',
    user: { id: 2, displayName: 'Tess Technician' },
    runId: null,
    orderId: null,
    stocktakeId: null,
    fromLocationId: null,
    toLocationId: null,
    relatedContainerId: null,
    createdAt: '2026-08-20T09:00:00.000Z',
    ...overrides,
  };
}
