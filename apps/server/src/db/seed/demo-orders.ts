import { addDays } from '@lotwise/chem';
import { todayIso, type User } from '@lotwise/shared';
import type { DataSource } from 'typeorm';
import type { Config } from '../../config';
import type { Logger } from '../../lib/logger';
import { alertsService } from '../../modules/alerts/alerts.service';
import { LocationEntity } from '../../modules/locations/location.entity';
import { ContainerEntity } from '../../modules/containers/container.entity';
import { ordersService } from '../../modules/orders/orders.service';
import { paymentsService } from '../../modules/payments/payments.service';
import { receivingService } from '../../modules/receiving/receiving.service';
import { segregationService } from '../../modules/segregation/segregation.service';
import { requestsService } from '../../modules/requests/requests.service';
import { CatalogItemEntity } from '../../modules/suppliers/catalog-item.entity';
import { presentUser } from '../../modules/users/users.service';
import { openStore } from '../repositories';
import { demoAccounts } from './demo-seed';

/**
 * The demo lab's shared purchasing, made the way people make it — through the same services
 * the API uses, so every amount is priced, fixed and paid by the real rules:
 *
 * - "Autumn club restock" (Northfield Lab Supply): claimed by the three club members, paid in
 *   cash and from the lab's funds, ordered, received into each member's own labelled
 *   containers, and closed.
 * - "Evening club: esters and acids" (Harbour Chemicals Co.): claims closed, member one paid
 *   in cash and the lab's rest from its funds, member two and three still to pay (online).
 * - Two open member requests.
 *
 * Runs after the demo lab is seeded, in one transaction; the members get the e-mails the
 * services send (portion ready, payment recorded) in the development inbox.
 */
export async function seedDemoOrders(dataSource: DataSource, config: Config, logger: Logger) {
  const store = openStore(dataSource);
  const alerts = alertsService(store, config);
  const payments = paymentsService(store, config, { alerts, logger });
  const orders = ordersService(store, config, { alerts, cancellation: payments });
  const receiving = receivingService(store, alerts, config);
  const requests = requestsService(store, config);

  await store.transaction(async (repos) => {
    const person = async (email: string): Promise<User> => {
      const row = await repos.users.findByEmail(email);
      if (!row) throw new Error(`The demo account ${email} is missing`);
      return presentUser(row);
    };
    const technician = await person(demoAccounts[1]!.email);
    const one = await person(demoAccounts[2]!.email);
    const two = await person(demoAccounts[3]!.email);
    const three = await person(demoAccounts[4]!.email);
    const items = dataSource.getRepository(CatalogItemEntity);
    const item = async (sku: string) => {
      const found = await items.findOneBy({ sku });
      if (!found) throw new Error(`The demo catalogue has no ${sku}`);
      return found;
    };
    /**
     * A place for a chemical's portions: beside bottles of it already on the shelf, else a
     * place meant for its storage group, where nothing there conflicts with it (the same
     * check receiving makes).
     */
    const shelfOf = async (chemicalId: number) => {
      const chemical = (await repos.chemicals.findRow(chemicalId))!;
      const held = await dataSource
        .getRepository(ContainerEntity)
        .find({ where: { chemicalId }, order: { id: 'ASC' } });
      const all = await dataSource.getRepository(LocationEntity).find({ order: { id: 'ASC' } });
      const heldAt = new Set(held.map((container) => container.locationId));
      const candidates = [
        ...all.filter((place) => heldAt.has(place.id)),
        ...all.filter((place) => place.storageGroups.includes(chemical.storageGroup)),
      ];
      for (const place of candidates) {
        const warnings = await segregationService(repos).confirmationsFor(
          { id: null },
          chemical,
          place,
        );
        if (warnings.length === 0) return place.id;
      }
      throw new Error(`The demo lab has no conflict-free place for ${chemical.name}`);
    };
    const today = todayIso();

    // A closed order: claimed, paid, ordered, received into members' containers, closed.
    const salicylic = await item('NLS-1001');
    const hydroxide = await item('NLS-1401');
    let order = await orders.create(
      {
        supplierId: salicylic.supplierId,
        title: 'Autumn club restock',
        feeRule: 'value',
        claimDeadline: today,
        lines: [
          { catalogItemId: salicylic.id, packs: 1 },
          { catalogItemId: hydroxide.id, packs: 1 },
        ],
        notes: 'Salicylic acid for the aspirin evenings; sodium hydroxide for the 1 M solution.',
      },
      technician!,
    );
    const closedId = order.id;
    const [salicylicLine, hydroxideLine] = order.lines;
    await orders.open(closedId, technician!);
    await orders.claim(closedId, { lineId: salicylicLine!.id, quantity: 100 }, one!);
    await orders.claim(closedId, { lineId: salicylicLine!.id, quantity: 150 }, two!);
    await orders.claim(closedId, { lineId: hydroxideLine!.id, quantity: 500 }, three!);
    order = await orders.closeClaims(closedId, technician!);
    for (const share of order.shares) {
      await payments.recordCash(technician!, closedId, share.id, {
        note: 'Paid in cash at the club evening',
      });
    }
    await orders.markOrdered(
      closedId,
      { supplierReference: 'NF-0042-1187', supplierInvoiceMinor: order.totalMinor },
      technician!,
    );
    await receiving.receive(
      closedId,
      {
        receivedOn: addDays(today, -21),
        locationId: await shelfOf(salicylic.chemicalId),
        lines: [
          {
            lineId: salicylicLine!.id,
            packsReceived: 1,
            supplierLotNumber: 'NF-SA-2611',
            expiresOn: addDays(today, 3 * 365),
          },
          {
            lineId: hydroxideLine!.id,
            packsReceived: 1,
            supplierLotNumber: 'NF-SH-2608',
            expiresOn: addDays(today, 2 * 365),
          },
        ],
        shares: await (async () => {
          const portions = [];
          for (const share of order.shares.filter((s) => s.lineId === hydroxideLine!.id)) {
            portions.push({ shareId: share.id, locationId: await shelfOf(hydroxide.chemicalId) });
          }
          return portions;
        })(),
        confirm: false,
      },
      technician!,
    );
    await receiving.close(closedId);

    // An open order: claims closed, some shares paid, some still to pay.
    const acetate = await item('HC-30-210');
    const acetic = await item('HC-50-100');
    order = await orders.create(
      {
        supplierId: acetate.supplierId,
        title: 'Evening club: esters and acids',
        feeRule: 'value',
        claimDeadline: addDays(today, 5),
        lines: [
          { catalogItemId: acetate.id, packs: 1 },
          { catalogItemId: acetic.id, packs: 1 },
        ],
        notes: 'Ethyl acetate for chromatography nights; glacial acetic acid for the esters.',
      },
      technician!,
    );
    const openId = order.id;
    const [acetateLine, aceticLine] = order.lines;
    await orders.open(openId, technician!);
    await orders.claim(openId, { lineId: acetateLine!.id, quantity: 1 }, one!);
    await orders.claim(openId, { lineId: aceticLine!.id, quantity: 0.25 }, two!);
    await orders.claim(openId, { lineId: aceticLine!.id, quantity: 0.25 }, three!);
    await orders.takeLabRemainder(openId, technician!);
    order = await orders.closeClaims(openId, technician!);
    const memberOne = order.shares.find((share) => share.member?.id === one!.id)!;
    const lab = order.shares.find((share) => share.forLab)!;
    await payments.recordCash(technician!, openId, memberOne.id, {
      note: 'Handed to the technician at the club evening',
    });
    await payments.recordCash(technician!, openId, lab.id, {
      note: 'From the club’s consumables budget',
    });

    // Members ask for what they will need.
    const chemicals = await repos.chemicals.list({
      q: '',
      sort: 'name.asc',
      page: 1,
      pageSize: 200,
    });
    const named = (name: string) => {
      const found = chemicals.items.find((chemical) => chemical.name === name);
      if (!found) throw new Error(`The demo lab has no ${name}`);
      return found;
    };
    const benzaldehyde = named('Benzaldehyde');
    await requests.create(
      {
        chemicalId: benzaldehyde.id,
        quantity: 50,
        unit: benzaldehyde.stockUnit,
        neededBy: addDays(today, 90),
        note: 'For the dibenzalacetone evening in spring.',
      },
      three!,
    );
    const copper = named('Copper(II) sulfate pentahydrate');
    await requests.create(
      {
        chemicalId: copper.id,
        quantity: 100,
        unit: copper.stockUnit,
        neededBy: null,
        note: 'Crystal growing with the younger members.',
      },
      one!,
    );
  });
}
