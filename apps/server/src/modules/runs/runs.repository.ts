import { parseSort, type RunListQuery } from '@lotwise/shared';
import type { EntityManager } from 'typeorm';
import { lockForWrite } from '../../db/postgres';
import { RunInputEntity, type RunInputRow } from './run-input.entity';
import { RunProductEntity, type RunProductRow } from './run-product.entity';
import { RunEntity, type RunRow } from './run.entity';

export type RunValues = Omit<RunRow, 'id' | 'procedure' | 'plan' | 'performedBy'>;
export type RunInputValues = Omit<
  RunInputRow,
  'id' | 'run' | 'container' | 'lot' | 'chemical' | 'ledgerEntry'
>;
export type RunProductValues = Omit<RunProductRow, 'id' | 'run' | 'lot' | 'container' | 'chemical'>;

const sortColumns: Record<string, string> = {
  performedOn: 'r.performed_on',
  createdAt: 'r.created_at',
  percentYield: 'r.percent_yield',
};

/** Data access for `runs`, `run_inputs` and `run_products`; answers plain objects. */
export function runsRepository(manager: EntityManager) {
  const repo = manager.getRepository(RunEntity);
  const inputs = manager.getRepository(RunInputEntity);
  const products = manager.getRepository(RunProductEntity);
  return {
    /** In a transaction on PostgreSQL the run stays locked until it ends (recorded once). */
    async findRow(id: number): Promise<RunRow | null> {
      return repo.findOne({ where: { id }, ...lockForWrite(manager) });
    },
    async rowsByIds(ids: number[]): Promise<RunRow[]> {
      if (ids.length === 0) return [];
      return repo.createQueryBuilder('r').where('r.id IN (:...ids)', { ids }).getMany();
    },
    async insert(values: RunValues): Promise<number> {
      const result = await repo.insert(values);
      return Number(result.identifiers[0]?.id);
    },
    async update(id: number, changes: Partial<RunValues>): Promise<void> {
      await repo.update({ id }, changes);
    },
    /** Only an opened run is deleted: nothing refers to it yet. */
    async delete(id: number): Promise<void> {
      await repo.delete({ id });
    },
    async list(query: RunListQuery): Promise<{ rows: RunRow[]; total: number }> {
      const qb = repo.createQueryBuilder('r');
      if (query.procedureId) {
        qb.andWhere('r.procedure_id = :procedureId', { procedureId: query.procedureId });
      }
      if (query.status) qb.andWhere('r.status = :status', { status: query.status });
      if (query.q) {
        qb.andWhere(
          "r.procedure_id IN (SELECT qp.id FROM procedures qp WHERE LOWER(qp.title) LIKE :q ESCAPE '\\')",
          { q: `%${query.q.toLowerCase().replace(/[\\%_]/g, (c) => `\\${c}`)}%` },
        );
      }
      const total = await qb.getCount();
      const { field, direction } = parseSort(query.sort);
      const column = sortColumns[field] ?? sortColumns.createdAt!;
      const rows = await qb
        // Empty values last in both directions; an index on the column serves NULLS LAST.
        .orderBy(column, direction === 'desc' ? 'DESC' : 'ASC', 'NULLS LAST')
        .addOrderBy('r.id', direction === 'desc' ? 'DESC' : 'ASC')
        .skip((query.page - 1) * query.pageSize)
        .take(query.pageSize)
        .getMany();
      return { rows, total };
    },
    /** Recorded runs of a procedure, oldest first. */
    async recordedOf(procedureId: number): Promise<RunRow[]> {
      return repo
        .createQueryBuilder('r')
        .where("r.procedure_id = :procedureId AND r.status = 'recorded'", { procedureId })
        .orderBy('r.performed_on', 'ASC')
        .addOrderBy('r.id', 'ASC')
        .getMany();
    },
    async insertInput(values: RunInputValues): Promise<number> {
      const result = await inputs.insert(values);
      return Number(result.identifiers[0]?.id);
    },
    async insertProduct(values: RunProductValues): Promise<number> {
      const result = await products.insert(values);
      return Number(result.identifiers[0]?.id);
    },
    async inputsOf(runId: number): Promise<RunInputRow[]> {
      return inputs.find({ where: { runId }, order: { id: 'ASC' } });
    },
    async productsOf(runId: number): Promise<RunProductRow[]> {
      return products.find({ where: { runId }, order: { id: 'ASC' } });
    },
    async inputsOfChemical(chemicalId: number): Promise<RunInputRow[]> {
      return inputs.find({ where: { chemicalId }, order: { id: 'ASC' } });
    },
    async productsOfChemical(chemicalId: number): Promise<RunProductRow[]> {
      return products.find({ where: { chemicalId }, order: { id: 'ASC' } });
    },
    async inputsFromContainers(containerIds: number[]): Promise<RunInputRow[]> {
      if (containerIds.length === 0) return [];
      return inputs
        .createQueryBuilder('i')
        .where('i.container_id IN (:...containerIds)', { containerIds })
        .orderBy('i.id', 'ASC')
        .getMany();
    },
  };
}
export type RunsRepository = ReturnType<typeof runsRepository>;
