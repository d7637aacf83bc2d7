import {
  ruleSetCitation,
  type ruleSetCreateSchema,
  type RuleSet,
  type RuleSetKind,
} from '@lotwise/shared';
import type { z } from 'zod';
import { AppError } from '../../lib/app-error';
import type { Repositories, Store } from '../../db/store';
import { nowIso } from '../../db/sql';
import type { RuleSetRow } from './rule-set.entity';

type RuleSetCreateParsed = z.output<typeof ruleSetCreateSchema>;

/** The API shape of a rule set, with the citation pages and warnings show. */
export function presentRuleSet(row: RuleSetRow): RuleSet {
  return {
    id: row.id,
    kind: row.kind,
    name: row.name,
    source: row.source,
    edition: row.edition,
    reference: row.reference,
    notes: row.notes,
    builtIn: Boolean(row.builtIn),
    citation: ruleSetCitation(row),
    data: row.data,
    createdAt: row.createdAt,
    updatedAt: row.updatedAt,
  } as RuleSet;
}

function notFound(id: number) {
  return AppError.notFound(`There is no rule set #${id}.`);
}

/** The set a write names: 400 naming the field when it is missing or of another kind. */
export async function requireRuleSet(
  repos: Repositories,
  id: number,
  kind: RuleSetKind,
  field: string,
): Promise<RuleSetRow> {
  const row = await repos.ruleSets.findRow(id);
  if (!row)
    throw AppError.validation(`There is no rule set #${id}.`, { [field]: `no rule set #${id}` });
  if (row.kind !== kind) {
    throw AppError.validation(`${row.name} is a ${row.kind} rule set, not ${kind}.`, {
      [field]: `must be a ${kind} rule set`,
    });
  }
  return row;
}

export function ruleSetsService(store: Store) {
  async function refuseBuiltIn(row: RuleSetRow, doing: string) {
    if (row.builtIn) {
      throw AppError.conflict(
        `${ruleSetCitation(row)} ships with Lotwise and cannot be ${doing}: copy it to change it (a new rule set with its figures).`,
      );
    }
  }

  return {
    async list(kind?: RuleSetKind): Promise<RuleSet[]> {
      return (await store.repos.ruleSets.list(kind)).map(presentRuleSet);
    },

    async get(id: number): Promise<RuleSet> {
      const row = await store.repos.ruleSets.findRow(id);
      if (!row) throw notFound(id);
      return presentRuleSet(row);
    },

    async create(input: RuleSetCreateParsed): Promise<RuleSet> {
      return store.transaction(async (repos) => {
        const now = nowIso();
        const id = await repos.ruleSets.insert({
          kind: input.kind,
          name: input.name,
          source: input.source,
          edition: input.edition,
          reference: input.reference,
          notes: input.notes,
          builtIn: false,
          data: input.data as Record<string, unknown>,
          createdAt: now,
          updatedAt: now,
        });
        return presentRuleSet((await repos.ruleSets.findRow(id))!);
      });
    },

    /** A whole custom set again (kind cannot change); built-in sets are refused. */
    async update(id: number, input: RuleSetCreateParsed): Promise<RuleSet> {
      return store.transaction(async (repos) => {
        const row = await repos.ruleSets.findRow(id);
        if (!row) throw notFound(id);
        await refuseBuiltIn(row, 'changed');
        if (input.kind !== row.kind) {
          throw AppError.validation(`A ${row.kind} rule set stays one.`, {
            kind: `must stay ${row.kind}`,
          });
        }
        await repos.ruleSets.update(id, {
          name: input.name,
          source: input.source,
          edition: input.edition,
          reference: input.reference,
          notes: input.notes,
          data: input.data as Record<string, unknown>,
          updatedAt: nowIso(),
        });
        return presentRuleSet((await repos.ruleSets.findRow(id))!);
      });
    },

    async remove(id: number): Promise<void> {
      await store.transaction(async (repos) => {
        const row = await repos.ruleSets.findRow(id);
        if (!row) throw notFound(id);
        await refuseBuiltIn(row, 'deleted');
        const areas = await repos.ruleSets.usedBy(id);
        if (areas.length > 0) {
          throw AppError.conflict(
            `${row.name} is in use by ${areas.join(', ')}: give ${areas.length === 1 ? 'that area' : 'those areas'} another rule set first.`,
          );
        }
        await repos.ruleSets.delete(id);
      });
    },
  };
}
export type RuleSetsService = ReturnType<typeof ruleSetsService>;
