import { countOf, fireDataProblem } from '@lotwise/shared';
import { canonicalFormula, tryMolarMass } from '@lotwise/chem';
import type {
  Chemical,
  ChemicalCreateParsed,
  ChemicalListQuery,
  ChemicalPatchBody,
  Page,
  StorageGroup,
} from '@lotwise/shared';
import { AppError } from '../../lib/app-error';
import type { Store } from '../../db/store';
import { nowIso } from '../../db/sql';
import type { ChemicalValues } from './chemicals.repository';

/** Molar mass in g/mol from packages/chem; null without a formula. */
export function molarMassOf(formula: string | null): number | null {
  if (!formula) return null;
  const result = tryMolarMass(formula);
  return result.ok ? result.value : null;
}

/**
 * The formula as stored: one normal form whatever was typed (subscripts, "." / "*" / spaced
 * dots), so the same substance is always written the same way. A formula the contract let
 * through always parses; anything else is kept as given.
 */
export function storedFormula(formula: string | null): string | null {
  if (!formula) return formula;
  try {
    return canonicalFormula(formula);
  } catch {
    return formula;
  }
}

/** What `q` matches: name, synonyms, CAS RN and formula, lower-cased (JS, so not ASCII only). */
export function searchTextOf(chemical: {
  name: string;
  synonyms: string[];
  casNumber: string | null;
  formula: string | null;
}): string {
  return [chemical.name, ...chemical.synonyms, chemical.casNumber, chemical.formula]
    .filter((part): part is string => Boolean(part))
    .join('\n')
    .toLowerCase();
}

/** Values of a new chemical row, with the computed columns filled in. */
export function newChemicalValues(
  input: ChemicalCreateParsed & { extraHazardGroups?: StorageGroup[] },
  now = nowIso(),
): ChemicalValues {
  const formula = storedFormula(input.formula);
  return {
    ...input,
    formula,
    extraHazardGroups: input.extraHazardGroups ?? [],
    molarMass: molarMassOf(formula),
    searchText: searchTextOf({ ...input, formula }),
    sdsFileName: null,
    sdsStoredName: null,
    sdsSize: null,
    sdsContentType: null,
    sdsUploadedAt: null,
    createdAt: now,
    updatedAt: now,
  };
}

function notFound(id: number) {
  return AppError.notFound(`There is no chemical #${id}.`);
}

/** Where a deleted chemical's SDS file goes (the app's file store). */
interface StoredFiles {
  remove(storedName: string | null): Promise<void>;
}

export function chemicalsService(store: Store, files?: StoredFiles) {
  const { chemicals } = store.repos;

  async function assertCasFree(casNumber: string | null, exceptId?: number) {
    if (!casNumber) return;
    const holder = await chemicals.findByCasNumber(casNumber);
    if (holder && holder.id !== exceptId) {
      throw AppError.conflict(`CAS RN ${casNumber} already belongs to ${holder.name}.`, {
        casNumber: `is already used by ${holder.name}`,
      });
    }
  }

  return {
    async list(query: ChemicalListQuery): Promise<Page<Chemical>> {
      const { items, total } = await chemicals.list(query);
      return { items, total, page: query.page, pageSize: query.pageSize };
    },

    async get(id: number): Promise<Chemical> {
      const chemical = await chemicals.findById(id);
      if (!chemical) throw notFound(id);
      return chemical;
    },

    async create(
      input: ChemicalCreateParsed & { extraHazardGroups?: StorageGroup[] },
    ): Promise<Chemical> {
      await assertCasFree(input.casNumber);
      return chemicals.insert(newChemicalValues(input));
    },

    async update(id: number, patch: ChemicalPatchBody): Promise<Chemical> {
      const current = await this.get(id);
      if (Object.keys(patch).length === 0) return current;
      if (patch.stockUnit !== undefined && patch.stockUnit !== current.stockUnit) {
        const held = await store.repos.containers.countForChemical(id);
        if (held > 0) {
          throw AppError.conflict(
            `${current.name} has ${countOf(held, 'container')} counted in ${current.stockUnit}; its stock unit cannot change.`,
            { stockUnit: `stays ${current.stockUnit} while containers hold it` },
          );
        }
      }
      if (patch.casNumber !== undefined) await assertCasFree(patch.casNumber, id);
      const problem = fireDataProblem(
        patch.flashPointC === undefined ? current.flashPointC : patch.flashPointC,
        patch.boilingPointC === undefined ? current.boilingPointC : patch.boilingPointC,
      );
      if (problem) {
        throw AppError.validation('The flash point must be below the boiling point.', {
          flashPointC: problem,
        });
      }
      const normalized =
        patch.formula === undefined ? patch : { ...patch, formula: storedFormula(patch.formula) };
      const next = { ...current, ...normalized };
      const changes: Partial<ChemicalValues> = { ...normalized, updatedAt: nowIso() };
      if (patch.formula !== undefined) changes.molarMass = molarMassOf(next.formula);
      if (['name', 'synonyms', 'casNumber', 'formula'].some((key) => key in patch)) {
        changes.searchText = searchTextOf(next);
      }
      return chemicals.update(id, changes);
    },

    async remove(id: number): Promise<void> {
      const lots = await store.repos.lots.countForChemical(id);
      if (lots > 0) {
        throw AppError.conflict(
          `This chemical has ${countOf(lots, 'lot')} in stock history and cannot be deleted.`,
        );
      }
      const procedures = await store.repos.procedures.using(id);
      if (procedures.length > 0) {
        throw AppError.conflict(
          `This chemical is on ${countOf(new Set(procedures.map((p) => p.procedureId)).size, 'procedure')} and cannot be deleted.`,
        );
      }
      const row = await chemicals.findRow(id);
      if (!row || !(await chemicals.delete(id))) throw notFound(id);
      await files?.remove(row.sdsStoredName);
    },
  };
}
export type ChemicalsService = ReturnType<typeof chemicalsService>;
