import type { StockUnit } from '@lotwise/shared';
import type { Repositories } from '../../db/store';
import { AppError } from '../../lib/app-error';
import type { PurchasingChemicalRow } from './reorder.repository';

/**
 * The chemical an amount to buy names, counted in its stock unit: 400 naming `chemicalId`
 * when it does not exist, `unit` when the amount is in the other unit.
 */
export async function requireChemicalIn(
  repos: Repositories,
  chemicalId: number,
  unit: StockUnit,
): Promise<PurchasingChemicalRow> {
  const chemical = await repos.reorder.chemical(chemicalId);
  if (!chemical) {
    throw AppError.validation(`There is no chemical #${chemicalId}.`, {
      chemicalId: `no chemical #${chemicalId}`,
    });
  }
  if (chemical.stockUnit !== unit) {
    throw AppError.validation(`${chemical.name} is counted in ${chemical.stockUnit}.`, {
      unit: `must be ${chemical.stockUnit}, the stock unit of ${chemical.name}`,
    });
  }
  return chemical;
}
