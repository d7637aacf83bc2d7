import {
  locationPathSeparator,
  parseSort,
  type Location,
  type LocationListQuery,
} from '@lotwise/shared';
import type { EntityManager } from 'typeorm';
import { containsPattern } from '../../db/sql';
import { LocationEntity, type LocationRow } from './location.entity';

export type LocationValues = Omit<LocationRow, 'id' | 'parent'>;

const sortColumns: Record<string, string> = {
  path: 'LOWER(l.path)',
  name: 'LOWER(l.name)',
  updatedAt: 'l.updatedAt',
};

/** Data access for `locations`; answers plain objects. */
export function locationsRepository(manager: EntityManager) {
  const repo = manager.getRepository(LocationEntity);

  async function counts(ids: number[]) {
    if (ids.length === 0)
      return { containers: new Map<number, number>(), children: new Map<number, number>() };
    const containerRows: { id: number; n: number }[] = await manager
      .createQueryBuilder()
      .select('c.location_id', 'id')
      .addSelect('COUNT(*)', 'n')
      .from('containers', 'c')
      .where('c.location_id IN (:...ids)', { ids })
      .andWhere("c.status <> 'disposed'")
      .groupBy('c.location_id')
      .getRawMany();
    const childRows: { id: number; n: number }[] = await manager
      .createQueryBuilder()
      .select('l.parent_id', 'id')
      .addSelect('COUNT(*)', 'n')
      .from('locations', 'l')
      .where('l.parent_id IN (:...ids)', { ids })
      .groupBy('l.parent_id')
      .getRawMany();
    return {
      containers: new Map(containerRows.map((r) => [Number(r.id), Number(r.n)])),
      children: new Map(childRows.map((r) => [Number(r.id), Number(r.n)])),
    };
  }

  async function present(rows: LocationRow[]): Promise<Location[]> {
    const { containers, children } = await counts(rows.map((r) => r.id));
    return rows.map(({ idPath: _idPath, parent: _parent, ...row }) => ({
      ...row,
      flammableStorage: row.flammableStorage ?? null,
      containerCount: containers.get(row.id) ?? 0,
      childCount: children.get(row.id) ?? 0,
    }));
  }

  return {
    async findRow(id: number): Promise<LocationRow | null> {
      return repo.findOneBy({ id });
    },
    async findById(id: number): Promise<Location | null> {
      const row = await repo.findOneBy({ id });
      return row ? ((await present([row]))[0] ?? null) : null;
    },
    async rowsByIds(ids: number[]): Promise<LocationRow[]> {
      if (ids.length === 0) return [];
      return repo.createQueryBuilder('l').where('l.id IN (:...ids)', { ids }).getMany();
    },
    async children(parentId: number): Promise<Location[]> {
      const rows = await repo.find({ where: { parentId }, order: { name: 'ASC' } });
      return present(rows);
    },
    /** Every place below `row` (not `row` itself), shallowest first. */
    async descendants(row: LocationRow): Promise<LocationRow[]> {
      return repo
        .createQueryBuilder('l')
        .where("l.idPath LIKE :prefix ESCAPE '\\'", { prefix: `${row.idPath}%` })
        .andWhere('l.id <> :id', { id: row.id })
        .orderBy('l.depth', 'ASC')
        .getMany();
    },
    async siblingNamed(parentId: number | null, name: string): Promise<LocationRow | null> {
      const qb = repo.createQueryBuilder('l').where('LOWER(l.name) = :name', {
        name: name.toLowerCase(),
      });
      if (parentId === null) qb.andWhere('l.parentId IS NULL');
      else qb.andWhere('l.parentId = :parentId', { parentId });
      return qb.getOne();
    },
    async insert(
      values: Omit<LocationValues, 'path' | 'idPath' | 'depth'>,
      parent: LocationRow | null,
    ) {
      const result = await repo.insert({
        ...values,
        path: parent ? `${parent.path}${locationPathSeparator}${values.name}` : values.name,
        idPath: 'pending',
        depth: parent ? parent.depth + 1 : 0,
      });
      const id = Number(result.identifiers[0]?.id);
      await repo.update({ id }, { idPath: `${parent ? parent.idPath : '/'}${id}/` });
      return (await repo.findOneBy({ id })) as LocationRow;
    },
    async update(id: number, changes: Partial<LocationValues>) {
      await repo.update({ id }, changes);
    },
    async delete(id: number): Promise<void> {
      await repo.delete({ id });
    },
    /** Containers of any status (disposed included: their ledger keeps the place). */
    async containerCount(id: number, activeOnly: boolean): Promise<number> {
      const qb = manager
        .createQueryBuilder()
        .select('COUNT(*)', 'n')
        .from('containers', 'c')
        .where('c.location_id = :id', { id });
      if (activeOnly) qb.andWhere("c.status <> 'disposed'");
      return Number((await qb.getRawOne<{ n: number }>())?.n ?? 0);
    },
    async subtreeContainerCount(row: LocationRow): Promise<number> {
      const result = await manager
        .createQueryBuilder()
        .select('COUNT(*)', 'n')
        .from('containers', 'c')
        .innerJoin('locations', 'l', 'l.id = c.location_id')
        .where("l.id_path LIKE :prefix ESCAPE '\\'", { prefix: `${row.idPath}%` })
        .andWhere("c.status <> 'disposed'")
        .getRawOne<{ n: number }>();
      return Number(result?.n ?? 0);
    },
    async list(query: LocationListQuery): Promise<{ items: Location[]; total: number }> {
      const qb = repo.createQueryBuilder('l');
      if (query.q) {
        qb.andWhere("LOWER(l.path) LIKE :q ESCAPE '\\'", {
          q: containsPattern(query.q.toLowerCase()),
        });
      }
      if (query.parentId === 0) qb.andWhere('l.parentId IS NULL');
      else if (query.parentId) qb.andWhere('l.parentId = :parentId', { parentId: query.parentId });
      if (query.storageGroup) {
        qb.andWhere('l.storageGroups LIKE :group', { group: `%"${query.storageGroup}"%` });
      }
      const total = await qb.getCount();
      const { field, direction } = parseSort(query.sort);
      const rows = await qb
        .orderBy(sortColumns[field] ?? sortColumns.path!, direction === 'desc' ? 'DESC' : 'ASC')
        .addOrderBy('l.id', 'ASC')
        .offset((query.page - 1) * query.pageSize)
        .limit(query.pageSize)
        .getMany();
      return { items: await present(rows), total };
    },
  };
}
export type LocationsRepository = ReturnType<typeof locationsRepository>;
