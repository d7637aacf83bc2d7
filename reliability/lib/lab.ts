import { randomUUID } from 'node:crypto';
import type { ApiClient } from './api';

/**
 * Stock a test needs, made through the API as a manager would. Names carry a short random
 * tag so tests sharing a database (RELIABILITY_DATABASE_URL) do not collide. The chemicals
 * are invented test stock; their hazards are given as for the real substances they resemble.
 */
export function labMaker(manager: ApiClient) {
  const tag = randomUUID().slice(0, 6);
  const today = new Date().toISOString().slice(0, 10);
  return {
    tag,
    async shelf(name = 'Reliability shelf'): Promise<{ id: number; path: string }> {
      return manager.json('POST', '/api/locations', { name: `${name} ${tag}` });
    },
    async chemical(
      name: string,
      extra: Record<string, unknown> = {},
    ): Promise<{ id: number; name: string }> {
      return manager.json('POST', '/api/chemicals', {
        name: `${name} ${tag}`,
        physicalState: 'solid',
        stockUnit: 'g',
        ghsPictograms: ['GHS07'],
        hazardStatements: ['H302'],
        ...extra,
      });
    },
    async lot(chemicalId: number): Promise<{ id: number }> {
      return manager.json('POST', '/api/lots', {
        chemicalId,
        supplierName: 'Fictional Reagents Ltd (invented)',
        receivedOn: today,
      });
    },
    async container(
      lotId: number,
      locationId: number,
      quantity: number,
    ): Promise<{ id: number; labelCode: string }> {
      const made = await manager.json<{ container: { id: number; labelCode: string } }>(
        'POST',
        '/api/containers',
        { lotId, locationId, quantity, unit: 'g', status: 'open', openedOn: today },
      );
      return made.container;
    },
    /** A one-reagent procedure: `reagentGrams` of the reagent give the product (1:1). */
    async procedure(reagentId: number, productId: number, reagentGrams: number) {
      return manager.json<{ id: number }>('POST', '/api/procedures', {
        title: `Reliability preparation ${tag}`,
        reference: 'Invented for the reliability suite',
        baseScale: `${reagentGrams} g of reagent`,
        cautions: 'Test procedure: follow the SDS of every reagent and local rules.',
        lines: [
          {
            chemicalId: reagentId,
            role: 'limiting-reagent',
            quantity: reagentGrams,
            unit: 'g',
            coefficient: 1,
          },
          { chemicalId: productId, role: 'product', coefficient: 1 },
        ],
      });
    },
  };
}
