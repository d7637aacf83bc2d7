import type {
  ContainerMaterial,
  FlammableStorageKind,
  GhsCode,
  PhysicalState,
  StockUnit,
} from '@lotwise/shared';
import type { EntityManager } from 'typeorm';
import { fromMicro } from '../../db/quantities';
import { LabAreaEntity, type LabAreaRow } from './lab-area.entity';

export type LabAreaValues = Omit<
  LabAreaRow,
  'id' | 'location' | 'flammableRuleSet' | 'containerSizeRuleSet'
>;

/** An area with its place. */
export interface LabAreaPlaced extends LabAreaRow {
  name: string;
  path: string;
  idPath: string;
}

/** A place flagged as approved flammable storage. */
export interface StoragePlace {
  id: number;
  path: string;
  idPath: string;
  flammableStorage: FlammableStorageKind;
}

/** A liquid container inside some area, as the totals need it. */
export interface AreaContainer {
  id: number;
  labelCode: string;
  quantity: number;
  unit: StockUnit;
  capacity: number | null;
  capacityUnit: string | null;
  material: ContainerMaterial | null;
  locationId: number;
  locationPath: string;
  locationIdPath: string;
  chemicalId: number;
  chemicalName: string;
  physicalState: PhysicalState;
  density: number | null;
  ghsPictograms: GhsCode[];
  hazardStatements: string[];
  flashPointC: number | null;
  boilingPointC: number | null;
}

const parseList = (value: unknown): string[] =>
  Array.isArray(value) ? value : typeof value === 'string' && value ? JSON.parse(value) : [];
const num = (value: unknown): number | null =>
  value === null || value === undefined ? null : Number(value);

/** Data access for `lab_areas` and what the totals read; answers plain objects. */
export function labAreasRepository(manager: EntityManager) {
  const repo = manager.getRepository(LabAreaEntity);

  function placed() {
    return repo
      .createQueryBuilder('a')
      .innerJoin('locations', 'l', 'l.id = a.location_id')
      .addSelect(['l.name AS l_name', 'l.path AS l_path', 'l.id_path AS l_id_path']);
  }
  function fromRaw(result: { entities: LabAreaRow[]; raw: Record<string, unknown>[] }) {
    return result.entities.map((row, i): LabAreaPlaced => {
      const raw = result.raw[i]!;
      return {
        ...row,
        instructional: Boolean(row.instructional),
        name: String(raw.l_name),
        path: String(raw.l_path),
        idPath: String(raw.l_id_path),
      };
    });
  }

  return {
    /** Every area (or the ones of `ids`), by path: one statement. */
    async list(ids?: number[]): Promise<LabAreaPlaced[]> {
      const qb = placed();
      if (ids) {
        if (ids.length === 0) return [];
        qb.where('a.id IN (:...ids)', { ids });
      }
      return fromRaw(
        await qb.orderBy('l.path', 'ASC').addOrderBy('a.id', 'ASC').getRawAndEntities(),
      );
    },
    async findRow(id: number): Promise<LabAreaRow | null> {
      return repo.findOneBy({ id });
    },
    async findByLocation(locationId: number): Promise<LabAreaRow | null> {
      return repo.findOneBy({ locationId });
    },
    /**
     * Areas whose place is `idPath`'s place, above it or below it (one statement): the areas
     * a container there counts toward, and the ones that stop a place being marked.
     */
    async related(idPath: string): Promise<LabAreaPlaced[]> {
      const prefixes = idPath
        .split('/')
        .filter(Boolean)
        .map((_, i, parts) => `/${parts.slice(0, i + 1).join('/')}/`);
      return fromRaw(
        await placed()
          .where('(l.id_path IN (:...prefixes) OR l.id_path LIKE :below)', {
            prefixes,
            below: `${idPath}%`,
          })
          .orderBy('l.depth', 'ASC')
          .getRawAndEntities(),
      );
    },
    /** Places flagged as approved storage, inside any of the given places (one statement). */
    async storagePlaces(idPaths: string[]): Promise<StoragePlace[]> {
      if (idPaths.length === 0) return [];
      const qb = manager
        .createQueryBuilder()
        .select(['l.id AS id', 'l.path AS path', 'l.id_path AS "idPath"'])
        .addSelect('l.flammable_storage', 'flammableStorage')
        .from('locations', 'l')
        .where('l.flammable_storage IS NOT NULL');
      qb.andWhere(
        `(${idPaths.map((_, i) => `l.id_path LIKE :p${i}`).join(' OR ')})`,
        Object.fromEntries(idPaths.map((p, i) => [`p${i}`, `${p}%`])),
      );
      const rows: StoragePlace[] = await qb.orderBy('l.path', 'ASC').getRawMany();
      return rows.map((r) => ({ ...r, id: Number(r.id) }));
    },
    /**
     * Containers not disposed, of liquids and solutions, in any of the given places or below
     * them (one statement, whatever their number).
     */
    async liquidContainers(idPaths: string[]): Promise<AreaContainer[]> {
      if (idPaths.length === 0) return [];
      const rows: Record<string, unknown>[] = await manager
        .createQueryBuilder()
        .select([
          'c.id AS id',
          'c.label_code AS "labelCode"',
          'c.quantity_micro AS "quantityMicro"',
          'c.unit AS unit',
          'c.capacity AS capacity',
          'c.capacity_unit AS "capacityUnit"',
          'c.material AS material',
          'c.location_id AS "locationId"',
          'l.path AS "locationPath"',
          'l.id_path AS "locationIdPath"',
          'ch.id AS "chemicalId"',
          'ch.name AS "chemicalName"',
          'ch.physical_state AS "physicalState"',
          'ch.density AS density',
          'ch.ghs_pictograms AS "ghsPictograms"',
          'ch.hazard_statements AS "hazardStatements"',
          'ch.flash_point_c AS "flashPointC"',
          'ch.boiling_point_c AS "boilingPointC"',
        ])
        .from('containers', 'c')
        .innerJoin('locations', 'l', 'l.id = c.location_id')
        .innerJoin('chemicals', 'ch', 'ch.id = c.chemical_id')
        .where("c.status <> 'disposed'")
        .andWhere("ch.physical_state IN ('liquid', 'solution')")
        .andWhere(
          `(${idPaths.map((_, i) => `l.id_path LIKE :p${i}`).join(' OR ')})`,
          Object.fromEntries(idPaths.map((p, i) => [`p${i}`, `${p}%`])),
        )
        .orderBy('l.path', 'ASC')
        .addOrderBy('c.label_code', 'ASC')
        .getRawMany();
      return rows.map((r) => ({
        id: Number(r.id),
        labelCode: String(r.labelCode),
        quantity: fromMicro(Number(r.quantityMicro)),
        unit: r.unit as StockUnit,
        capacity: num(r.capacity),
        capacityUnit: (r.capacityUnit as string | null) ?? null,
        material: (r.material as ContainerMaterial | null) ?? null,
        locationId: Number(r.locationId),
        locationPath: String(r.locationPath),
        locationIdPath: String(r.locationIdPath),
        chemicalId: Number(r.chemicalId),
        chemicalName: String(r.chemicalName),
        physicalState: r.physicalState as PhysicalState,
        density: num(r.density),
        ghsPictograms: parseList(r.ghsPictograms) as GhsCode[],
        hazardStatements: parseList(r.hazardStatements),
        flashPointC: num(r.flashPointC),
        boilingPointC: num(r.boilingPointC),
      }));
    },
    async insert(values: LabAreaValues): Promise<number> {
      const result = await repo.insert(values);
      return Number(result.identifiers[0]?.id);
    },
    async update(id: number, changes: Partial<LabAreaValues>): Promise<void> {
      await repo.update({ id }, changes);
    },
    async delete(id: number): Promise<void> {
      await repo.delete({ id });
    },
  };
}
export type LabAreasRepository = ReturnType<typeof labAreasRepository>;
