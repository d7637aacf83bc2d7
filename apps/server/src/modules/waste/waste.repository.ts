import type { WasteStatus } from '@lotwise/shared';
import type { EntityManager } from 'typeorm';
import { advisoryLocks, lockForWrite, takeTurn } from '../../db/postgres';
import {
  WasteAdditionChemicalEntity,
  WasteAdditionEntity,
  WasteAreaEntity,
  WasteContainerEntity,
  WastePickupEntity,
  type WasteAdditionRow,
  type WasteAreaRow,
  type WasteContainerRow,
  type WastePickupRow,
} from './waste.entity';

export type WasteContainerValues = Omit<WasteContainerRow, 'id' | 'location' | 'pickup'>;
export type WasteAdditionValues = Omit<
  WasteAdditionRow,
  'id' | 'wasteContainer' | 'run' | 'ledgerEntry' | 'addedBy'
>;
export type WastePickupValues = Omit<WastePickupRow, 'id' | 'recordedBy'>;

/** Data access for the waste tables; answers plain objects. */
export function wasteRepository(manager: EntityManager) {
  const containers = manager.getRepository(WasteContainerEntity);
  const additions = manager.getRepository(WasteAdditionEntity);
  const additionChemicals = manager.getRepository(WasteAdditionChemicalEntity);
  const pickups = manager.getRepository(WastePickupEntity);
  const areas = manager.getRepository(WasteAreaEntity);
  return {
    /** In a transaction on PostgreSQL the container stays locked until it ends. */
    async findContainer(id: number): Promise<WasteContainerRow | null> {
      return containers.findOne({ where: { id }, ...lockForWrite(manager) });
    },
    async findContainerByLabel(labelCode: string): Promise<WasteContainerRow | null> {
      return containers.findOne({ where: { labelCode } });
    },
    async containersByIds(ids: number[]): Promise<WasteContainerRow[]> {
      if (ids.length === 0) return [];
      return containers
        .createQueryBuilder('w')
        .where('w.id IN (:...ids)', { ids })
        .orderBy('w.id', 'ASC')
        .getMany();
    },
    async listContainers(filter: {
      status?: WasteStatus;
      statuses?: WasteStatus[];
      locationIds?: number[];
    }): Promise<WasteContainerRow[]> {
      const qb = containers.createQueryBuilder('w');
      if (filter.status) qb.andWhere('w.status = :status', { status: filter.status });
      if (filter.statuses) qb.andWhere('w.status IN (:...statuses)', { statuses: filter.statuses });
      if (filter.locationIds) {
        if (filter.locationIds.length === 0) return [];
        qb.andWhere('w.location_id IN (:...locationIds)', { locationIds: filter.locationIds });
      }
      return qb.orderBy('w.label_number', 'ASC').getMany();
    },
    /** Open and full waste containers anywhere under the places of `idPaths` (`/1/4/`). */
    async openInSubtrees(idPaths: string[]): Promise<(WasteContainerRow & { idPath: string })[]> {
      if (idPaths.length === 0) return [];
      const rows = await containers
        .createQueryBuilder('w')
        .innerJoin('locations', 'l', 'l.id = w.location_id')
        .addSelect('l.id_path', 'idPath')
        .where("w.status IN ('open', 'full')")
        .andWhere(
          `(${idPaths.map((_, i) => `l.id_path LIKE :p${i}`).join(' OR ')})`,
          Object.fromEntries(idPaths.map((p, i) => [`p${i}`, `${p}%`])),
        )
        .orderBy('w.label_number', 'ASC')
        .getRawAndEntities();
      return rows.entities.map((row, i) => ({
        ...row,
        idPath: String((rows.raw[i] as { idPath: string }).idPath),
      }));
    },
    async nextLabelNumber(): Promise<number> {
      await takeTurn(manager, advisoryLocks.labelNumbers);
      const row = await manager
        .createQueryBuilder()
        .select('MAX(w.label_number)', 'n')
        .from('waste_containers', 'w')
        .getRawOne<{ n: number | null }>();
      return Number(row?.n ?? 0) + 1;
    },
    async insertContainer(values: WasteContainerValues): Promise<number> {
      const result = await containers.insert(values);
      return Number(result.identifiers[0]?.id);
    },
    async updateContainer(id: number, changes: Partial<WasteContainerValues>): Promise<void> {
      await containers.update({ id }, changes);
    },
    async updateContainers(ids: number[], changes: Partial<WasteContainerValues>): Promise<void> {
      if (ids.length === 0) return;
      await containers
        .createQueryBuilder()
        .update()
        .set(changes)
        .where('id IN (:...ids)', { ids })
        .execute();
    },
    async insertAddition(values: WasteAdditionValues, chemicalIds: number[]): Promise<number> {
      const result = await additions.insert(values);
      const id = Number(result.identifiers[0]?.id);
      for (const chemicalId of new Set(chemicalIds)) {
        await additionChemicals.insert({ wasteAdditionId: id, chemicalId });
      }
      return id;
    },
    async additionsOf(containerIds: number[]): Promise<WasteAdditionRow[]> {
      if (containerIds.length === 0) return [];
      return additions
        .createQueryBuilder('a')
        .where('a.waste_container_id IN (:...containerIds)', { containerIds })
        .orderBy('a.added_at', 'ASC')
        .addOrderBy('a.id', 'ASC')
        .getMany();
    },
    async additionsOfRun(runId: number): Promise<WasteAdditionRow[]> {
      return additions.find({ where: { runId }, order: { id: 'ASC' } });
    },
    /** Chemical ids of each addition. */
    async chemicalsOfAdditions(
      additionIds: number[],
    ): Promise<{ wasteAdditionId: number; chemicalId: number }[]> {
      if (additionIds.length === 0) return [];
      return additionChemicals
        .createQueryBuilder('c')
        .where('c.waste_addition_id IN (:...additionIds)', { additionIds })
        .orderBy('c.id', 'ASC')
        .getMany();
    },
    async insertPickup(values: WastePickupValues): Promise<number> {
      const result = await pickups.insert(values);
      return Number(result.identifiers[0]?.id);
    },
    async findPickup(id: number): Promise<WastePickupRow | null> {
      return pickups.findOne({ where: { id } });
    },
    async listPickups(): Promise<WastePickupRow[]> {
      return pickups.find({ order: { pickedUpOn: 'DESC', id: 'DESC' } });
    },
    async containersOfPickups(pickupIds: number[]): Promise<WasteContainerRow[]> {
      if (pickupIds.length === 0) return [];
      return containers
        .createQueryBuilder('w')
        .where('w.pickup_id IN (:...pickupIds)', { pickupIds })
        .orderBy('w.label_number', 'ASC')
        .getMany();
    },
    async listAreas(): Promise<WasteAreaRow[]> {
      return areas.find({ order: { id: 'ASC' } });
    },
    async findArea(locationId: number): Promise<WasteAreaRow | null> {
      return areas.findOne({ where: { locationId } });
    },
    async setArea(locationId: number, ruleSetId: number, now: string): Promise<void> {
      const found = await areas.findOne({ where: { locationId }, ...lockForWrite(manager) });
      if (found) await areas.update({ id: found.id }, { ruleSetId });
      else await areas.insert({ locationId, ruleSetId, createdAt: now });
    },
    async deleteArea(locationId: number): Promise<void> {
      await areas.delete({ locationId });
    },
  };
}
export type WasteRepository = ReturnType<typeof wasteRepository>;
