import {
  countOf,
  can,
  formatQuantity,
  safetyDeferral,
  type ReceiveOrderParsed,
  type ReceivingLine,
  type ReceivingView,
  type ConfirmationWarning,
  type User,
} from '@lotwise/shared';
import type { Config } from '../../config';
import type { Repositories, Store } from '../../db/store';
import { nowIso } from '../../db/sql';
import { AppError } from '../../lib/app-error';
import type { AlertsService } from '../alerts/alerts.service';
import type { ChemicalRow } from '../chemicals/chemical.entity';
import type { ContainerRow } from '../containers/container.entity';
import {
  appendEntry,
  createContainer,
  peroxideDueFor,
  roundQuantity,
  statusAfter,
  toStockUnit,
} from '../containers/containers.service';
import type { LocationRow } from '../locations/location.entity';
import { requireLocation } from '../locations/locations.service';
import { mayMove } from '../orders/order-lifecycle';
import type { OrderLineRow } from '../orders/order-line.entity';
import type { OrderShareRow } from '../orders/order-share.entity';
import type { OrderRecord } from '../orders/orders.repository';
import { watchLabAreas } from '../lab-areas/lab-area-confirmations';
import { refuseUnconfirmed, segregationService } from '../segregation/segregation.service';
import { closeBlockers, requireOrder } from './money';
import { planPacks } from './pack-portions';

const labHolder = 'Lab';

/** A container made for a share's portion, for the member's e-mail. */
interface MadePortion {
  share: OrderShareRow;
  container: ContainerRow;
  location: LocationRow;
  chemical: ChemicalRow;
}

/** A share's amount in the chemical's stock unit, or null when it cannot be converted. */
function stockQuantityOf(quantity: number, line: OrderLineRow, chemical: ChemicalRow) {
  try {
    return roundQuantity(toStockUnit(quantity, line.packUnit, chemical, 'quantity'));
  } catch {
    return null;
  }
}

/** What the receive page shows: lines, shares, holders and (once received) their containers. */
async function receivingView(repos: Repositories, record: OrderRecord): Promise<ReceivingView> {
  const { order, lines, shares } = record;
  const supplier = (await repos.receiving.supplierNames([order.supplierId])).get(order.supplierId);
  const people = await repos.receiving.people(
    shares.flatMap((share) => (share.userId === null ? [] : [share.userId])),
  );
  const payments = await repos.receiving.paymentsOf([order.id]);
  const holderOf = (share: OrderShareRow) =>
    share.userId === null
      ? labHolder
      : (people.get(share.userId)?.displayName ?? `Member #${share.userId}`);
  const viewLines: ReceivingLine[] = [];
  for (const line of lines) {
    const chemical = (await repos.chemicals.findRow(line.chemicalId))!;
    let lot: ReceivingLine['lot'] = null;
    const lineShares: ReceivingLine['shares'] = [];
    for (const share of shares.filter((s) => s.lineId === line.id)) {
      const view = share.containerId ? await repos.containers.findView(share.containerId) : null;
      if (view && !lot) lot = { id: view.lotId, supplierLotNumber: view.lotSupplierLotNumber };
      lineShares.push({
        shareId: share.id,
        userId: share.userId,
        forLab: share.forLab || share.userId === null,
        holder: holderOf(share),
        quantity: share.quantity,
        packUnit: line.packUnit,
        stockQuantity: stockQuantityOf(share.quantity, line, chemical),
        stockUnit: chemical.stockUnit,
        container: view
          ? {
              id: view.id,
              labelCode: view.labelCode,
              quantity: Number(view.quantity),
              unit: view.unit,
              locationId: view.locationId,
              locationPath: view.locationPath,
            }
          : null,
      });
    }
    viewLines.push({
      lineId: line.id,
      sku: line.sku,
      chemical: {
        id: chemical.id,
        name: chemical.name,
        ghsPictograms: chemical.ghsPictograms,
        hazardStatements: chemical.hazardStatements,
      },
      packs: line.packs,
      packSize: line.packSize,
      packUnit: line.packUnit,
      grade: line.grade,
      hazardous: line.hazardous,
      lot,
      shares: lineShares,
    });
  }
  const blockers =
    order.status === 'received'
      ? closeBlockers(order, shares, payments, (shareId) => {
          const share = shares.find((s) => s.id === shareId);
          return share ? holderOf(share) : `share #${shareId}`;
        })
      : [];
  return {
    orderId: order.id,
    title: order.title,
    status: order.status,
    supplierName: supplier ?? `Supplier #${order.supplierId}`,
    supplierReference: order.supplierReference,
    receivedAt: order.receivedAt,
    receivable: order.status === 'ordered',
    closable: order.status === 'received' && blockers.length === 0,
    closeBlockers: blockers,
    lines: viewLines,
  };
}

/** Checks that every line is named once with all its packs; answers the input per line id. */
function linesReceived(record: OrderRecord, input: ReceiveOrderParsed) {
  const byLine = new Map<number, { index: number; line: ReceiveOrderParsed['lines'][number] }>();
  const fields: Record<string, string> = {};
  input.lines.forEach((line, index) => {
    const ordered = record.lines.find((l) => l.id === line.lineId);
    if (!ordered) fields[`lines.${index}.lineId`] = `is not a line of order #${record.order.id}`;
    else if (byLine.has(line.lineId)) fields[`lines.${index}.lineId`] = 'is named twice';
    else if (line.packsReceived !== ordered.packs) {
      fields[`lines.${index}.packsReceived`] =
        `must be the ${countOf(ordered.packs, 'pack')} ordered: receive the delivery when all of it has come`;
    }
    byLine.set(line.lineId, { index, line });
  });
  record.lines.forEach((line) => {
    if (!byLine.has(line.id)) fields[`lines`] = `say what came for ${line.sku}`;
  });
  for (const [index, share] of input.shares.entries()) {
    if (!record.shares.some((s) => s.id === share.shareId)) {
      fields[`shares.${index}.shareId`] = `is not a share of order #${record.order.id}`;
    }
  }
  if (Object.keys(fields).length > 0) {
    throw AppError.validation(
      `What came does not match order #${record.order.id}: ${Object.values(fields).join('; ')}.`,
      fields,
    );
  }
  return byLine;
}

export function receivingService(store: Store, alerts: AlertsService, config: Config) {
  async function portionReadyMails(
    repos: Repositories,
    orderId: number,
    title: string,
    made: MadePortion[],
  ) {
    const byMember = new Map<number, MadePortion[]>();
    for (const portion of made) {
      if (portion.share.userId === null) continue;
      byMember.set(portion.share.userId, [...(byMember.get(portion.share.userId) ?? []), portion]);
    }
    for (const [userId, portions] of byMember) {
      const lines = portions.map(
        ({ container, location, chemical }) =>
          `- ${chemical.name}: ${formatQuantity(container.quantity, container.unit)} in container ${container.labelCode}, at ${location.path}.${
            chemical.hazardStatements.length > 0
              ? ` Hazards: ${chemical.hazardStatements.join(', ')}.`
              : ''
          }`,
      );
      await alerts.notify(repos, {
        kind: 'order-portion-ready',
        recipients: [userId],
        subject: `Your portion of “${title}” is ready`,
        text: [
          `The delivery of the shared order “${title}” has been received at ${config.labName}. Your portion is labelled and on the shelf:`,
          lines.join('\n'),
          `Check the label and the safety data sheet before you use it. ${safetyDeferral}`,
        ].join('\n\n'),
        link: `/stock/containers/${portions[0]!.container.id}`,
        dedupKey: `order-${orderId}-portion-ready`,
      });
    }
  }

  return {
    async view(id: number): Promise<ReceivingView> {
      return receivingView(store.repos, await requireOrder(store.repos, id));
    },

    /**
     * Receives an ordered delivery in one transaction: a lot per line, each pack a container
     * (`received`), portions poured off it into one container per share (`split`), each owned
     * by its member; the shares point at their containers and the order is `received`.
     * Storage conflicts at the chosen places answer 409 `confirmation_required` (nothing
     * written) until confirmed.
     */
    async receive(id: number, input: ReceiveOrderParsed, actor: User): Promise<ReceivingView> {
      if (!can(actor.role, 'stock.write')) {
        throw AppError.forbidden(
          'Receiving a delivery puts stock on the shelf: your role may not.',
        );
      }
      return store.transaction(async (repos) => {
        const record = await requireOrder(repos, id);
        const { order } = record;
        if (order.status !== 'ordered' || !mayMove(order.status, 'received')) {
          throw AppError.conflict(
            `Order #${id} is ${order.status}: only an order marked ordered can be received.`,
          );
        }
        const byLine = linesReceived(record, input);
        const defaultLocation = await requireLocation(repos, input.locationId);
        const placeOf = new Map<number, LocationRow>();
        for (const [index, choice] of input.shares.entries()) {
          placeOf.set(
            choice.shareId,
            await requireLocation(repos, choice.locationId, `shares.${index}.locationId`),
          );
        }
        const locationOf = (share: OrderShareRow) => placeOf.get(share.id) ?? defaultLocation;
        const supplierName =
          (await repos.receiving.supplierNames([order.supplierId])).get(order.supplierId) ?? null;
        const segregation = segregationService(repos);
        const warnings: ConfirmationWarning[] = [];
        const labAreas = input.confirm
          ? null
          : await watchLabAreas(repos, [defaultLocation, ...placeOf.values()]);
        const written: number[] = [];
        const checkPlace = async (chemical: ChemicalRow, location: LocationRow) => {
          if (input.confirm) return;
          for (const warning of await segregation.confirmationsFor(
            { id: null },
            chemical,
            location,
          )) {
            if (!warnings.some((w) => w.message === warning.message)) warnings.push(warning);
          }
        };
        const now = nowIso();
        const made: MadePortion[] = [];
        const containerOfShare = new Map<number, number>();

        for (const line of record.lines) {
          const received = byLine.get(line.id)!;
          const field = `lines.${received.index}`;
          const chemical = (await repos.chemicals.findRow(line.chemicalId))!;
          const packQuantity = roundQuantity(
            toStockUnit(line.packSize, line.packUnit, chemical, `${field}.packsReceived`),
          );
          const lotId = await repos.lots.insert({
            chemicalId: chemical.id,
            source: 'purchased',
            supplierName,
            supplierLotNumber: received.line.supplierLotNumber,
            grade: line.grade,
            purityPercent: line.purityPercent,
            receivedOn: input.receivedOn,
            expiresOn: received.line.expiresOn,
            madeByRunId: null,
            certificateFileName: null,
            certificateStoredName: null,
            notes: `Shared order #${order.id}: ${order.title}`,
            createdAt: now,
            updatedAt: now,
          });
          const lineShares = record.shares.filter((share) => share.lineId === line.id);
          let plans;
          try {
            plans = planPacks(line.packs, line.packSize, lineShares);
          } catch {
            throw AppError.conflict(
              `The shares of ${line.sku} take more than its ${countOf(line.packs, 'pack')} hold.`,
            );
          }
          for (const plan of plans) {
            const portions = plan.portions.map((portion) => ({
              ...portion,
              stock: roundQuantity(
                toStockUnit(portion.quantity, line.packUnit, chemical, `${field}.packsReceived`),
              ),
            }));
            // The largest portion stays in the pack as delivered (unless part of it is nobody's);
            // its amount is what is left after the others, so the pack adds up exactly.
            const keeper =
              plan.rest > 0
                ? null
                : portions.reduce<(typeof portions)[number] | null>(
                    (best, p) => (!best || p.quantity > best.quantity ? p : best),
                    null,
                  );
            const poured = portions.filter((p) => p !== keeper);
            const packLocation = keeper ? locationOf(keeper.share) : defaultLocation;
            await checkPlace(chemical, packLocation);
            const pack = await createContainer(repos, {
              lotId,
              chemical,
              location: packLocation,
              quantity: packQuantity,
              status: 'sealed',
              openedOn: null,
              tareMass: null,
              capacity: null,
              capacityUnit: null,
              notes: `Shared order #${order.id}`,
              expiresOn: received.line.expiresOn,
              ownerId: keeper?.share.userId ?? null,
            });
            let packRow = (
              await appendEntry(
                repos,
                pack,
                {
                  delta: packQuantity,
                  reason: 'received',
                  note: `Received for shared order #${order.id} into ${packLocation.path}`,
                  toLocationId: packLocation.id,
                  orderId: order.id,
                },
                actor,
              )
            ).container;
            written.push(pack.id);
            if (keeper && !containerOfShare.has(keeper.share.id)) {
              containerOfShare.set(keeper.share.id, packRow.id);
            }
            for (const portion of poured) {
              const location = locationOf(portion.share);
              if (location.id !== packLocation.id) await checkPlace(chemical, location);
              const created = await createContainer(repos, {
                lotId,
                chemical,
                location,
                quantity: portion.stock,
                status: 'open',
                openedOn: input.receivedOn,
                tareMass: null,
                capacity: null,
                capacityUnit: null,
                notes: `Shared order #${order.id}`,
                expiresOn: received.line.expiresOn,
                ownerId: portion.share.userId,
              });
              const next = statusAfter(
                packRow.status,
                packRow.quantity - portion.stock,
                input.receivedOn,
                packRow.openedOn,
              );
              packRow = (
                await appendEntry(
                  repos,
                  packRow,
                  {
                    delta: -portion.stock,
                    reason: 'split',
                    note: `Portion for shared order #${order.id} into ${created.labelCode}`,
                    relatedContainerId: created.id,
                    fromLocationId: packLocation.id,
                    toLocationId: location.id,
                    orderId: order.id,
                  },
                  actor,
                  {
                    ...next,
                    peroxideDueOn: await peroxideDueFor(
                      repos,
                      { lotId, openedOn: next.openedOn },
                      chemical,
                    ),
                  },
                )
              ).container;
              const into = await appendEntry(
                repos,
                created,
                {
                  delta: portion.stock,
                  reason: 'split',
                  note: `Portion for shared order #${order.id} from ${pack.labelCode}`,
                  relatedContainerId: pack.id,
                  fromLocationId: packLocation.id,
                  toLocationId: location.id,
                  orderId: order.id,
                },
                actor,
              );
              written.push(created.id);
              made.push({ share: portion.share, container: into.container, location, chemical });
              if (!containerOfShare.has(portion.share.id)) {
                containerOfShare.set(portion.share.id, created.id);
              }
            }
            // The kept portion is told with what is left in the pack once the others are poured.
            if (keeper) {
              made.push({
                share: keeper.share,
                container: packRow,
                location: packLocation,
                chemical,
              });
            }
          }
        }
        if (labAreas) warnings.push(...(await labAreas.warnings(written)));
        refuseUnconfirmed(
          warnings,
          'Nothing was received: confirm to store the portions there anyway.',
        );
        for (const [shareId, containerId] of containerOfShare) {
          await repos.orders.updateShare(shareId, { containerId, updatedAt: now });
        }
        await repos.orders.updateOrder(order.id, {
          status: 'received',
          receivedAt: now,
          updatedAt: now,
        });
        await portionReadyMails(repos, order.id, order.title, made);
        return receivingView(repos, await requireOrder(repos, id));
      });
    },

    /** Closes a received order once nothing is owed and no payment or refund is in flight. */
    async close(id: number): Promise<ReceivingView> {
      return store.transaction(async (repos) => {
        const record = await requireOrder(repos, id);
        const view = await receivingView(repos, record);
        if (record.order.status !== 'received' || !mayMove(record.order.status, 'closed')) {
          throw AppError.conflict(
            `Order #${id} is ${record.order.status}: only a received order can be closed.`,
          );
        }
        if (!view.closable) {
          throw AppError.conflict(
            `Order #${id} cannot be closed yet. ${view.closeBlockers.join(' ')}`,
          );
        }
        const now = nowIso();
        await repos.orders.updateOrder(id, { status: 'closed', closedAt: now, updatedAt: now });
        return receivingView(repos, await requireOrder(repos, id));
      });
    },
  };
}
export type ReceivingService = ReturnType<typeof receivingService>;
