import { chemicalCreateBodySchema, type Role } from '@lotwise/shared';
import type { DataSource } from 'typeorm';
import { hashPassword } from '../../modules/auth/passwords';
import { newChemicalValues } from '../../modules/chemicals/chemicals.service';
import { nowIso } from '../sql';
import { openStore } from '../repositories';
import { demoChemicals } from './demo-chemicals';
import { seedDemoLabAreas } from './demo-lab-areas';
import { seedDemoStock } from './demo-stock';
import { seedDemoWaste } from './demo-waste';
import { preparedOnlyChemicals, seedDemoPreparations } from './demo-preparations';
import { seedDemoSuppliers } from './purchasing-suppliers';

/** One published password for every demo account; change it before real use. */
export const demoPassword = 'lotwise-demo-2026';

/** The demo lab's people: a college teaching lab that hosts an evening chemistry club. */
export const demoAccounts: { email: string; displayName: string; role: Role }[] = [
  { email: 'instructor@example.test', displayName: 'Demo Instructor', role: 'admin' },
  { email: 'technician@example.test', displayName: 'Demo Technician', role: 'manager' },
  { email: 'member.one@example.test', displayName: 'Club Member One', role: 'member' },
  { email: 'member.two@example.test', displayName: 'Club Member Two', role: 'member' },
  { email: 'member.three@example.test', displayName: 'Club Member Three', role: 'member' },
  { email: 'visitor@example.test', displayName: 'Visiting Student', role: 'viewer' },
];

/**
 * Fills an empty database with the demo lab in one transaction. Does nothing (answers false)
 * when there is any user or chemical already. Demo prices are in the lab's `currency`.
 */
/** The built-in watch lists the demo lab has chosen. */
export const demoWatchListPresets = ['eu-2019-1148-annex-i', 'eu-2019-1148-annex-ii'];

export async function seedDemo(
  dataSource: DataSource,
  bcryptCost: number,
  currency = 'EUR',
): Promise<boolean> {
  const store = openStore(dataSource);
  const chemicals = demoChemicals.map((chemical) => chemicalCreateBodySchema.parse(chemical));
  const passwordHash = await hashPassword(demoPassword, bcryptCost);
  return store.transaction(async (repos) => {
    const empty =
      (await repos.users.count()) === 0 &&
      (await repos.chemicals.list({ q: '', sort: 'name.asc', page: 1, pageSize: 1 })).total === 0;
    if (!empty) return false;
    const now = nowIso();
    const people: { id: number; role: Role }[] = [];
    for (const account of demoAccounts) {
      const created = await repos.users.insert({
        ...account,
        passwordHash,
        active: true,
        inviteTokenHash: null,
        inviteExpiresAt: null,
        lastLoginAt: null,
        createdAt: now,
        updatedAt: now,
      });
      people.push({ id: created.id, role: created.role });
    }
    const inserted = [];
    for (const chemical of chemicals)
      inserted.push(await repos.chemicals.insert(newChemicalValues(chemical, now)));
    // Chemicals only ever made in the lab get their stock from the demo runs.
    const places = await seedDemoStock(
      repos,
      inserted.filter((chemical) => !preparedOnlyChemicals.has(chemical.name)),
      people,
    );
    await seedDemoPreparations(repos, inserted, people, places);
    await seedDemoWaste(
      repos,
      new Map(inserted.map((chemical) => [chemical.name, chemical.id])),
      people,
      places.get('r102')!.id,
    );
    await seedDemoSuppliers(repos, inserted, currency);
    // The demo lab follows the EU explosives-precursor lists: acetone (Annex II) and sulfuric
    // acid 98 % (Annex I, above 15 %) are watched, with their history of draws.
    await repos.watchLists.choosePresets(demoWatchListPresets);
    await seedDemoLabAreas(repos, inserted, places);
    return true;
  });
}
