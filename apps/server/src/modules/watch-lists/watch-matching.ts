import {
  meetsThreshold,
  thresholdText,
  type WatchListing,
  type WatchedHolding,
} from '@lotwise/shared';
import type { Repositories } from '../../db/store';
import { AppError } from '../../lib/app-error';
import type { ChosenEntry } from './watch-lists.repository';

/** What matching reads of a chemical: its CAS RN and its concentration (default purity, %). */
export interface WatchedCandidate {
  id: number;
  casNumber: string | null;
  defaultPurityPercent: number;
}

function listingOf(entry: ChosenEntry): WatchListing {
  return {
    listId: entry.listId,
    listName: entry.listName,
    jurisdiction: entry.jurisdiction,
    substance: entry.substance,
    threshold: thresholdText(entry),
    action: entry.action,
    // "Regulation …, Annex II" with a row source "Annex II" is said once.
    source: entry.listSource.endsWith(entry.source)
      ? entry.listSource
      : `${entry.listSource}; ${entry.source}`,
  };
}

/**
 * The chosen lists' rows each chemical meets, by chemical id, in one query for the whole set.
 * A chemical is watched when its CAS RN is on a chosen list and its default purity (for a
 * solution, its concentration in % w/w) meets the row's threshold.
 */
export async function watchListingsFor(
  repos: Repositories,
  chemicals: readonly WatchedCandidate[],
): Promise<Map<number, WatchListing[]>> {
  const result = new Map<number, WatchListing[]>();
  for (const chemical of chemicals) result.set(chemical.id, []);
  const cas = chemicals.map((c) => c.casNumber).filter((c): c is string => Boolean(c));
  const rows = await repos.watchLists.chosenEntriesFor(cas);
  if (rows.length === 0) return result;
  for (const chemical of chemicals) {
    if (!chemical.casNumber) continue;
    result.set(
      chemical.id,
      rows
        .filter((row) => row.casNumber === chemical.casNumber)
        .filter((row) => meetsThreshold(chemical.defaultPurityPercent, row))
        .map(listingOf),
    );
  }
  return result;
}

/** The chemicals of the lab on a chosen list at their concentration, with their listings. */
export async function watchedChemicals(repos: Repositories) {
  const cas = await repos.watchLists.chosenCasNumbers();
  const chemicals = await repos.watchLists.chemicalsFor({ casNumbers: cas });
  const listings = await watchListingsFor(repos, chemicals);
  return chemicals
    .map((chemical) => ({ ...chemical, listings: listings.get(chemical.id) ?? [] }))
    .filter((chemical) => chemical.listings.length > 0);
}

/** "EU explosives precursors, reportable (Annex II); DEA List II chemicals". */
export function listNames(listings: readonly WatchListing[]): string {
  return [...new Set(listings.map((l) => l.listName))].join('; ');
}

/**
 * Containers of watched chemicals held in `locationIds` (exactly these places: pass a lab
 * area's whole subtree to cover its cabinets and shelves), with the lists that name them.
 * Used by the watch-list report and the per-area inspection summary.
 */
export async function watchedHoldingsIn(
  repos: Repositories,
  locationIds?: readonly number[],
): Promise<WatchedHolding[]> {
  const watched = await watchedChemicals(repos);
  if (watched.length === 0) return [];
  const byId = new Map(watched.map((c) => [c.id, c]));
  const held = await repos.watchLists.heldContainers(
    watched.map((c) => c.id),
    locationIds ? [...locationIds] : undefined,
  );
  return held.map((row) => {
    const chemical = byId.get(row.chemicalId)!;
    return {
      ...row,
      chemicalName: chemical.name,
      casNumber: chemical.casNumber,
      lists: listNames(chemical.listings),
    };
  });
}

/**
 * Receiving or drawing a watched chemical is recorded with why: refuses an empty note with a
 * field error naming the lists. `field` is the request's note field.
 */
export async function requireWatchReason(
  repos: Repositories,
  chemical: WatchedCandidate & { name: string },
  note: string,
  field: string,
): Promise<WatchListing[]> {
  const listings = (await watchListingsFor(repos, [chemical])).get(chemical.id) ?? [];
  if (listings.length > 0 && note.trim() === '') {
    const lists = listNames(listings);
    throw AppError.validation(
      `${chemical.name} is on ${lists}: say why in the note; it is recorded with your name.`,
      { [field]: `say why: ${chemical.name} is on ${lists}` },
    );
  }
  return listings;
}
