import type { RuleSetKind } from '@lotwise/shared';
import { EntitySchema } from 'typeorm';

/** A row of `rule_sets`: the figures (`data`) are JSON of the kind's shape (shared/src/rule-sets.ts). */
export interface RuleSetRow {
  id: number;
  kind: RuleSetKind;
  name: string;
  source: string;
  edition: string;
  reference: string;
  notes: string;
  builtIn: boolean;
  data: Record<string, unknown>;
  createdAt: string;
  updatedAt: string;
}

export const RuleSetEntity = new EntitySchema<RuleSetRow>({
  name: 'RuleSet',
  tableName: 'rule_sets',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    kind: { type: 'varchar', length: 30 },
    name: { type: 'varchar', length: 120 },
    source: { type: 'varchar', length: 300 },
    edition: { type: 'varchar', length: 60 },
    reference: { type: 'varchar', length: 120 },
    notes: { type: 'text' },
    builtIn: { name: 'built_in', type: 'boolean' },
    data: { type: 'simple-json' },
    createdAt: { name: 'created_at', type: 'varchar', length: 24 },
    updatedAt: { name: 'updated_at', type: 'varchar', length: 24 },
  },
  indices: [{ name: 'rule_sets_kind_idx', columns: ['kind'] }],
});
