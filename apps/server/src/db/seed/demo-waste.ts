import { addDays } from '@lotwise/chem';
import { formatWasteLabelCode, todayIso, type User } from '@lotwise/shared';
import type { Repositories } from '../store';
import { presentUser } from '../../modules/users/users.service';
import { writeWaste } from '../../modules/waste/waste.service';

/**
 * The demo lab's waste: a waste station in the prep room marked as a satellite accumulation
 * area, an organic-solvent container fed by the filtrates of recorded demo runs, an aqueous
 * acid container nearly full, and an older container already picked up.
 */
export async function seedDemoWaste(
  repos: Repositories,
  chemicalIds: Map<string, number>,
  people: { id: number; role: string }[],
  prepRoomId: number,
  today = todayIso(),
): Promise<void> {
  const at = (daysAgo: number, hour = 16) =>
    `${addDays(today, -daysAgo)}T${String(hour).padStart(2, '0')}:00:00.000Z`;
  const manager: User = presentUser(
    (await repos.users.findById(people.find((p) => p.role === 'manager')!.id))!,
  );
  const id = (name: string) => {
    const found = chemicalIds.get(name);
    if (found === undefined) throw new Error(`The demo has no chemical named ${name}`);
    return found;
  };
  const prepRoom = (await repos.locations.findRow(prepRoomId))!;
  const station = await repos.locations.insert(
    {
      name: 'Waste station',
      kind: 'other',
      parentId: prepRoom.id,
      storageGroups: [],
      flammableStorage: null,
      notes: 'Satellite accumulation area, by the prep-room sink.',
      createdAt: at(120, 8),
      updatedAt: at(120, 8),
    },
    prepRoom,
  );
  const set = await repos.ruleSets.builtIn('waste-accumulation');
  if (set) await repos.waste.setArea(station.id, set.id, at(120, 8));

  async function container(
    title: string,
    capacity: number,
    characteristics: ('ignitable' | 'corrosive' | 'reactive' | 'toxic')[],
    createdDaysAgo: number,
  ) {
    const labelNumber = await repos.waste.nextLabelNumber();
    return repos.waste.insertContainer({
      labelCode: formatWasteLabelCode(labelNumber),
      labelNumber,
      title,
      locationId: station.id,
      capacity,
      capacityUnit: 'L',
      form: 'liquid',
      characteristics,
      acutelyHazardous: false,
      accumulationStartOn: null,
      status: 'open',
      pickupId: null,
      notes: '',
      createdAt: at(createdDaysAgo, 8),
      updatedAt: at(createdDaysAgo, 8),
    });
  }
  const add = async (
    wasteContainerId: number,
    daysAgo: number,
    description: string,
    quantity: number,
    unit: string,
    chemicals: string[],
    runId: number | null = null,
  ) =>
    writeWaste(
      repos,
      { wasteContainerId, description, quantity, unit, chemicalIds: chemicals.map(id) },
      { runId },
      manager,
      { now: at(daysAgo), today: addDays(today, -daysAgo) },
    );

  // Picked up last month.
  const old = await container('Mixed organic solvents (spring)', 10, ['ignitable'], 100);
  await add(old, 95, 'Column washings', 3.5, 'L', ['Ethyl acetate', 'n-Hexane']);
  await add(old, 70, 'Rinse acetone', 2, 'L', ['Acetone']);
  const pickupId = await repos.waste.insertPickup({
    pickedUpOn: addDays(today, -40),
    contractor: 'Riverside Disposal Services (fictional)',
    manifestNumber: 'EX-2026-0042',
    notes: 'Invented demo pickup.',
    recordedById: manager.id,
    createdAt: at(40),
  });
  await repos.waste.updateContainers([old], {
    status: 'picked-up',
    pickupId,
    updatedAt: at(40),
  });

  // Fed by the recorded demo runs: the filtrate of each.
  const organic = await container('Halogen-free organic solvents', 10, ['ignitable'], 35);
  const runs = await repos.runs.list({
    page: 1,
    pageSize: 100,
    sort: 'performedOn.asc',
    status: 'recorded',
    q: '',
  } as never);
  for (const run of runs.rows.slice(-4)) {
    const daysAgo = Math.max(
      0,
      Math.round((Date.parse(today) - Date.parse(run.performedOn ?? today)) / 86_400_000),
    );
    await add(
      organic,
      daysAgo,
      `Filtrate and washings of run #${run.id}`,
      0.15,
      'L',
      ['Ethanol'],
      run.id,
    );
  }

  // Nearly full: time for a pickup.
  const acids = await container('Aqueous acid waste', 2, ['corrosive'], 30);
  await add(acids, 28, 'Titration waste', 0.8, 'L', ['Hydrochloric acid 37 %']);
  await add(acids, 14, 'Titration waste', 0.6, 'L', ['Hydrochloric acid 37 %']);
  await add(acids, 3, 'Acid bath rinse', 0.45, 'L', ['Sulfuric acid 98 %']);
}
