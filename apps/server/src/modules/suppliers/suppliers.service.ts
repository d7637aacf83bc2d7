import { countOf } from '@lotwise/shared';
import type {
  CatalogItem,
  CatalogItemCreateParsed,
  CatalogItemListQuery,
  CatalogItemPatch,
  Page,
  Supplier,
  SupplierCreateParsed,
  SupplierListQuery,
  SupplierPage,
  SupplierPatch,
} from '@lotwise/shared';
import { AppError } from '../../lib/app-error';
import type { Repositories, Store } from '../../db/store';
import { isUniqueViolation, nowIso } from '../../db/sql';
import type { CatalogItemWithNames, SupplierWithCounts } from './suppliers.repository';

/** The one rule for a price's currency: the lab's own (`CURRENCY`), or a 400 naming the field. */
export function currencyProblem(given: string | undefined | null, labCurrency: string) {
  if (!given || given === labCurrency) return null;
  return `is ${given}, but this lab keeps every price in ${labCurrency} (CURRENCY): give the price in ${labCurrency}`;
}

/** The supplier a write names: 400 naming the field when it does not exist. */
export async function requireSupplier(repos: Repositories, id: number, field = 'supplierId') {
  const supplier = await repos.suppliers.findSupplier(id);
  if (!supplier) {
    throw AppError.validation(`There is no supplier #${id}.`, { [field]: `no supplier #${id}` });
  }
  return supplier;
}

export function suppliersService(store: Store, labCurrency: string) {
  const presentSupplier = ({ ...row }: SupplierWithCounts): Supplier => ({
    ...row,
    currency: labCurrency,
  });
  const presentItem = (row: CatalogItemWithNames): CatalogItem => row;

  async function loadSupplier(repos: Repositories, id: number) {
    const supplier = await repos.suppliers.findSupplier(id);
    if (!supplier) throw AppError.notFound(`There is no supplier #${id}.`);
    return supplier;
  }
  async function loadItem(repos: Repositories, id: number) {
    const item = await repos.suppliers.findItem(id);
    if (!item) throw AppError.notFound(`There is no catalogue item #${id}.`);
    return item;
  }
  async function assertNameFree(repos: Repositories, name: string, exceptId?: number) {
    const holder = await repos.suppliers.supplierNamed(name);
    if (holder && holder.id !== exceptId) {
      throw AppError.conflict(`There is already a supplier called ${holder.name}.`, {
        name: 'is already the name of another supplier',
      });
    }
  }
  async function assertSkuFree(
    repos: Repositories,
    supplierId: number,
    sku: string,
    exceptId?: number,
  ) {
    const holder = await repos.suppliers.itemBySku(supplierId, sku);
    if (holder && holder.id !== exceptId) {
      throw AppError.conflict(`This supplier already sells an item with SKU ${holder.sku}.`, {
        sku: 'is already used by another item of this supplier',
      });
    }
  }
  async function requireChemical(repos: Repositories, id: number) {
    if (!(await repos.chemicals.findRow(id))) {
      throw AppError.validation(`There is no chemical #${id}.`, {
        chemicalId: `no chemical #${id}`,
      });
    }
  }
  function checkCurrency(currency: string | undefined) {
    const problem = currencyProblem(currency, labCurrency);
    if (problem) throw AppError.validation(`The currency ${problem}.`, { currency: problem });
  }
  /** Two writers racing for one name or SKU: the unique index decides, answered as 409. */
  async function unique<T>(work: () => Promise<T>, message: string, field: string): Promise<T> {
    try {
      return await work();
    } catch (error) {
      if (isUniqueViolation(error)) throw AppError.conflict(message, { [field]: message });
      throw error;
    }
  }

  return {
    async listSuppliers(query: SupplierListQuery): Promise<SupplierPage> {
      const { items, total } = await store.repos.suppliers.listSuppliers(query);
      return {
        items: items.map(presentSupplier),
        total,
        page: query.page,
        pageSize: query.pageSize,
        currency: labCurrency,
      };
    },

    async getSupplier(id: number): Promise<Supplier> {
      return presentSupplier(await loadSupplier(store.repos, id));
    },

    async createSupplier(input: SupplierCreateParsed): Promise<Supplier> {
      return unique(
        () =>
          store.transaction(async (repos) => {
            await assertNameFree(repos, input.name);
            const now = nowIso();
            const id = await repos.suppliers.insertSupplier({
              ...input,
              archived: false,
              createdAt: now,
              updatedAt: now,
            });
            return presentSupplier(await loadSupplier(repos, id));
          }),
        'is already the name of another supplier',
        'name',
      );
    },

    async updateSupplier(id: number, patch: SupplierPatch): Promise<Supplier> {
      return unique(
        () =>
          store.transaction(async (repos) => {
            await loadSupplier(repos, id);
            if (patch.name !== undefined) await assertNameFree(repos, patch.name, id);
            await repos.suppliers.updateSupplier(id, { ...patch, updatedAt: nowIso() });
            return presentSupplier(await loadSupplier(repos, id));
          }),
        'is already the name of another supplier',
        'name',
      );
    },

    /** Deletes a supplier and its catalogue; refused (409) while any order names it. */
    async removeSupplier(id: number): Promise<void> {
      await store.transaction(async (repos) => {
        const supplier = await loadSupplier(repos, id);
        const lines = await repos.suppliers.orderLinesOfSupplier(id);
        if (supplier.orderCount > 0 || lines > 0) {
          throw AppError.conflict(
            `${supplier.name} is named by ${countOf(supplier.orderCount, 'order')}, which keep it in their history, so it cannot be deleted. Archive it instead: it then stays out of new orders.`,
          );
        }
        await repos.suppliers.deleteSupplier(id);
      });
    },

    async listItems(query: CatalogItemListQuery): Promise<Page<CatalogItem>> {
      const { items, total } = await store.repos.suppliers.listItems(query);
      return { items: items.map(presentItem), total, page: query.page, pageSize: query.pageSize };
    },

    async getItem(id: number): Promise<CatalogItem> {
      return presentItem(await loadItem(store.repos, id));
    },

    async createItem(input: CatalogItemCreateParsed): Promise<CatalogItem> {
      checkCurrency(input.currency);
      return unique(
        () =>
          store.transaction(async (repos) => {
            await requireSupplier(repos, input.supplierId);
            await requireChemical(repos, input.chemicalId);
            await assertSkuFree(repos, input.supplierId, input.sku);
            const now = nowIso();
            const id = await repos.suppliers.insertItem({
              ...input,
              currency: labCurrency,
              discontinued: false,
              createdAt: now,
              updatedAt: now,
            });
            return presentItem(await loadItem(repos, id));
          }),
        'is already used by another item of this supplier',
        'sku',
      );
    },

    async updateItem(id: number, patch: CatalogItemPatch): Promise<CatalogItem> {
      checkCurrency(patch.currency);
      return unique(
        () =>
          store.transaction(async (repos) => {
            const current = await loadItem(repos, id);
            if (patch.chemicalId !== undefined) await requireChemical(repos, patch.chemicalId);
            if (patch.sku !== undefined)
              await assertSkuFree(repos, current.supplierId, patch.sku, id);
            await repos.suppliers.updateItem(id, { ...patch, updatedAt: nowIso() });
            return presentItem(await loadItem(repos, id));
          }),
        'is already used by another item of this supplier',
        'sku',
      );
    },

    /** Deletes a catalogue item; refused (409) while an order line names it. */
    async removeItem(id: number): Promise<void> {
      await store.transaction(async (repos) => {
        const item = await loadItem(repos, id);
        if (item.orderLineCount > 0) {
          throw AppError.conflict(
            `${item.sku} (${item.chemical.name}) is on ${countOf(item.orderLineCount, 'order line')}, which keep it in their history, so it cannot be deleted. Mark it discontinued instead: it then stays out of new orders.`,
          );
        }
        await repos.suppliers.deleteItem(id);
      });
    },
  };
}
export type SuppliersService = ReturnType<typeof suppliersService>;
