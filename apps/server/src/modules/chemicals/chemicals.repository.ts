import {
  fireClassOf,
  parseSort,
  type Chemical,
  type ChemicalListQuery,
  type StoredFile,
} from '@lotwise/shared';
import { type EntityManager, In } from 'typeorm';
import { AppError } from '../../lib/app-error';
import { containsPattern, isUniqueViolation } from '../../db/sql';
import { ChemicalEntity, type ChemicalRow } from './chemical.entity';

const sortColumns: Record<string, string> = {
  name: 'LOWER(c.name)',
  casNumber: 'c.casNumber',
  formula: 'c.formula',
  molarMass: 'c.molarMass',
  storageGroup: 'c.storageGroup',
  updatedAt: 'c.updatedAt',
};

export type ChemicalValues = Omit<ChemicalRow, 'id'>;

function toChemical({
  searchText: _searchText,
  extraHazardGroups,
  sdsFileName,
  sdsStoredName: _sdsStoredName,
  sdsSize,
  sdsContentType,
  sdsUploadedAt,
  ...chemical
}: ChemicalRow): Chemical {
  return {
    ...chemical,
    ...fireClassOf(chemical),
    extraHazardGroups: extraHazardGroups ?? [],
    sds: sdsOf({ sdsFileName, sdsSize, sdsContentType, sdsUploadedAt }),
  };
}

/** The chemical's uploaded SDS as the API shows it; null when none was uploaded. */
export function sdsOf(
  row: Pick<ChemicalRow, 'sdsFileName' | 'sdsSize' | 'sdsContentType' | 'sdsUploadedAt'>,
): StoredFile | null {
  return row.sdsFileName && row.sdsUploadedAt
    ? {
        fileName: row.sdsFileName,
        size: Number(row.sdsSize ?? 0),
        contentType: row.sdsContentType ?? 'application/pdf',
        uploadedAt: row.sdsUploadedAt,
      }
    : null;
}

function duplicateCas(): AppError {
  return AppError.conflict('Another chemical already has this CAS RN.', {
    casNumber: 'is already used by another chemical',
  });
}

/** Data access for `chemicals`; answers plain `Chemical` objects. */
export function chemicalsRepository(manager: EntityManager) {
  const repo = manager.getRepository(ChemicalEntity);

  return {
    async findById(id: number): Promise<Chemical | null> {
      const row = await repo.findOneBy({ id });
      return row ? toChemical(row) : null;
    },
    /** The row as stored (with its search key), for services that need every column. */
    async findRow(id: number): Promise<ChemicalRow | null> {
      return repo.findOneBy({ id });
    },
    /** The stored rows of `ids` (those that exist), in one statement. */
    async findRows(ids: number[]): Promise<ChemicalRow[]> {
      if (ids.length === 0) return [];
      return repo.findBy({ id: In([...new Set(ids)]) });
    },
    async findByCasNumber(casNumber: string): Promise<Chemical | null> {
      const row = await repo.findOneBy({ casNumber });
      return row ? toChemical(row) : null;
    },
    async insert(values: ChemicalValues): Promise<Chemical> {
      try {
        const result = await repo.insert(values);
        return (await this.findById(Number(result.identifiers[0]?.id))) as Chemical;
      } catch (error) {
        if (isUniqueViolation(error)) throw duplicateCas();
        throw error;
      }
    },
    async update(id: number, changes: Partial<ChemicalValues>): Promise<Chemical> {
      try {
        await repo.update({ id }, changes);
      } catch (error) {
        if (isUniqueViolation(error)) throw duplicateCas();
        throw error;
      }
      return (await this.findById(id)) as Chemical;
    },
    async delete(id: number): Promise<boolean> {
      const result = await repo.delete({ id });
      return (result.affected ?? 0) > 0;
    },
    async list(query: ChemicalListQuery): Promise<{ items: Chemical[]; total: number }> {
      const qb = repo.createQueryBuilder('c');
      if (query.q) {
        qb.andWhere("c.searchText LIKE :q ESCAPE '\\'", {
          q: containsPattern(query.q.toLowerCase()),
        });
      }
      if (query.storageGroup)
        qb.andWhere('c.storageGroup = :storageGroup', { storageGroup: query.storageGroup });
      if (query.physicalState)
        qb.andWhere('c.physicalState = :physicalState', { physicalState: query.physicalState });
      // Lists are JSON text; a quoted code cannot match part of another code.
      if (query.pictogram) {
        qb.andWhere('c.ghsPictograms LIKE :pictogram', { pictogram: `%"${query.pictogram}"%` });
      }
      const total = await qb.getCount();
      const { field, direction } = parseSort(query.sort);
      const column = sortColumns[field] ?? sortColumns.name!;
      const rows = await qb
        // Empty values last in both directions, the same on SQLite and PostgreSQL; an index
        // on the column serves NULLS LAST.
        .addOrderBy(column, direction === 'desc' ? 'DESC' : 'ASC', 'NULLS LAST')
        .addOrderBy('c.id', 'ASC')
        .offset((query.page - 1) * query.pageSize)
        .limit(query.pageSize)
        .getMany();
      return { items: rows.map(toChemical), total };
    },
  };
}
export type ChemicalsRepository = ReturnType<typeof chemicalsRepository>;
