import { parseSort, type ProcedureListQuery } from '@lotwise/shared';
import type { EntityManager } from 'typeorm';
import { containsPattern } from '../../db/sql';
import { ProcedureLineEntity, type ProcedureLineRow } from './procedure-line.entity';
import { ProcedureEntity, type ProcedureRow } from './procedure.entity';

export type ProcedureValues = Omit<ProcedureRow, 'id' | 'createdBy'>;
export type ProcedureLineValues = Omit<
  ProcedureLineRow,
  'id' | 'procedure' | 'chemical' | 'dissolvedInChemical'
>;

const sortColumns: Record<string, string> = {
  title: 'LOWER(p.title)',
  updatedAt: 'p.updated_at',
};

/** Data access for `procedures` and `procedure_lines`; answers plain objects. */
export function proceduresRepository(manager: EntityManager) {
  const repo = manager.getRepository(ProcedureEntity);
  const lines = manager.getRepository(ProcedureLineEntity);
  return {
    async findRow(id: number): Promise<ProcedureRow | null> {
      return repo.findOneBy({ id });
    },
    async rowsByIds(ids: number[]): Promise<ProcedureRow[]> {
      if (ids.length === 0) return [];
      return repo.createQueryBuilder('p').where('p.id IN (:...ids)', { ids }).getMany();
    },
    async insert(values: ProcedureValues): Promise<number> {
      const result = await repo.insert(values);
      return Number(result.identifiers[0]?.id);
    },
    async update(id: number, changes: Partial<ProcedureValues>): Promise<void> {
      await repo.update({ id }, changes);
    },
    async delete(id: number): Promise<void> {
      await lines.delete({ procedureId: id });
      await repo.delete({ id });
    },
    /** The lines of a procedure in order. */
    async lines(procedureId: number): Promise<ProcedureLineRow[]> {
      return lines.find({ where: { procedureId }, order: { position: 'ASC' } });
    },
    async linesFor(procedureIds: number[]): Promise<ProcedureLineRow[]> {
      if (procedureIds.length === 0) return [];
      return lines
        .createQueryBuilder('l')
        .where('l.procedure_id IN (:...procedureIds)', { procedureIds })
        .orderBy('l.procedure_id', 'ASC')
        .addOrderBy('l.position', 'ASC')
        .getMany();
    },
    async replaceLines(procedureId: number, values: ProcedureLineValues[]): Promise<void> {
      await lines.delete({ procedureId });
      for (const line of values) await lines.insert(line);
    },
    /** Per chemical of `chemicalIds`, ids of procedures with a product line of it (one statement). */
    async producingAny(chemicalIds: number[]): Promise<Map<number, number[]>> {
      const producing = new Map<number, number[]>();
      if (chemicalIds.length === 0) return producing;
      const rows = await lines
        .createQueryBuilder('l')
        .select('l.chemical_id', 'chemicalId')
        .addSelect('l.procedure_id', 'id')
        .where("l.chemical_id IN (:...chemicalIds) AND l.role = 'product'", {
          chemicalIds: [...new Set(chemicalIds)],
        })
        .groupBy('l.chemical_id')
        .addGroupBy('l.procedure_id')
        .orderBy('l.procedure_id', 'ASC')
        .getRawMany<{ chemicalId: number; id: number }>();
      for (const row of rows) {
        const list = producing.get(Number(row.chemicalId)) ?? [];
        list.push(Number(row.id));
        producing.set(Number(row.chemicalId), list);
      }
      return producing;
    },
    /** Procedures listing the chemical on a line (or as a solvent to dissolve in). */
    async using(chemicalId: number): Promise<{ procedureId: number; role: string }[]> {
      const rows = await lines
        .createQueryBuilder('l')
        .select('l.procedure_id', 'procedureId')
        .addSelect("CASE WHEN l.chemical_id = :chemicalId THEN l.role ELSE 'solvent' END", 'role')
        .where('(l.chemical_id = :chemicalId OR l.dissolved_in_chemical_id = :chemicalId)', {
          chemicalId,
        })
        .orderBy('l.procedure_id', 'ASC')
        .addOrderBy('l.position', 'ASC')
        .getRawMany<{ procedureId: number; role: string }>();
      return rows.map((row) => ({ procedureId: Number(row.procedureId), role: row.role }));
    },
    async list(query: ProcedureListQuery): Promise<{ rows: ProcedureRow[]; total: number }> {
      const qb = repo.createQueryBuilder('p');
      if (query.q) {
        qb.andWhere("LOWER(p.title) LIKE :q ESCAPE '\\'", {
          q: containsPattern(query.q.toLowerCase()),
        });
      }
      if (query.chemicalId) {
        qb.andWhere(
          'p.id IN (SELECT ul.procedure_id FROM procedure_lines ul WHERE ul.chemical_id = :chemicalId OR ul.dissolved_in_chemical_id = :chemicalId)',
          { chemicalId: query.chemicalId },
        );
      }
      if (query.producesChemicalId) {
        qb.andWhere(
          "p.id IN (SELECT pl.procedure_id FROM procedure_lines pl WHERE pl.chemical_id = :producesChemicalId AND pl.role = 'product')",
          { producesChemicalId: query.producesChemicalId },
        );
      }
      const total = await qb.getCount();
      const { field, direction } = parseSort(query.sort);
      const rows = await qb
        .orderBy(sortColumns[field] ?? sortColumns.title!, direction === 'desc' ? 'DESC' : 'ASC')
        .addOrderBy('p.id', 'ASC')
        .skip((query.page - 1) * query.pageSize)
        .take(query.pageSize)
        .getMany();
      return { rows, total };
    },
    async runCounts(procedureIds: number[]): Promise<Map<number, number>> {
      const counts = new Map<number, number>();
      if (procedureIds.length === 0) return counts;
      const rows = await manager
        .createQueryBuilder()
        .select('r.procedure_id', 'procedureId')
        .addSelect('COUNT(*)', 'n')
        .from('runs', 'r')
        .where("r.procedure_id IN (:...procedureIds) AND r.status = 'recorded'", { procedureIds })
        .groupBy('r.procedure_id')
        .getRawMany<{ procedureId: number; n: number }>();
      for (const row of rows) counts.set(Number(row.procedureId), Number(row.n));
      return counts;
    },
    async planOrRunCount(procedureId: number): Promise<number> {
      const row = await manager
        .createQueryBuilder()
        .select(
          '(SELECT COUNT(*) FROM runs r WHERE r.procedure_id = :procedureId) + (SELECT COUNT(*) FROM prep_plans pp WHERE pp.procedure_id = :procedureId)',
          'n',
        )
        .from('procedures', 'p')
        .where('p.id = :procedureId', { procedureId })
        .getRawOne<{ n: number }>();
      return Number(row?.n ?? 0);
    },
  };
}
export type ProceduresRepository = ReturnType<typeof proceduresRepository>;
