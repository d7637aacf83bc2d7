import { ChemError, consumptionRate, PACK_CHOICE_RULE, planReorder } from '@lotwise/chem';
import {
  todayIso,
  type DraftedOrder,
  type DraftFromSuggestions,
  type PackOffer,
  type ReorderSuggestion,
  type ReorderSuggestionList,
  type ReorderSuggestionQuery,
  type ShortfallDraft,
  type User,
} from '@lotwise/shared';
import type { Config } from '../../config';
import type { Repositories, Store } from '../../db/store';
import { AppError } from '../../lib/app-error';
import { requireChemicalIn } from './purchasing-chemical';
import { addToDraftOrder, type DraftLine } from './draft-order';
import { choiceNotes, choosePacksFrom, onOrderAmount, presentOffer } from './offers';
import type { OfferRow, PurchasingChemicalRow, ReorderChemicalRow } from './reorder.repository';

const DAY_MS = 86_400_000;

const dateOf = (date: Date | null) => (date ? todayIso(date) : null);

const purchasingChemical = (row: PurchasingChemicalRow) => ({
  id: row.id,
  name: row.name,
  casNumber: row.casNumber,
  formula: row.formula,
  physicalState: row.physicalState,
  stockUnit: row.stockUnit,
  ghsPictograms: row.ghsPictograms,
  hazardStatements: row.hazardStatements,
  storageGroup: row.storageGroup,
  restricted: row.restricted,
});

/** The best offer and the others for a quantity of a chemical, with notes on what was left out. */
export function offersFor(
  chemical: PurchasingChemicalRow,
  quantity: number,
  offers: readonly OfferRow[],
): { offer: PackOffer | null; alternatives: PackOffer[]; notes: string[] } {
  if (offers.length === 0) {
    return {
      offer: null,
      alternatives: [],
      notes: ['No supplier lists this chemical in its catalogue.'],
    };
  }
  const choice = choosePacksFrom(offers, quantity, chemical.stockUnit, chemical);
  const presented = choice.alternatives.map((combination) => presentOffer(combination, offers));
  const notes = choiceNotes(choice, offers);
  if (presented.length === 0) notes.unshift('No catalogue pack can be counted in the stock unit.');
  return { offer: presented[0] ?? null, alternatives: presented.slice(1), notes };
}

/** Reorder suggestions, drafting orders from them, and buying a plan's shortfall. */
export function reorderService(store: Store, config: Pick<Config, 'reorder' | 'currency'>) {
  const windowWeeks = config.reorder.windowWeeks;

  async function suggestionsFor(
    repos: Repositories,
    chemicals: ReorderChemicalRow[],
    now: Date,
  ): Promise<ReorderSuggestion[]> {
    const ids = chemicals.map((chemical) => chemical.id);
    const windowStart = new Date(now.getTime() - windowWeeks * 7 * DAY_MS);
    // One after another: in a transaction they share one connection (pg queues, and warns).
    const draws = await repos.reorder.drawsSince(ids, windowStart.toISOString());
    const firstEntries = await repos.reorder.firstEntryAt(ids);
    const offers = await repos.reorder.offers(ids);
    const pending = await repos.reorder.pendingLines(ids);
    return chemicals.map((chemical) => {
      // A chemical newer than the window has its rate counted from its first entry.
      const first = firstEntries.get(chemical.id);
      const start =
        first && new Date(first).getTime() > windowStart.getTime() ? new Date(first) : windowStart;
      const own = draws.filter((draw) => draw.chemicalId === chemical.id);
      const consumed = own.reduce((sum, draw) => sum + draw.quantity, 0);
      // Balances that fall by each draw only: deliveries and corrections are not use.
      let left = consumed;
      const rate = consumptionRate([
        { at: start, quantity: consumed },
        ...own.map((draw) => ({ at: draw.at, quantity: Math.max(0, (left -= draw.quantity)) })),
        { at: now, quantity: 0 },
      ]);
      const ratePerDay = consumed > 0 ? rate.ratePerDay : null;
      const plan = planReorder({
        onHand: chemical.onHand,
        ratePerDay,
        reorderPoint: chemical.reorderPoint,
        reorderQuantity: chemical.reorderQuantity,
        asOf: now,
      });
      const ownOffers = offers.filter((offer) => offer.chemicalId === chemical.id);
      const bought =
        plan.quantityToBuy !== null && plan.quantityToBuy > 0
          ? offersFor(chemical, plan.quantityToBuy, ownOffers)
          : {
              offer: null,
              alternatives: [],
              notes: ['Set a reorder quantity on the chemical to get a quantity and packs to buy.'],
            };
      return {
        chemical: purchasingChemical(chemical),
        unit: chemical.stockUnit,
        onHand: chemical.onHand,
        reorderPoint: chemical.reorderPoint,
        reorderQuantity: chemical.reorderQuantity,
        consumed: Math.round(consumed * 1e6) / 1e6,
        rateDays: rate.spanDays,
        ratePerDay,
        daysLeft: plan.daysLeft,
        daysToReorderPoint: plan.daysToReorderPoint,
        reorderPointOn: dateOf(plan.reorderPointOn),
        emptyOn: dateOf(plan.emptyOn),
        due: plan.due,
        quantityToBuy: plan.quantityToBuy,
        rule: plan.rule,
        onOrder: onOrderAmount(
          pending.filter((line) => line.chemicalId === chemical.id),
          chemical.stockUnit,
          chemical,
        ),
        ...bought,
      };
    });
  }

  /** Due first, then the soonest reorder point (unknown last), then by name. */
  const bySoonest = (a: ReorderSuggestion, b: ReorderSuggestion) =>
    Number(b.due) - Number(a.due) ||
    (a.daysToReorderPoint ?? Infinity) - (b.daysToReorderPoint ?? Infinity) ||
    a.chemical.name.localeCompare(b.chemical.name);

  /** Validates the chemicals and their offers, groups the packs by supplier. */
  function linesBySupplier(
    suggestions: ReorderSuggestion[],
    items: DraftFromSuggestions['items'],
    offers: OfferRow[],
  ) {
    const fields: Record<string, string> = {};
    const groups = new Map<number, { name: string; lines: DraftLine[] }>();
    items.forEach((item, index) => {
      const suggestion = suggestions.find((s) => s.chemical.id === item.chemicalId);
      const field = `items.${index}.chemicalId`;
      if (!suggestion) {
        fields[field] = `chemical #${item.chemicalId} has no reorder point`;
        return;
      }
      const offer =
        item.supplierId === undefined
          ? suggestion.offer
          : [suggestion.offer, ...suggestion.alternatives].find(
              (candidate) => candidate?.supplier.id === item.supplierId,
            );
      if (!offer) {
        fields[item.supplierId === undefined ? field : `items.${index}.supplierId`] =
          item.supplierId === undefined
            ? `${suggestion.chemical.name}: ${suggestion.notes[0] ?? 'no catalogue pack covers the quantity to buy'}`
            : `${suggestion.chemical.name}: supplier #${item.supplierId} has no pack that covers the quantity to buy`;
        return;
      }
      const group = groups.get(offer.supplier.id) ?? { name: offer.supplier.name, lines: [] };
      for (const pack of offer.packs) {
        const row = offers.find((o) => o.catalogItemId === pack.catalogItemId);
        if (row) group.lines.push({ item: row, packs: pack.count });
      }
      groups.set(offer.supplier.id, group);
    });
    if (Object.keys(fields).length > 0) {
      throw AppError.validation(
        'Some chosen chemicals cannot be drafted; nothing was drafted.',
        fields,
      );
    }
    return groups;
  }

  return {
    async list(query: ReorderSuggestionQuery): Promise<ReorderSuggestionList> {
      const now = new Date();
      const items = await store.transaction(async (repos) => {
        const chemicals = await repos.reorder.chemicalsWithReorderPoint(query.q, todayIso(now));
        return suggestionsFor(repos, chemicals, now);
      });
      return {
        items: items.filter((item) => !query.dueOnly || item.due).sort(bySoonest),
        windowWeeks,
        asOf: todayIso(now),
        currency: config.currency,
        packRule: PACK_CHOICE_RULE,
      };
    },

    /** One draft order per supplier, holding the best (or chosen) packs of every item. */
    async draftOrders(input: DraftFromSuggestions, actor: User): Promise<DraftedOrder[]> {
      const now = new Date();
      return store.transaction(async (repos) => {
        const ids = new Set(input.items.map((item) => item.chemicalId));
        const chemicals = (await repos.reorder.chemicalsWithReorderPoint('', todayIso(now))).filter(
          (chemical) => ids.has(chemical.id),
        );
        const suggestions = await suggestionsFor(repos, chemicals, now);
        const offers = await repos.reorder.offers([...ids]);
        const groups = linesBySupplier(suggestions, input.items, offers);
        const drafted: DraftedOrder[] = [];
        for (const [supplierId, group] of groups) {
          const result = await addToDraftOrder(repos, {
            supplierId,
            supplierName: group.name,
            lines: group.lines,
            coordinatorId: actor.id,
            currency: config.currency,
          });
          drafted.push({
            orderId: result.orderId,
            supplier: { id: supplierId, name: group.name },
            created: result.created,
            lineCount: result.lineIds.size,
          });
        }
        return drafted;
      });
    },

    /** A plan's shortfall of one chemical onto the draft order of the best supplier. */
    async draftShortfall(input: ShortfallDraft, actor: User): Promise<DraftedOrder> {
      return store.transaction(async (repos) => {
        const chemical = await requireChemicalIn(repos, input.chemicalId, input.unit);
        const offers = await repos.reorder.offers([chemical.id]);
        let found;
        try {
          found = offersFor(chemical, input.quantity, offers);
        } catch (error) {
          if (error instanceof ChemError) throw AppError.validation(error.message);
          throw error;
        }
        const offer = found.offer;
        if (!offer) {
          throw AppError.conflict(
            `No catalogue pack of ${chemical.name} covers ${input.quantity} ${input.unit}: ${found.notes.join(' ')}`,
          );
        }
        const lines = offer.packs.flatMap((pack) => {
          const item = offers.find((row) => row.catalogItemId === pack.catalogItemId);
          return item ? [{ item, packs: pack.count }] : [];
        });
        const result = await addToDraftOrder(repos, {
          supplierId: offer.supplier.id,
          supplierName: offer.supplier.name,
          lines,
          coordinatorId: actor.id,
          currency: config.currency,
        });
        return {
          orderId: result.orderId,
          supplier: offer.supplier,
          created: result.created,
          lineCount: result.lineIds.size,
        };
      });
    },
  };
}

export type ReorderService = ReturnType<typeof reorderService>;
