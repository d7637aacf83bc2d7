import type { LiquidClass } from '@lotwise/chem';
import {
  formatWasteLabelCode,
  parseWasteLabelCode,
  todayIso,
  type User,
  type WasteAdditionInputParsed,
  type WasteArea,
  type WasteContainer,
  type WasteContainerCreateParsed,
  type WasteContainerDetail,
  type WasteContainerListQuery,
  type WastePickup,
  type wasteAreaPutSchema,
  type wasteContainerPatchSchema,
  type wastePickupCreateSchema,
} from '@lotwise/shared';
import type { z } from 'zod';
import { AppError } from '../../lib/app-error';
import type { Repositories, Store } from '../../db/store';
import { nowIso } from '../../db/sql';
import { rulesBetween } from '@lotwise/chem';
import { requireRuleSet } from '../rule-sets/rule-sets.service';
import { hazardGroupsOf } from '../segregation/segregation.service';
import type { AlertsService } from '../alerts/alerts.service';
import { wasteAlertMessages } from './waste-alerts';
import { wasteAreas } from './waste-areas';
import {
  addWaste,
  approximateIn,
  chemicalsIn,
  presentWasteContainers,
  wasteContainerDetail,
} from './waste-contents';
import type { WastePickupRow } from './waste.entity';

export { addWaste, checkWaste, withWasteWarnings, writeWaste } from './waste-contents';

/** Waste on hand in a set of places (open and full containers), for reports. */
export interface WasteOnHand {
  containers: WasteContainer[];
  /** Approximate litres of all of it (masses counted as if 1 g were 1 mL). */
  litres: number;
  /** Litres of ignitable liquid waste by the NFPA 30 class it counts under. */
  ignitableLitresByClass: Partial<Record<LiquidClass, number>>;
}

/** An ignitable liquid waste container, as the flammable-liquid totals count it. */
export interface IgnitableWaste {
  wasteContainerId: number;
  labelCode: string;
  title: string;
  locationPath: string;
  idPath: string;
  liquidClass: LiquidClass;
  liquidClassNote: string | null;
  litres: number;
}

/** The waste on hand in `locationIds` (the places themselves, not their children). */
export async function wasteOnHandIn(
  repos: Repositories,
  locationIds: number[],
  today = todayIso(),
): Promise<WasteOnHand> {
  const rows = await repos.waste.listContainers({ statuses: ['open', 'full'], locationIds });
  const containers = await presentWasteContainers(repos, rows, today);
  let litres = 0;
  const byClass: Partial<Record<LiquidClass, number>> = {};
  for (const container of containers) {
    const l =
      container.filled === null
        ? 0
        : (approximateIn(container.filled, container.capacityUnit, 'L') ?? 0);
    litres += l;
    if (
      container.form === 'liquid' &&
      container.liquidClass &&
      container.characteristics.includes('ignitable')
    ) {
      byClass[container.liquidClass] = (byClass[container.liquidClass] ?? 0) + l;
    }
  }
  return { containers, litres, ignitableLitresByClass: byClass };
}

/** Ignitable liquid waste anywhere under `idPaths`, for the flammable-liquid totals. */
export async function ignitableWasteUnder(
  repos: Repositories,
  idPaths: string[],
  today = todayIso(),
): Promise<IgnitableWaste[]> {
  const rows = await repos.waste.openInSubtrees(idPaths);
  const idPathOf = new Map(rows.map((r) => [r.id, r.idPath]));
  const presented = await presentWasteContainers(repos, rows, today);
  return presented.flatMap((c) =>
    c.form === 'liquid' && c.liquidClass && c.characteristics.includes('ignitable')
      ? [
          {
            wasteContainerId: c.id,
            labelCode: c.labelCode,
            title: c.title,
            locationPath: c.locationPath,
            idPath: idPathOf.get(c.id)!,
            liquidClass: c.liquidClass,
            liquidClassNote: c.liquidClassNote,
            litres: c.filled === null ? 0 : (approximateIn(c.filled, c.capacityUnit, 'L') ?? 0),
          },
        ]
      : [],
  );
}

async function requireLocation(repos: Repositories, id: number) {
  const location = await repos.locations.findRow(id);
  if (!location) {
    throw AppError.validation(`There is no location #${id}.`, { locationId: `no location #${id}` });
  }
  return location;
}

function presentPickup(
  row: WastePickupRow,
  containers: { id: number; labelCode: string; title: string; pickupId: number | null }[],
): WastePickup {
  return {
    ...row,
    containers: containers
      .filter((c) => c.pickupId === row.id)
      .map((c) => ({ id: c.id, labelCode: c.labelCode, title: c.title })),
  };
}

/** Waste containers, their additions, accumulation areas and pickups. */
export function wasteService(
  store: Store,
  options: { alerts?: Pick<AlertsService, 'notify'> } = {},
) {
  /** Sends the waste alerts of the moment with the write that changed them. */
  async function alertAfter(repos: Repositories) {
    if (!options.alerts) return;
    for (const message of await wasteAlertMessages(repos))
      await options.alerts.notify(repos, message);
  }

  return {
    /** Open containers (or of `status`); `compatibleWith` leaves out those that conflict. */
    async list(
      query: WasteContainerListQuery & { statuses?: WasteContainer['status'][] },
    ): Promise<WasteContainer[]> {
      const repos = store.repos;
      let rows = await repos.waste.listContainers({
        ...(query.status
          ? { status: query.status }
          : query.statuses
            ? { statuses: query.statuses }
            : {}),
        ...(query.locationId ? { locationIds: [query.locationId] } : {}),
      });
      if (query.compatibleWith?.length) {
        const incoming = await repos.chemicals.findRows(query.compatibleWith);
        const contents = await chemicalsIn(
          repos,
          rows.map((r) => r.id),
        );
        rows = rows.filter((row) =>
          (contents.get(row.id) ?? []).every((there) =>
            incoming.every(
              (mine) =>
                mine.id === there.id ||
                rulesBetween(hazardGroupsOf(mine), hazardGroupsOf(there)).length === 0,
            ),
          ),
        );
      }
      return presentWasteContainers(repos, rows);
    },

    get: (id: number): Promise<WasteContainerDetail> => wasteContainerDetail(store.repos, id),

    async getByLabel(labelCode: string): Promise<WasteContainerDetail> {
      const n = parseWasteLabelCode(labelCode);
      const row =
        n === null ? null : await store.repos.waste.findContainerByLabel(formatWasteLabelCode(n));
      if (!row) throw AppError.notFound(`No waste container has the label ${labelCode}.`);
      return wasteContainerDetail(store.repos, row.id);
    },

    async create(input: WasteContainerCreateParsed): Promise<WasteContainerDetail> {
      const id = await store.transaction(async (repos) => {
        await requireLocation(repos, input.locationId);
        const labelNumber = await repos.waste.nextLabelNumber();
        const now = nowIso();
        return repos.waste.insertContainer({
          labelCode: formatWasteLabelCode(labelNumber),
          labelNumber,
          title: input.title,
          locationId: input.locationId,
          capacity: input.capacity,
          capacityUnit: input.capacityUnit,
          form: input.form,
          characteristics: input.characteristics,
          acutelyHazardous: input.acutelyHazardous,
          accumulationStartOn: input.accumulationStartOn,
          status: 'open',
          pickupId: null,
          notes: input.notes,
          createdAt: now,
          updatedAt: now,
        });
      });
      return wasteContainerDetail(store.repos, id);
    },

    async update(
      id: number,
      patch: z.output<typeof wasteContainerPatchSchema>,
    ): Promise<WasteContainerDetail> {
      await store.transaction(async (repos) => {
        const row = await repos.waste.findContainer(id);
        if (!row) throw AppError.notFound(`There is no waste container #${id}.`);
        if (row.status === 'picked-up') {
          throw AppError.conflict(`${row.labelCode} was picked up; its record stands as it was.`);
        }
        if (patch.locationId !== undefined) await requireLocation(repos, patch.locationId);
        await repos.waste.updateContainer(id, { ...patch, updatedAt: nowIso() });
      });
      return wasteContainerDetail(store.repos, id);
    },

    async addTo(
      id: number,
      input: Omit<WasteAdditionInputParsed, 'wasteContainerId'> & { confirm: boolean },
      actor: User,
    ): Promise<WasteContainerDetail> {
      const { confirm, ...rest } = input;
      await store.transaction(async (repos) => {
        await addWaste(repos, { ...rest, wasteContainerId: id }, {}, actor, { confirm });
        await alertAfter(repos);
      });
      return wasteContainerDetail(store.repos, id);
    },

    areas: (): Promise<WasteArea[]> => wasteAreas(store.repos),

    async setArea(
      locationId: number,
      input: z.output<typeof wasteAreaPutSchema>,
    ): Promise<WasteArea[]> {
      await store.transaction(async (repos) => {
        await requireLocation(repos, locationId);
        const set =
          input.ruleSetId === null
            ? await repos.ruleSets.builtIn('waste-accumulation')
            : await requireRuleSet(repos, input.ruleSetId, 'waste-accumulation', 'ruleSetId');
        if (!set)
          throw AppError.conflict('There is no waste-accumulation rule set: add one first.');
        await repos.waste.setArea(locationId, set.id, nowIso());
      });
      return wasteAreas(store.repos);
    },

    async removeArea(locationId: number): Promise<void> {
      await store.transaction((repos) => repos.waste.deleteArea(locationId));
    },

    /** Records a pickup and marks every container picked up, in one transaction. */
    async pickup(
      input: z.output<typeof wastePickupCreateSchema>,
      actor: User,
    ): Promise<WastePickup> {
      const id = await store.transaction(async (repos) => {
        const ids = [...new Set(input.wasteContainerIds)];
        for (const [index, containerId] of ids.entries()) {
          const row = await repos.waste.findContainer(containerId);
          if (!row) {
            throw AppError.validation(`There is no waste container #${containerId}.`, {
              [`wasteContainerIds.${index}`]: `no waste container #${containerId}`,
            });
          }
          if (row.status === 'picked-up') {
            throw AppError.conflict(
              `${row.labelCode} was already picked up (pickup #${row.pickupId}).`,
              {
                [`wasteContainerIds.${index}`]: `${row.labelCode} was already picked up`,
              },
            );
          }
        }
        const now = nowIso();
        const pickupId = await repos.waste.insertPickup({
          pickedUpOn: input.pickedUpOn,
          contractor: input.contractor,
          manifestNumber: input.manifestNumber,
          notes: input.notes,
          recordedById: actor.id,
          createdAt: now,
        });
        await repos.waste.updateContainers(ids, { status: 'picked-up', pickupId, updatedAt: now });
        return pickupId;
      });
      return this.getPickup(id);
    },

    async pickups(): Promise<WastePickup[]> {
      const rows = await store.repos.waste.listPickups();
      const containers = await store.repos.waste.containersOfPickups(rows.map((r) => r.id));
      return rows.map((row) => presentPickup(row, containers));
    },

    async getPickup(id: number): Promise<WastePickup> {
      const row = await store.repos.waste.findPickup(id);
      if (!row) throw AppError.notFound(`There is no waste pickup #${id}.`);
      return presentPickup(row, await store.repos.waste.containersOfPickups([id]));
    },
  };
}
export type WasteService = ReturnType<typeof wasteService>;
