import { addDays } from '@lotwise/chem';
import { todayIso, type Chemical } from '@lotwise/shared';
import type { Repositories } from '../store';
import { appendEntry, createContainer } from '../../modules/containers/containers.service';

/** Solvent cans the teaching lab keeps in its flammables cabinet (5 L and 1 L, metal). */
const cans = [5000, 5000, 5000, 5000, 5000, 1000];

/**
 * The demo lab's room rules: Room 101, the teaching lab, is an instructional Class C lab unit
 * of 40 m² on the 2nd storey whose flammables cabinet is an approved cabinet, holding about
 * 94 % of its Class I limit once the club's solvent cans are in (NFPA 45 (2024) Table 9.1.1 as
 * the public summaries give it: 50 % of Class C's 4 gal per 100 ft² = 32.6 L). Runs last, so
 * the label codes of everything seeded before stay as they were.
 */
export async function seedDemoLabAreas(
  repos: Repositories,
  chemicals: Chemical[],
  places: Map<string, { id: number; path: string }>,
  today = todayIso(),
): Promise<void> {
  const room = places.get('r101')!;
  const cabinet = places.get('flam')!;
  const shelf = (await repos.locations.findRow(places.get('flam2')!.id))!;
  await repos.locations.update(cabinet.id, { flammableStorage: 'cabinet' });
  const nfpa45 = (await repos.ruleSets.builtIn('flammable-limits'))!;
  const sizes = (await repos.ruleSets.builtIn('container-sizes'))!;
  const now = `${today}T08:00:00.000Z`;
  await repos.labAreas.insert({
    locationId: room.id,
    kind: 'lab-unit',
    unitClass: 'C',
    floorArea: 40,
    floorAreaUnit: 'm2',
    storey: 2,
    instructional: true,
    flammableRuleSetId: nfpa45.id,
    containerSizeRuleSetId: sizes.id,
    notes: 'Teaching lab: benches for 16. Floor area from the building plan (invented).',
    createdAt: now,
    updatedAt: now,
  });

  const hexane = (await repos.chemicals.findRow(chemicals.find((c) => c.name === 'n-Hexane')!.id))!;
  const receivedOn = addDays(today, -20);
  const lotId = await repos.lots.insert({
    chemicalId: hexane.id,
    source: 'purchased',
    supplierName: 'Harbourview Scientific (fictional)',
    supplierLotNumber: 'DL-09911',
    grade: 'Laboratory reagent',
    purityPercent: 99,
    receivedOn,
    expiresOn: addDays(today, 700),
    madeByRunId: null,
    certificateFileName: null,
    certificateStoredName: null,
    notes: 'Solvent cans for the club’s chromatography evenings',
    createdAt: `${receivedOn}T09:00:00.000Z`,
    updatedAt: `${receivedOn}T09:00:00.000Z`,
  });
  for (const size of cans) {
    const row = await createContainer(repos, {
      lotId,
      chemical: hexane,
      location: shelf,
      quantity: size,
      status: 'sealed',
      openedOn: null,
      tareMass: null,
      capacity: size,
      capacityUnit: 'mL',
      material: 'metal',
      notes: '',
      expiresOn: addDays(today, 700),
    });
    await appendEntry(
      repos,
      row,
      {
        delta: size,
        reason: 'received',
        note: `Received into ${shelf.path}`,
        toLocationId: shelf.id,
        at: `${receivedOn}T09:30:00.000Z`,
      },
      null,
    );
  }
}
