import { addDays, addMonths } from '@lotwise/chem';
import {
  formatLabelCode,
  todayIso,
  type Chemical,
  type LocationKind,
  type StorageGroup,
} from '@lotwise/shared';
import type { Repositories } from '../store';
import { peroxideDueOf } from '../../modules/containers/peroxide-dates';
import { roundQuantity } from '../../modules/containers/containers.service';

/** A small deterministic PRNG (mulberry32), so the demo is the same on every machine. */
function prng(seed: number) {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** The invented lab's places: room > cabinet > shelf, each with the groups it is meant for. */
const places: {
  key: string;
  name: string;
  kind: LocationKind;
  parent?: string;
  groups: StorageGroup[];
}[] = [
  { key: 'r101', name: 'Room 101 Teaching lab', kind: 'room', groups: [] },
  {
    key: 'flam',
    name: 'Flammables cabinet',
    kind: 'cabinet',
    parent: 'r101',
    groups: ['flammable'],
  },
  { key: 'flam1', name: 'Shelf 1', kind: 'shelf', parent: 'flam', groups: ['flammable'] },
  { key: 'flam2', name: 'Shelf 2', kind: 'shelf', parent: 'flam', groups: ['flammable'] },
  {
    key: 'acid',
    name: 'Acid cabinet',
    kind: 'cabinet',
    parent: 'r101',
    groups: ['inorganic-acid', 'organic-acid'],
  },
  {
    key: 'mineral',
    name: 'Mineral acids shelf',
    kind: 'shelf',
    parent: 'acid',
    groups: ['inorganic-acid'],
  },
  {
    key: 'organic',
    name: 'Organic acids shelf',
    kind: 'shelf',
    parent: 'acid',
    groups: ['organic-acid'],
  },
  { key: 'basecab', name: 'Base cabinet', kind: 'cabinet', parent: 'r101', groups: ['base'] },
  { key: 'bases', name: 'Bases shelf', kind: 'shelf', parent: 'basecab', groups: ['base'] },
  { key: 'r102', name: 'Room 102 Prep room', kind: 'room', groups: [] },
  {
    key: 'general',
    name: 'General shelving',
    kind: 'cabinet',
    parent: 'r102',
    groups: ['low-hazard'],
  },
  { key: 'genA', name: 'Shelf A', kind: 'shelf', parent: 'general', groups: ['low-hazard'] },
  { key: 'genB', name: 'Shelf B', kind: 'shelf', parent: 'general', groups: ['low-hazard'] },
  { key: 'ox', name: 'Oxidizer cabinet', kind: 'cabinet', parent: 'r102', groups: ['oxidizer'] },
  { key: 'ox1', name: 'Shelf 1', kind: 'shelf', parent: 'ox', groups: ['oxidizer'] },
  { key: 'ox2', name: 'Shelf 2 (nitrites)', kind: 'shelf', parent: 'ox', groups: ['oxidizer'] },
  { key: 'metals', name: 'Metals cabinet', kind: 'cabinet', parent: 'r102', groups: ['reducer'] },
  { key: 'r103', name: 'Room 103 Club room', kind: 'room', groups: [] },
  {
    key: 'club',
    name: 'Club cupboard',
    kind: 'cabinet',
    parent: 'r103',
    groups: ['low-hazard', 'flammable'],
  },
  { key: 'water', name: 'Water store', kind: 'shelf', parent: 'r103', groups: ['low-hazard'] },
];

const shelfFor: Record<StorageGroup, string[]> = {
  flammable: ['flam1', 'flam2', 'club'],
  'organic-acid': ['organic'],
  'inorganic-acid': ['mineral'],
  base: ['bases'],
  oxidizer: ['ox1'],
  reducer: ['metals'],
  'water-reactive': ['metals'],
  'gas-with-acid': ['ox2'],
  'low-hazard': ['genA', 'genB', 'club'],
};

/** Invented suppliers; no real company has these names. */
const suppliers = [
  'Northgate Lab Supply (fictional)',
  'Harbourview Scientific (fictional)',
  'Fernhill Reagents (fictional)',
];
const grades = ['ACS reagent', 'Laboratory reagent', 'Technical', 'USP'];

/** Chemicals kept short on purpose, so the overview shows reorder warnings. */
const shortOnPurpose = new Set([
  'Acetone',
  'Sodium bicarbonate',
  'Acetic anhydride',
  'Potassium permanganate',
]);

const packSizes = { g: [100, 250, 500, 1000], mL: [100, 250, 500, 1000, 2500] };

/**
 * Locations, lots, containers and about six months of ledger history for the demo lab.
 * Deterministic; runs inside the seed's transaction.
 */
export async function seedDemoStock(
  repos: Repositories,
  chemicals: Chemical[],
  people: { id: number; role: string }[],
  today = todayIso(),
): Promise<Map<string, { id: number; path: string }>> {
  const random = prng(20260301);
  const pick = <T>(list: readonly T[]): T => list[Math.floor(random() * list.length)]!;
  const now = `${today}T08:00:00.000Z`;

  const ids = new Map<string, Awaited<ReturnType<Repositories['locations']['insert']>>>();
  for (const place of places) {
    const parent = place.parent ? ids.get(place.parent)! : null;
    const row = await repos.locations.insert(
      {
        name: place.name,
        kind: place.kind,
        parentId: parent?.id ?? null,
        storageGroups: place.groups,
        notes: '',
        createdAt: now,
        updatedAt: now,
      },
      parent,
    );
    ids.set(place.key, row);
  }

  const drawers = people.filter((p) => p.role !== 'viewer');
  const monthEnd = addDays(addMonths(`${today.slice(0, 7)}-01`, 1), -1);
  let labelNumber = 0;
  let lotIndex = 0;

  async function addContainer(
    chemical: Chemical,
    lot: { id: number; receivedOn: string; expiresOn: string | null },
    locationKey: string,
    size: number,
    usedFraction: number,
  ) {
    labelNumber++;
    const location = ids.get(locationKey)!;
    const tare = roundQuantity(
      size * (chemical.stockUnit === 'mL' ? 0.45 : 0.3) + 40 + random() * 20,
    );
    const containerId = await repos.containers.insert({
      labelCode: formatLabelCode(labelNumber),
      labelNumber,
      lotId: lot.id,
      chemicalId: chemical.id,
      locationId: location.id,
      status: 'sealed',
      quantity: 0,
      unit: chemical.stockUnit,
      tareMass: tare,
      capacity: size,
      capacityUnit: chemical.stockUnit,
      openedOn: null,
      expiresOn: lot.expiresOn,
      peroxideDueOn: null,
      notes: '',
      createdAt: `${lot.receivedOn}T09:00:00.000Z`,
      updatedAt: now,
    });
    const technician = people.find((p) => p.role === 'manager')!;
    let balance = size;
    await repos.containers.insertEntry({
      containerId,
      reason: 'received',
      quantity: size,
      unit: chemical.stockUnit,
      balanceAfter: balance,
      note: `Received into ${location.path}`,
      userId: technician.id,
      runId: null,
      orderId: null,
      stocktakeId: null,
      fromLocationId: null,
      toLocationId: location.id,
      relatedContainerId: null,
      createdAt: `${lot.receivedOn}T09:00:00.000Z`,
    });
    let openedOn: string | null = null;
    const target = size * usedFraction;
    const draws = usedFraction === 0 ? 0 : 2 + Math.floor(random() * 7);
    const span = Math.max(
      1,
      Math.round((Date.parse(today) - Date.parse(lot.receivedOn)) / 86_400_000) - 1,
    );
    const days = Array.from({ length: draws }, () => 1 + Math.floor(random() * span)).sort(
      (a, b) => a - b,
    );
    for (const day of days) {
      const amount = roundQuantity(Math.min(balance, (target / draws) * (0.6 + random() * 0.8)));
      if (amount <= 0) break;
      const date = addDays(lot.receivedOn, day);
      openedOn ??= date;
      balance = roundQuantity(balance - amount);
      await repos.containers.insertEntry({
        containerId,
        reason: 'drawn',
        quantity: -amount,
        unit: chemical.stockUnit,
        balanceAfter: balance,
        note: pick(['Practical class', 'Club evening', 'Prep for next week', 'Demonstration']),
        userId: pick(drawers).id,
        runId: null,
        orderId: null,
        stocktakeId: null,
        fromLocationId: null,
        toLocationId: null,
        relatedContainerId: null,
        createdAt: `${date}T${String(9 + Math.floor(random() * 10)).padStart(2, '0')}:15:00.000Z`,
      });
    }
    const due = peroxideDueOf(chemical.peroxideClass, openedOn, lot.receivedOn, lot.expiresOn);
    await repos.containers.update(containerId, {
      quantity: balance,
      status: balance <= 0 ? 'empty' : openedOn ? 'open' : 'sealed',
      openedOn,
      peroxideDueOn: due?.dueOn ?? null,
    });
    return containerId;
  }

  async function addLot(chemical: Chemical, receivedOn: string, expiresOn: string | null) {
    lotIndex++;
    const id = await repos.lots.insert({
      chemicalId: chemical.id,
      source: 'purchased',
      supplierName: suppliers[lotIndex % suppliers.length]!,
      supplierLotNumber: `DL-${String(2400 + lotIndex * 37).padStart(5, '0')}`,
      grade: pick(grades),
      purityPercent:
        chemical.defaultPurityPercent < 100
          ? chemical.defaultPurityPercent
          : pick([99, 99.5, 99.8, null]),
      receivedOn,
      expiresOn,
      madeByRunId: null,
      certificateFileName: null,
      certificateStoredName: null,
      notes: '',
      createdAt: `${receivedOn}T09:00:00.000Z`,
      updatedAt: `${receivedOn}T09:00:00.000Z`,
    });
    return { id, receivedOn, expiresOn };
  }

  for (const [index, chemical] of chemicals.entries()) {
    // Nitrite is an oxidizer that also reacts with acids and other oxidizers: its own shelf.
    const groupShelves = chemical.extraHazardGroups?.length
      ? ['ox2']
      : shelfFor[chemical.storageGroup];
    const home = chemical.name.startsWith('Water')
      ? 'water'
      : groupShelves[index % groupShelves.length]!;
    const sizes = packSizes[chemical.stockUnit];
    const receivedOn = addDays(today, -(150 + Math.floor(random() * 60)));
    // Some lots expire at the end of this month; every fifth chemical also has an old,
    // expired lot still on the shelf.
    const expiresOn =
      index % 7 === 3 ? monthEnd : addDays(receivedOn, 730 + Math.floor(random() * 365));
    const lot = await addLot(chemical, receivedOn, expiresOn);
    if (shortOnPurpose.has(chemical.name)) {
      const size = chemical.reorderPoint ?? 100;
      await addContainer(chemical, lot, home, Math.max(size, 100), 0.75);
      continue;
    }
    const size = chemical.name.startsWith('Water') ? 5000 : pick(sizes);
    await addContainer(chemical, lot, home, size, 0.2 + random() * 0.5);
    await addContainer(chemical, lot, groupShelves[(index + 1) % groupShelves.length]!, size, 0);
    if (index % 3 === 1) {
      // A working bottle for the club evenings where the group may stand there.
      const club = groupShelves.includes('club') ? 'club' : home;
      await addContainer(chemical, lot, club, sizes[0]!, 0.3 + random() * 0.4);
    }
    if (index % 5 === 0) {
      const old = await addLot(chemical, addDays(today, -900), addDays(today, -20 - index));
      await addContainer(chemical, old, home, pick(sizes), 0.4);
    }
  }

  // The one deliberate segregation conflict: a bottle of hydrochloric acid left on the bases shelf.
  const hcl = chemicals.find((c) => c.casNumber === '7647-01-0');
  if (hcl) {
    const lot = await addLot(hcl, addDays(today, -40), addDays(today, 500));
    await addContainer(hcl, lot, 'bases', 500, 0.1);
  }
  return ids;
}
