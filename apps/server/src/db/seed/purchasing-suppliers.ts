import {
  catalogItemCreateSchema,
  supplierCreateSchema,
  type Chemical,
  type PackUnit,
  type SupplierCreate,
} from '@lotwise/shared';
import type { Repositories } from '../store';
import { nowIso } from '../sql';

/**
 * The demo lab's two suppliers and their price lists: invented shops at example.test
 * addresses, small-pack prices of the kind a teaching lab pays, in minor units (cents).
 */
interface DemoItem {
  sku: string;
  chemical: string;
  packSize: number;
  packUnit: PackUnit;
  priceMinor: number;
  grade: string | null;
  purityPercent: number | null;
  hazardous: boolean;
  splittable: boolean;
}

interface DemoSupplier extends SupplierCreate {
  items: DemoItem[];
}

const item = (
  sku: string,
  chemical: string,
  packSize: number,
  packUnit: PackUnit,
  priceMinor: number,
  options: Partial<
    Omit<DemoItem, 'sku' | 'chemical' | 'packSize' | 'packUnit' | 'priceMinor'>
  > = {},
): DemoItem => ({
  sku,
  chemical,
  packSize,
  packUnit,
  priceMinor,
  grade: 'Reagent',
  purityPercent: null,
  hazardous: false,
  splittable: true,
  ...options,
});

export const demoSuppliers: DemoSupplier[] = [
  {
    name: 'Northfield Lab Supply',
    contactName: 'Orders desk',
    email: 'orders@northfield.example.test',
    phone: '+00 555 0142',
    website: 'https://northfield.example.test',
    orderingNotes:
      'Order by e-mail quoting club account NF-0042. Orders placed before 14:00 ship the same day; hazardous goods go by a separate carrier on Tuesdays and Thursdays.',
    minimumOrderMinor: 5000,
    shippingFeeMinor: 995,
    hazardousFeeMinor: 1800,
    items: [
      item('NLS-1001', 'Salicylic acid', 250, 'g', 1490, {
        grade: 'ACS reagent',
        purityPercent: 99.5,
      }),
      item('NLS-1002', 'Salicylic acid', 1, 'kg', 3950, {
        grade: 'ACS reagent',
        purityPercent: 99.5,
      }),
      item('NLS-1101', 'Acetic anhydride', 500, 'mL', 2840, { purityPercent: 99, hazardous: true }),
      item('NLS-1201', 'Isoamyl alcohol', 500, 'mL', 2290, {
        purityPercent: 98.5,
        hazardous: true,
      }),
      item('NLS-1301', 'Benzaldehyde', 250, 'mL', 1980, { purityPercent: 99, hazardous: true }),
      item('NLS-1401', 'Sodium hydroxide', 500, 'g', 1260, {
        grade: 'Pellets, reagent',
        purityPercent: 98,
        hazardous: true,
      }),
      item('NLS-1501', 'Sodium chloride', 1, 'kg', 690, { grade: 'Laboratory', purityPercent: 99 }),
      item('NLS-1601', 'Copper(II) sulfate pentahydrate', 500, 'g', 1740, {
        purityPercent: 99,
        hazardous: true,
      }),
      item('NLS-1701', 'Ethanol', 1, 'L', 1580, {
        grade: 'Absolute',
        purityPercent: 99.8,
        hazardous: true,
        splittable: false,
      }),
    ],
  },
  {
    name: 'Harbour Chemicals Co.',
    contactName: 'Customer service',
    email: 'service@harbour-chemicals.example.test',
    phone: '+00 555 0199',
    website: 'https://harbour-chemicals.example.test',
    orderingNotes:
      'Web shop with the school account; pay by invoice within 30 days. Acids ship in outer packaging only, so allow a week.',
    minimumOrderMinor: 0,
    shippingFeeMinor: 1250,
    hazardousFeeMinor: 2200,
    items: [
      item('HC-20-050', 'Sulfuric acid 98 %', 1, 'L', 2450, {
        purityPercent: 98,
        hazardous: true,
        splittable: false,
      }),
      item('HC-20-110', 'Hydrochloric acid 37 %', 1, 'L', 1890, {
        purityPercent: 37,
        hazardous: true,
        splittable: false,
      }),
      item('HC-30-200', 'Acetone', 1, 'L', 1140, {
        grade: 'Technical',
        purityPercent: 99.5,
        hazardous: true,
      }),
      item('HC-30-210', 'Ethyl acetate', 1, 'L', 1320, { purityPercent: 99.5, hazardous: true }),
      item('HC-40-001', 'Salicylic acid', 500, 'g', 2360, {
        grade: 'Technical',
        purityPercent: 99,
      }),
      item('HC-40-010', 'Sodium bicarbonate', 1, 'kg', 780, {
        grade: 'Laboratory',
        purityPercent: 99,
      }),
      item('HC-50-100', 'Acetic acid, glacial', 1, 'L', 1650, {
        purityPercent: 99.8,
        hazardous: true,
      }),
      item('HC-50-300', 'Potassium permanganate', 250, 'g', 2190, {
        purityPercent: 99,
        hazardous: true,
      }),
    ],
  },
];

/**
 * Writes the demo suppliers and their price lists, checked with the API's own schemas.
 * Answers each supplier's id and its catalogue items' ids by SKU, for demo orders built on top.
 */
export async function seedDemoSuppliers(
  repos: Repositories,
  chemicals: Pick<Chemical, 'id' | 'name'>[],
  currency: string,
): Promise<Map<string, { id: number; items: Map<string, number> }>> {
  const now = nowIso();
  const chemicalId = new Map(chemicals.map((c) => [c.name, c.id]));
  const seeded = new Map<string, { id: number; items: Map<string, number> }>();
  for (const { items, ...fields } of demoSuppliers) {
    const supplier = supplierCreateSchema.parse(fields);
    const supplierId = await repos.suppliers.insertSupplier({
      ...supplier,
      archived: false,
      createdAt: now,
      updatedAt: now,
    });
    const ids = new Map<string, number>();
    for (const { chemical, ...rest } of items) {
      const id = chemicalId.get(chemical);
      if (id === undefined)
        throw new Error(`The demo price list names ${chemical}, which the demo lab lacks`);
      const values = catalogItemCreateSchema.parse({ ...rest, supplierId, chemicalId: id });
      ids.set(
        rest.sku,
        await repos.suppliers.insertItem({
          ...values,
          currency,
          discontinued: false,
          createdAt: now,
          updatedAt: now,
        }),
      );
    }
    seeded.set(supplier.name, { id: supplierId, items: ids });
  }
  return seeded;
}
