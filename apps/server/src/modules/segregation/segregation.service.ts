import { rulesBetween, type IncompatiblePair } from '@lotwise/chem';
import {
  safetyDeferral,
  storageGroups,
  type ConfirmationWarning,
  type ConflictContainer,
  type LocationConflict,
  type LocationConflictPair,
  type SegregationConflictsResponse,
  type SegregationWarning,
  type StorageConflictWarning,
  type StorageGroup,
} from '@lotwise/shared';
import { AppError } from '../../lib/app-error';
import type { Repositories } from '../../db/store';
import type { LocationRow } from '../locations/location.entity';
import type { PlacedContainer } from './segregation.repository';

/** Every group whose incompatibilities a chemical carries: its storage group, then the extras. */
export function hazardGroupsOf(chemical: {
  storageGroup: StorageGroup;
  extraHazardGroups: StorageGroup[] | null | undefined;
}): StorageGroup[] {
  return [chemical.storageGroup, ...(chemical.extraHazardGroups ?? [])];
}

function asConflictContainer(container: PlacedContainer): ConflictContainer {
  return {
    id: container.id,
    labelCode: container.labelCode,
    chemicalId: container.chemicalId,
    chemicalName: container.chemicalName,
    storageGroup: container.storageGroup,
  };
}

function label(group: StorageGroup): string {
  return storageGroups[group].label.toLowerCase();
}

/** Does `group` fall under the rule's side `side`? */
function carries(container: PlacedContainer, group: StorageGroup): boolean {
  return hazardGroupsOf(container).includes(group);
}

/** Every incompatible pair and every misplaced container at one place. */
function conflictsAmong(location: LocationRow, here: PlacedContainer[]): LocationConflict | null {
  const byRule = new Map<IncompatiblePair, LocationConflictPair>();
  for (let i = 0; i < here.length; i++) {
    for (let j = i + 1; j < here.length; j++) {
      const a = here[i]!;
      const b = here[j]!;
      if (a.chemicalId === b.chemicalId) continue;
      for (const rule of rulesBetween(hazardGroupsOf(a), hazardGroupsOf(b))) {
        const entry = byRule.get(rule) ?? {
          groups: [rule.a, rule.b] as [StorageGroup, StorageGroup],
          reason: rule.reason,
          source: rule.source,
          first: [],
          second: [],
        };
        const [onA, onB] = carries(a, rule.a) && carries(b, rule.b) ? [a, b] : [b, a];
        if (!entry.first.some((c) => c.id === onA.id)) entry.first.push(asConflictContainer(onA));
        if (!entry.second.some((c) => c.id === onB.id)) entry.second.push(asConflictContainer(onB));
        byRule.set(rule, entry);
      }
    }
  }
  const mismatches =
    location.storageGroups.length === 0
      ? []
      : here
          .filter((c) => !location.storageGroups.includes(c.storageGroup))
          .map(asConflictContainer);
  if (byRule.size === 0 && mismatches.length === 0) return null;
  return {
    location: { id: location.id, name: location.name, path: location.path },
    pairs: [...byRule.values()],
    mismatches,
  };
}

/** The chemical of a container being placed, with its groups. */
export interface PlacedChemical {
  id: number;
  name: string;
  storageGroup: StorageGroup;
  extraHazardGroups: StorageGroup[] | null;
}

/** A group in a sentence: "Nitric acid (mineral acid) and ethanol (flammable)". */
const groupNouns: Record<StorageGroup, string> = {
  flammable: 'flammable',
  'organic-acid': 'organic acid',
  'inorganic-acid': 'mineral acid',
  base: 'base',
  oxidizer: 'oxidizer',
  reducer: 'reducing metal',
  'water-reactive': 'water-reactive',
  'gas-with-acid': 'gives toxic gas with acids',
  'low-hazard': 'general',
};

/** "an organic acid", "a base"; "flammable" and "general" stay as they are. */
function article(noun: string): string {
  if (noun === 'flammable' || noun === 'general') return noun;
  if (noun.startsWith('gives')) return `one that ${noun}`;
  return /^[aeiou]/.test(noun) ? `an ${noun}` : `a ${noun}`;
}

/** "Ethanol" in the middle of a sentence reads "ethanol"; "EDTA" stays as it is. */
function midSentence(name: string): string {
  return /^[A-Z][a-z]/.test(name) ? name[0]!.toLowerCase() + name.slice(1) : name;
}

/**
 * Refuses a write (409 `confirmation_required`, nothing written) while there are warnings the
 * person has not confirmed: every write that asks for a say-so answers through here.
 */
export function refuseUnconfirmed(warnings: ConfirmationWarning[], nothingSaved: string): void {
  if (warnings.length === 0) return;
  throw AppError.confirmationRequired(
    `${warnings.map((w) => w.message).join(' ')} ${nothingSaved} ${safetyDeferral}`,
    warnings,
  );
}

export function segregationService(repos: Repositories) {
  /**
   * The rules a container of `chemical` at `location` breaks with the other containers there
   * (bottles of the same chemical never warn about each other), and whether the place is
   * meant for other groups.
   */
  async function conflictsFor(
    container: { id: number | null },
    chemical: PlacedChemical,
    location: LocationRow,
  ) {
    const mine = hazardGroupsOf(chemical);
    // Which chemicals there conflict at all, from one row per chemical; only their containers
    // are read (most places have none).
    const conflicting = (await repos.segregation.chemicalsAt(location.id))
      .filter((other) => other.chemicalId !== chemical.id)
      .filter((other) => rulesBetween(mine, hazardGroupsOf(other)).length > 0)
      .map((other) => other.chemicalId);
    const others = (await repos.segregation.placedOf(location.id, conflicting)).filter(
      (c) => c.id !== container.id,
    );
    const byRule = new Map<IncompatiblePair, PlacedContainer[]>();
    for (const other of others) {
      for (const rule of rulesBetween(mine, hazardGroupsOf(other))) {
        byRule.set(rule, [...(byRule.get(rule) ?? []), other]);
      }
    }
    return {
      rules: [...byRule.entries()].map(([rule, found]) => ({ rule, others: found })),
      mismatch:
        location.storageGroups.length > 0 &&
        !location.storageGroups.includes(chemical.storageGroup),
    };
  }

  return {
    /**
     * Warnings for a container (of `chemical`) at `location`: incompatible groups among the
     * other containers there, and a mismatch with the place's intended groups.
     */
    async warningsFor(
      container: { id: number | null; labelCode: string },
      chemical: PlacedChemical,
      location: LocationRow,
    ): Promise<SegregationWarning[]> {
      const found = await conflictsFor(container, chemical, location);
      const warnings: SegregationWarning[] = found.rules.map(({ rule, others }) => ({
        code: 'incompatible_groups',
        message: `${container.labelCode} (${chemical.name}) shares ${location.path} with ${others
          .map((c) => `${c.labelCode} (${c.chemicalName})`)
          .join(', ')}: ${label(rule.a)} and ${label(rule.b)} are stored apart.`,
        reason: rule.reason,
        source: rule.source,
        groups: [rule.a, rule.b],
        labelCodes: others.map((c) => c.labelCode),
      }));
      if (found.mismatch) {
        warnings.push({
          code: 'location_group_mismatch',
          message: `${location.path} is meant for ${location.storageGroups.map(label).join(', ')}; ${container.labelCode} (${chemical.name}) is ${label(chemical.storageGroup)}.`,
          reason: 'The place was set up for other storage groups.',
          source: null,
          groups: [chemical.storageGroup],
          labelCodes: [],
        });
      }
      return warnings;
    },

    /**
     * What putting a container of `chemical` at `location` would break, asked before the write:
     * each incompatible pair says which chemicals "must be kept apart" and why.
     */
    async confirmationsFor(
      container: { id: number | null },
      chemical: PlacedChemical,
      location: LocationRow,
    ): Promise<StorageConflictWarning[]> {
      const found = await conflictsFor(container, chemical, location);
      const mine = hazardGroupsOf(chemical);
      const warnings: StorageConflictWarning[] = found.rules.map(({ rule, others }) => {
        const [myGroup, theirGroup] = mine.includes(rule.a) ? [rule.a, rule.b] : [rule.b, rule.a];
        const names = [...new Set(others.map((c) => midSentence(c.chemicalName)))].join(', ');
        return {
          kind: 'storage_conflict',
          message: `${chemical.name} (${groupNouns[myGroup]}) and ${names} (${groupNouns[theirGroup]}, ${others
            .map((c) => c.labelCode)
            .join(', ')} at ${location.path}) must be kept apart: ${rule.reason}`,
          code: 'incompatible_groups',
          reason: rule.reason,
          source: rule.source,
          groups: [myGroup, theirGroup],
          locationId: location.id,
          locationPath: location.path,
          labelCodes: others.map((c) => c.labelCode),
        };
      });
      if (found.mismatch) {
        warnings.push({
          kind: 'storage_conflict',
          message: `${location.path} is meant for ${location.storageGroups.map(label).join(', ')}; ${chemical.name} is ${article(groupNouns[chemical.storageGroup])}: store it with its own group.`,
          code: 'location_group_mismatch',
          reason: 'The place was set up for other storage groups.',
          source: null,
          groups: [chemical.storageGroup],
          locationId: location.id,
          locationPath: location.path,
          labelCodes: [],
        });
      }
      return warnings;
    },

    /**
     * Refuses (409 `confirmation_required`, nothing written) putting a container where it
     * breaks a storage rule, unless the person confirmed.
     */
    async requireStorageConfirmed(
      container: { id: number | null },
      chemical: PlacedChemical,
      location: LocationRow,
      confirmed: boolean,
    ): Promise<void> {
      if (confirmed) return;
      refuseUnconfirmed(
        await this.confirmationsFor(container, chemical, location),
        'Nothing was saved: confirm to store it there anyway.',
      );
    },

    /** Conflicts at one place, as warnings (for the location page). */
    async warningsAt(location: LocationRow): Promise<SegregationWarning[]> {
      const conflict = conflictsAmong(location, await repos.segregation.placedAt([location.id]));
      if (!conflict) return [];
      return [
        ...conflict.pairs.map((pair): SegregationWarning => ({
          code: 'incompatible_groups',
          message: `${location.path} holds ${label(pair.groups[0])} (${pair.first.map((c) => c.labelCode).join(', ')}) with ${label(pair.groups[1])} (${pair.second.map((c) => c.labelCode).join(', ')}).`,
          reason: pair.reason,
          source: pair.source,
          groups: pair.groups,
          labelCodes: [...pair.first, ...pair.second].map((c) => c.labelCode),
        })),
        ...conflict.mismatches.map((c): SegregationWarning => ({
          code: 'location_group_mismatch',
          message: `${location.path} is meant for ${location.storageGroups.map(label).join(', ')}; ${c.labelCode} (${c.chemicalName}) is ${label(c.storageGroup)}.`,
          reason: 'The place was set up for other storage groups.',
          source: null,
          groups: [c.storageGroup],
          labelCodes: [c.labelCode],
        })),
      ];
    },

    /** Every place with a conflict, by path. */
    async conflicts(): Promise<SegregationConflictsResponse> {
      const combos = await repos.segregation.chemicalsByLocation();
      const byLocation = new Map<number, typeof combos>();
      for (const combo of combos)
        byLocation.set(combo.locationId, [...(byLocation.get(combo.locationId) ?? []), combo]);
      const locations = new Map(
        (await repos.locations.rowsByIds([...byLocation.keys()])).map((row) => [row.id, row]),
      );
      // First find the places that may conflict from one row per chemical, then load their containers.
      const suspects = [...byLocation.entries()].filter(([locationId, here]) => {
        const location = locations.get(locationId);
        if (!location) return false;
        if (
          location.storageGroups.length > 0 &&
          here.some((c) => !location.storageGroups.includes(c.storageGroup))
        )
          return true;
        for (let i = 0; i < here.length; i++)
          for (let j = i + 1; j < here.length; j++)
            if (rulesBetween(hazardGroupsOf(here[i]!), hazardGroupsOf(here[j]!)).length > 0)
              return true;
        return false;
      });
      const placed = await repos.segregation.placedAt(suspects.map(([id]) => id));
      const items = suspects
        .map(([locationId]) =>
          conflictsAmong(
            locations.get(locationId)!,
            placed.filter((c) => c.locationId === locationId),
          ),
        )
        .filter((item): item is LocationConflict => item !== null)
        .sort((a, b) => a.location.path.localeCompare(b.location.path));
      return { items, total: items.length, notice: safetyDeferral };
    },
  };
}
export type SegregationService = ReturnType<typeof segregationService>;
