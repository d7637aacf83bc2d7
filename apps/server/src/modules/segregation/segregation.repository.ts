import type { StorageGroup } from '@lotwise/shared';
import type { EntityManager } from 'typeorm';

/** A container that is physically somewhere (not disposed), with its chemical's groups. */
export interface PlacedContainer {
  id: number;
  labelCode: string;
  locationId: number;
  chemicalId: number;
  chemicalName: string;
  storageGroup: StorageGroup;
  extraHazardGroups: StorageGroup[];
}

interface RawPlaced {
  id: number;
  labelCode: string;
  locationId: number;
  chemicalId: number;
  chemicalName: string;
  storageGroup: StorageGroup;
  extraHazardGroups: string | null;
}

function toPlaced(row: RawPlaced): PlacedContainer {
  return {
    id: Number(row.id),
    labelCode: row.labelCode,
    locationId: Number(row.locationId),
    chemicalId: Number(row.chemicalId),
    chemicalName: row.chemicalName,
    storageGroup: row.storageGroup,
    extraHazardGroups: row.extraHazardGroups
      ? (JSON.parse(row.extraHazardGroups) as StorageGroup[])
      : [],
  };
}

/** Reads for segregation checks; answers plain objects. */
export function segregationRepository(manager: EntityManager) {
  const placed = () =>
    manager
      .createQueryBuilder()
      .select('c.id', 'id')
      .addSelect('c.label_code', 'labelCode')
      .addSelect('c.location_id', 'locationId')
      .addSelect('c.chemical_id', 'chemicalId')
      .addSelect('ch.name', 'chemicalName')
      .addSelect('ch.storage_group', 'storageGroup')
      .addSelect('ch.extra_hazard_groups', 'extraHazardGroups')
      .from('containers', 'c')
      .innerJoin('chemicals', 'ch', 'ch.id = c.chemical_id')
      .where("c.status <> 'disposed'");

  return {
    /**
     * The chemicals (with their groups) that have a container at one place: one row per
     * chemical, read from the place's index, so a shelf of hundreds of bottles answers in a
     * few hundred index entries instead of every container row sorted by label.
     */
    async chemicalsAt(locationId: number): Promise<
      { chemicalId: number; storageGroup: StorageGroup; extraHazardGroups: StorageGroup[] }[]
    > {
      const rows = await manager
        .createQueryBuilder()
        .select('ch.id', 'chemicalId')
        .addSelect('ch.storage_group', 'storageGroup')
        .addSelect('ch.extra_hazard_groups', 'extraHazardGroups')
        .from('chemicals', 'ch')
        .where(
          "ch.id IN (SELECT c.chemical_id FROM containers c WHERE c.location_id = :locationId AND c.status <> 'disposed')",
          { locationId },
        )
        .getRawMany<{
          chemicalId: number;
          storageGroup: StorageGroup;
          extraHazardGroups: string | null;
        }>();
      return rows.map((row) => ({
        chemicalId: Number(row.chemicalId),
        storageGroup: row.storageGroup,
        extraHazardGroups: row.extraHazardGroups
          ? (JSON.parse(row.extraHazardGroups) as StorageGroup[])
          : [],
      }));
    },
    /** The containers of `chemicalIds` at one place (not disposed), by label code. */
    async placedOf(locationId: number, chemicalIds: number[]): Promise<PlacedContainer[]> {
      if (chemicalIds.length === 0) return [];
      const rows = await placed()
        .andWhere('c.location_id = :locationId', { locationId })
        .andWhere('c.chemical_id IN (:...chemicalIds)', { chemicalIds })
        .orderBy('c.label_code', 'ASC')
        .getRawMany<RawPlaced>();
      return rows.map(toPlaced);
    },
    async placedAt(locationIds: number[]): Promise<PlacedContainer[]> {
      if (locationIds.length === 0) return [];
      const rows = await placed()
        .andWhere('c.location_id IN (:...locationIds)', { locationIds })
        .orderBy('c.label_code', 'ASC')
        .getRawMany<RawPlaced>();
      return rows.map(toPlaced);
    },
    /** One row per chemical per place: the input of the conflicts list, small even at 100,000 containers. */
    async chemicalsByLocation(): Promise<
      {
        locationId: number;
        chemicalId: number;
        storageGroup: StorageGroup;
        extraHazardGroups: StorageGroup[];
      }[]
    > {
      const rows = await manager
        .createQueryBuilder()
        .select('c.location_id', 'locationId')
        .addSelect('c.chemical_id', 'chemicalId')
        .addSelect('MIN(ch.storage_group)', 'storageGroup')
        .addSelect('MIN(ch.extra_hazard_groups)', 'extraHazardGroups')
        .from('containers', 'c')
        .innerJoin('chemicals', 'ch', 'ch.id = c.chemical_id')
        .where("c.status <> 'disposed'")
        .groupBy('c.location_id')
        .addGroupBy('c.chemical_id')
        .getRawMany<{
          locationId: number;
          chemicalId: number;
          storageGroup: StorageGroup;
          extraHazardGroups: string | null;
        }>();
      return rows.map((row) => ({
        locationId: Number(row.locationId),
        chemicalId: Number(row.chemicalId),
        storageGroup: row.storageGroup,
        extraHazardGroups: row.extraHazardGroups
          ? (JSON.parse(row.extraHazardGroups) as StorageGroup[])
          : [],
      }));
    },
  };
}
export type SegregationRepository = ReturnType<typeof segregationRepository>;
