import type { PackUnit } from '@lotwise/shared';
import { nowIso } from '../../db/sql';
import { testContext } from '../../test/harness';
import { CatalogItemEntity } from '../suppliers/catalog-item.entity';
import { SupplierEntity } from '../suppliers/supplier.entity';

let sequence = 0;

/**
 * Suppliers and catalogue items written straight into the test database, for the tests of
 * what is built on the catalogue (suggestions, requests). Invented names only.
 */
export function catalogueFactory() {
  const repo = <T>(entity: T) => testContext().dataSource.getRepository(entity as never);
  return {
    async supplier(
      fees: {
        shippingFeeMinor?: number;
        hazardousFeeMinor?: number;
        minimumOrderMinor?: number;
      } = {},
    ) {
      const now = nowIso();
      const name = `Test supplier ${++sequence} (fictional)`;
      const result = await repo(SupplierEntity).insert({
        name,
        contactName: '',
        email: `orders.${sequence}@example.test`,
        phone: '',
        website: '',
        orderingNotes: '',
        minimumOrderMinor: fees.minimumOrderMinor ?? 0,
        shippingFeeMinor: fees.shippingFeeMinor ?? 0,
        hazardousFeeMinor: fees.hazardousFeeMinor ?? 0,
        archived: false,
        createdAt: now,
        updatedAt: now,
      });
      return { id: Number(result.identifiers[0]?.id), name };
    },
    async item(
      supplierId: number,
      chemicalId: number,
      pack: {
        packSize: number;
        packUnit?: PackUnit;
        priceMinor: number;
        hazardous?: boolean;
        splittable?: boolean;
      },
    ) {
      const now = nowIso();
      const sku = `SKU-${++sequence}`;
      const result = await repo(CatalogItemEntity).insert({
        supplierId,
        sku,
        chemicalId,
        packSize: pack.packSize,
        packUnit: pack.packUnit ?? 'g',
        grade: null,
        purityPercent: null,
        priceMinor: pack.priceMinor,
        currency: 'EUR',
        hazardous: pack.hazardous ?? false,
        splittable: pack.splittable ?? false,
        discontinued: false,
        createdAt: now,
        updatedAt: now,
      });
      return { id: Number(result.identifiers[0]?.id), sku };
    },
  };
}
