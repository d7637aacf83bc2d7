import type { RuleSetKind } from '@lotwise/shared';
import type { EntityManager } from 'typeorm';
import { RuleSetEntity, type RuleSetRow } from './rule-set.entity';

export type RuleSetValues = Omit<RuleSetRow, 'id'>;

/** Data access for `rule_sets`; answers plain objects. */
export function ruleSetsRepository(manager: EntityManager) {
  const repo = manager.getRepository(RuleSetEntity);
  return {
    async list(kind?: RuleSetKind): Promise<RuleSetRow[]> {
      const qb = repo.createQueryBuilder('r');
      if (kind) qb.where('r.kind = :kind', { kind });
      return qb.orderBy('r.builtIn', 'DESC').addOrderBy('LOWER(r.name)', 'ASC').getMany();
    },
    async findRow(id: number): Promise<RuleSetRow | null> {
      return repo.findOneBy({ id });
    },
    async rowsByIds(ids: number[]): Promise<RuleSetRow[]> {
      if (ids.length === 0) return [];
      return repo.createQueryBuilder('r').where('r.id IN (:...ids)', { ids }).getMany();
    },
    /** The first built-in set of a kind (the default for a new lab area). */
    async builtIn(kind: RuleSetKind): Promise<RuleSetRow | null> {
      return repo.findOne({ where: { kind, builtIn: true }, order: { id: 'ASC' } });
    },
    /** Names of the places marked as lab areas or waste accumulation areas that use the set. */
    async usedBy(id: number): Promise<string[]> {
      const rows: { path: string }[] = await manager
        .createQueryBuilder()
        .select('l.path', 'path')
        .from('lab_areas', 'a')
        .innerJoin('locations', 'l', 'l.id = a.location_id')
        .where('a.flammable_rule_set_id = :id OR a.container_size_rule_set_id = :id', { id })
        .orderBy('l.path', 'ASC')
        .getRawMany();
      const waste: { path: string }[] = await manager
        .createQueryBuilder()
        .select('l.path', 'path')
        .from('waste_areas', 'w')
        .innerJoin('locations', 'l', 'l.id = w.location_id')
        .where('w.rule_set_id = :id', { id })
        .orderBy('l.path', 'ASC')
        .getRawMany();
      return [...rows, ...waste].map((r) => r.path);
    },
    async insert(values: RuleSetValues): Promise<number> {
      const saved = await repo.save({ ...values });
      return saved.id;
    },
    async update(id: number, changes: Partial<RuleSetValues>): Promise<void> {
      const row = await repo.findOneByOrFail({ id });
      await repo.save({ ...row, ...changes });
    },
    async delete(id: number): Promise<void> {
      await repo.delete({ id });
    },
  };
}
export type RuleSetsRepository = ReturnType<typeof ruleSetsRepository>;
