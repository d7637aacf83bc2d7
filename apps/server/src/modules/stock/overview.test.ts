import { stockListQuerySchema, type StockListQuery } from '@lotwise/shared';
import { beforeAll, describe, expect, it } from 'vitest';
import { fromMicro, microPerUnit } from '../../db/quantities';
import { generateLabIn, smallLab, type GeneratedLab } from '../../test/generated-lab';
import { testContext } from '../../test/harness';
import type { StockRow } from './stock.repository';

interface Chemical {
  id: number;
  name: string;
  search_text: string;
  storage_group: string;
  reorder_point: number | null;
}
interface Container {
  chemical_id: number;
  status: string;
  expires_on: string | null;
  quantity_micro: number;
  id_path: string;
}

let lab: GeneratedLab;
let chemicals: Chemical[];
let containers: Container[];

beforeAll(async () => {
  const { dataSource } = testContext();
  lab = await generateLabIn(dataSource, {
    ...smallLab,
    chemicals: 700,
    plans: 0,
    runs: 0,
    outbox: 0,
    audit: 0,
    orders: 0,
  });
  chemicals = await dataSource.query(
    'SELECT id, name, search_text, storage_group, reorder_point FROM chemicals',
  );
  containers = await dataSource.query(
    'SELECT c.chemical_id, c.status, c.expires_on, c.quantity_micro, l.id_path FROM containers c JOIN locations l ON l.id = c.location_id',
  );
});

/**
 * The overview worked out the long way, in plain code: every chemical's containers summed,
 * filtered, sorted, then paged.
 */
function everythingThenPage(
  query: StockListQuery,
  context: { today: string; locationIdPath?: string; expiringBefore?: string },
): { rows: Partial<StockRow>[]; total: number } {
  const { today, locationIdPath, expiringBefore } = context;
  const usable = (c: Container) =>
    (c.status === 'sealed' || c.status === 'open') &&
    (c.expires_on === null || c.expires_on >= today);
  let rows = chemicals.map((chemical) => {
    const held = containers.filter(
      (c) =>
        c.chemical_id === chemical.id &&
        c.status !== 'disposed' &&
        (!locationIdPath || c.id_path.startsWith(locationIdPath)),
    );
    const usableHeld = held.filter(usable);
    const totalMicro = usableHeld.reduce((sum, c) => sum + Number(c.quantity_micro), 0);
    const expiries = usableHeld.map((c) => c.expires_on).filter((d): d is string => d !== null);
    return {
      chemical,
      totalMicro,
      row: {
        id: chemical.id,
        name: chemical.name,
        total: fromMicro(totalMicro),
        containerCount: held.length,
        usableContainerCount: usableHeld.length,
        expiredContainerCount: held.filter(
          (c) =>
            (c.status === 'sealed' || c.status === 'open') &&
            c.expires_on !== null &&
            c.expires_on < today,
        ).length,
        nextExpiresOn: expiries.length ? expiries.sort()[0]! : null,
      },
      expiring: expiringBefore
        ? usableHeld.filter((c) => c.expires_on !== null && c.expires_on <= expiringBefore).length
        : 0,
    };
  });
  const needle = query.q.toLowerCase();
  rows = rows.filter(({ chemical, row, totalMicro, expiring }) => {
    if (needle && !chemical.search_text.includes(needle)) return false;
    if (query.storageGroup && chemical.storage_group !== query.storageGroup) return false;
    if (locationIdPath && row.containerCount === 0) return false;
    if (expiringBefore && expiring === 0) return false;
    const below =
      chemical.reorder_point !== null &&
      totalMicro <= Math.round(chemical.reorder_point * microPerUnit);
    if (query.belowReorderPoint !== undefined && below !== query.belowReorderPoint) return false;
    return true;
  });
  const [field, direction] = query.sort.split('.') as [string, 'asc' | 'desc'];
  const sign = direction === 'desc' ? -1 : 1;
  const key = (entry: (typeof rows)[number]): string | number | null =>
    field === 'name'
      ? entry.chemical.name.toLowerCase()
      : field === 'total'
        ? entry.totalMicro
        : field === 'containerCount'
          ? entry.row.containerCount
          : entry.row.nextExpiresOn;
  rows.sort((a, b) => {
    const ka = key(a);
    const kb = key(b);
    if (ka !== kb) {
      if (ka === null) return 1; // no expiry last, in both directions
      if (kb === null) return -1;
      return (ka < kb ? -1 : 1) * sign;
    }
    return a.chemical.id - b.chemical.id;
  });
  const start = (query.page - 1) * query.pageSize;
  return { rows: rows.slice(start, start + query.pageSize).map((r) => r.row), total: rows.length };
}

describe('stock overview, page first', () => {
  const cases: [string, Record<string, string>, 'cabinet' | 'room' | null, number | null][] = [
    ['by name', {}, null, null],
    ['by name, a later page', { page: '5' }, null, null],
    ['by name, descending, searched', { sort: 'name.desc', q: 'acid' }, null, null],
    ['by storage group', { storageGroup: 'flammable' }, null, null],
    ['by total, descending', { sort: 'total.desc' }, null, null],
    ['by total, page 3', { sort: 'total.asc', page: '3' }, null, null],
    ['by container count', { sort: 'containerCount.desc', page: '2' }, null, null],
    ['by next expiry', { sort: 'nextExpiresOn.asc', page: '2' }, null, null],
    ['by next expiry, descending', { sort: 'nextExpiresOn.desc', page: '4' }, null, null],
    ['below the reorder point', { belowReorderPoint: 'true' }, null, null],
    [
      'below the reorder point, by total',
      { belowReorderPoint: 'true', sort: 'total.desc' },
      null,
      null,
    ],
    ['not below the reorder point', { belowReorderPoint: 'false', page: '2' }, null, null],
    [
      'below the reorder point, past the last page',
      { belowReorderPoint: 'true', page: '90' },
      null,
      null,
    ],
    ['by name, past the last page', { page: '90' }, null, null],
    ['in a cabinet', {}, 'cabinet', null],
    ['in a room, by total', { sort: 'total.desc' }, 'room', null],
    ['in a room, below the reorder point', { belowReorderPoint: 'true' }, 'room', null],
    ['expiring within 60 days', {}, null, 60],
    [
      'expiring within 90 days in a room, by next expiry',
      { sort: 'nextExpiresOn.asc' },
      'room',
      90,
    ],
    ['searched and below the reorder point', { q: 'oxide', belowReorderPoint: 'true' }, null, null],
  ];

  it.each(cases)(
    'when the overview is asked %s, then the page, its totals, order and count equal summing everything first',
    async (_label, params, place, expiringDays) => {
      const { store } = testContext();
      const query = stockListQuerySchema.parse({ pageSize: '40', ...params });
      const locationIdPath =
        place === null
          ? undefined
          : `/${place === 'room' ? lab.locationIds.rooms[1] : `${lab.locationIds.rooms[0]}/${lab.locationIds.cabinets[2]}`}/`;
      const expiringBefore =
        expiringDays === null
          ? undefined
          : new Date(Date.parse(lab.today) + expiringDays * 86_400_000).toISOString().slice(0, 10);
      const context = { today: lab.today, locationIdPath, expiringBefore };
      const expected = everythingThenPage(query, context);
      const actual = await store.repos.stock.overview(query, context);
      expect(expected.total).toBeGreaterThan(0);
      expect(actual.total).toBe(expected.total);
      expect(
        actual.rows.map((row) => ({
          id: row.id,
          name: row.name,
          total: row.total,
          containerCount: row.containerCount,
          usableContainerCount: row.usableContainerCount,
          expiredContainerCount: row.expiredContainerCount,
          nextExpiresOn: row.nextExpiresOn,
        })),
      ).toEqual(expected.rows);
    },
  );
});
