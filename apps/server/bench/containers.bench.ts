import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { addDays } from '@lotwise/chem';
import { formatLabelCode, todayIso } from '@lotwise/shared';
import request from 'supertest';
import { afterAll, bench, describe } from 'vitest';
import { createApp } from '../src/app';
import { createDataSource } from '../src/db/data-source';
import { openStore } from '../src/db/repositories';
import { hashPassword } from '../src/modules/auth/passwords';
import { testConfig } from '../src/test/harness';

const containerCount = 100_000;
const chemicalCount = 500;
const locationCount = 120;
const groups = ['low-hazard', 'flammable', 'oxidizer', 'base', 'inorganic-acid', 'organic-acid'];
const statuses = ['sealed', 'open', 'open', 'open', 'empty', 'disposed'];

const dir = mkdtempSync(path.join(tmpdir(), 'lotwise-bench-'));
const config = testConfig(dir);
const dataSource = createDataSource(config.databasePath);
await dataSource.initialize();
await dataSource.runMigrations({ transaction: 'all' });
const store = openStore(dataSource);
const today = todayIso();
const now = new Date().toISOString();

/** Raw multi-row INSERTs in one transaction: the fast way to fill 100,000 rows for a bench. */
async function insertRows(table: string, columns: string[], rows: unknown[][]) {
  const perStatement = Math.floor(30000 / columns.length);
  for (let start = 0; start < rows.length; start += perStatement) {
    const chunk = rows.slice(start, start + perStatement);
    const placeholders = chunk.map(() => `(${columns.map(() => '?').join(', ')})`).join(', ');
    await dataSource.query(
      `INSERT INTO ${table} (${columns.join(', ')}) VALUES ${placeholders}`,
      chunk.flat(),
    );
  }
}

const seedStarted = performance.now();
await dataSource.transaction(async () => {
  await insertRows(
    'chemicals',
    [
      'name',
      'synonyms',
      'cas_number',
      'formula',
      'molar_mass',
      'physical_state',
      'density',
      'default_purity_percent',
      'ghs_pictograms',
      'hazard_statements',
      'storage_group',
      'peroxide_class',
      'stock_unit',
      'reorder_point',
      'reorder_quantity',
      'restricted',
      'notes',
      'search_text',
      'extra_hazard_groups',
      'created_at',
      'updated_at',
    ],
    Array.from({ length: chemicalCount }, (_, i) => [
      `Bench reagent ${i}`,
      JSON.stringify([`bench synonym ${i}`]),
      null,
      'NaCl',
      58.44,
      i % 2 ? 'liquid' : 'solid',
      i % 2 ? 0.9 : null,
      100,
      '["GHS07"]',
      '[]',
      groups[i % groups.length],
      i % 25 === 0 ? 'B' : null,
      i % 2 ? 'mL' : 'g',
      i % 3 === 0 ? 50000 : null,
      null,
      0,
      '',
      `bench reagent ${i}\nbench synonym ${i}\nnacl`,
      '[]',
      now,
      now,
    ]),
  );
  await insertRows(
    'locations',
    [
      'name',
      'kind',
      'parent_id',
      'path',
      'id_path',
      'depth',
      'storage_groups',
      'notes',
      'created_at',
      'updated_at',
    ],
    Array.from({ length: locationCount }, (_, i) => {
      const room = Math.floor(i / 40) + 1; // rooms are ids 1, 41, 81
      const isRoom = i % 40 === 0;
      return [
        isRoom ? `Room ${room}` : `Shelf ${i}`,
        isRoom ? 'room' : 'shelf',
        isRoom ? null : (room - 1) * 40 + 1,
        isRoom ? `Room ${room}` : `Room ${room} › Shelf ${i}`,
        isRoom ? `/${i + 1}/` : `/${(room - 1) * 40 + 1}/${i + 1}/`,
        isRoom ? 0 : 1,
        JSON.stringify([groups[i % groups.length]]),
        '',
        now,
        now,
      ];
    }),
  );
  await insertRows(
    'lots',
    [
      'chemical_id',
      'source',
      'supplier_name',
      'supplier_lot_number',
      'grade',
      'purity_percent',
      'received_on',
      'expires_on',
      'notes',
      'created_at',
      'updated_at',
    ],
    Array.from({ length: chemicalCount * 4 }, (_, i) => [
      (i % chemicalCount) + 1,
      'purchased',
      'Northgate Lab Supply (fictional)',
      `B-${i}`,
      'Laboratory reagent',
      null,
      addDays(today, -400 + (i % 300)),
      addDays(today, -60 + ((i * 7) % 900)),
      '',
      now,
      now,
    ]),
  );
  const containers: unknown[][] = [];
  const entries: unknown[][] = [];
  for (let i = 0; i < containerCount; i++) {
    const lot = (i % (chemicalCount * 4)) + 1;
    const chemical = ((lot - 1) % chemicalCount) + 1;
    const quantity = (i % 997) + 1;
    // Stored as whole millionths of the unit (see src/db/quantities.ts).
    const quantityMicro = quantity * 1_000_000;
    const expires = addDays(today, -60 + (((lot - 1) * 7) % 900));
    containers.push([
      formatLabelCode(i + 1),
      i + 1,
      lot,
      chemical,
      (i % (locationCount - 3)) + 2,
      statuses[i % statuses.length],
      quantityMicro,
      chemical % 2 === 0 ? 'mL' : 'g',
      150,
      expires,
      '',
      now,
      now,
    ]);
    entries.push([
      i + 1,
      'received',
      quantityMicro,
      chemical % 2 === 0 ? 'mL' : 'g',
      quantityMicro,
      '',
      now,
    ]);
  }
  await insertRows(
    'containers',
    [
      'label_code',
      'label_number',
      'lot_id',
      'chemical_id',
      'location_id',
      'status',
      'quantity_micro',
      'unit',
      'tare_mass',
      'expires_on',
      'notes',
      'created_at',
      'updated_at',
    ],
    containers,
  );
  await insertRows(
    'ledger_entries',
    [
      'container_id',
      'reason',
      'quantity_micro',
      'unit',
      'balance_after_micro',
      'note',
      'created_at',
    ],
    entries,
  );
});
// Room 41 (about a third of the containers, half of them liquids of Class IB) is a lab area.
await dataSource.query(
  "UPDATE chemicals SET flash_point_c = 13, boiling_point_c = 78 WHERE physical_state = 'liquid'",
);
await dataSource.query("UPDATE locations SET flammable_storage = 'cabinet' WHERE id % 2 = 0");
const labAreaId = await store.repos.labAreas.insert({
  locationId: 41,
  kind: 'lab-unit',
  unitClass: 'A',
  floorArea: 400,
  floorAreaUnit: 'm2',
  storey: 1,
  instructional: false,
  flammableRuleSetId: (await store.repos.ruleSets.builtIn('flammable-limits'))!.id,
  containerSizeRuleSetId: (await store.repos.ruleSets.builtIn('container-sizes'))!.id,
  notes: '',
  createdAt: now,
  updatedAt: now,
});
await dataSource.query('ANALYZE');
console.log(
  `seeded ${containerCount.toLocaleString('en')} containers in ${Math.round(performance.now() - seedStarted)} ms`,
);

await store.repos.users.insert({
  email: 'bench@example.test',
  displayName: 'Bench',
  role: 'admin',
  active: true,
  passwordHash: await hashPassword('bench-password', 4),
  inviteTokenHash: null,
  inviteExpiresAt: null,
  lastLoginAt: null,
  createdAt: now,
  updatedAt: now,
});
const app = createApp({ dataSource, config });
const login = await request(app)
  .post('/api/auth/login')
  .send({ email: 'bench@example.test', password: 'bench-password' });
const cookie = String([login.headers['set-cookie']].flat()[0]).split(';')[0]!;
const get = (url: string) => request(app).get(url).set('Cookie', cookie).expect(200);

afterAll(async () => {
  await dataSource.destroy();
  rmSync(dir, { recursive: true, force: true });
});

describe(`GET /api/containers on ${containerCount.toLocaleString('en')} containers (HTTP, in-process)`, () => {
  bench('first page, default sort (label code)', async () => {
    await get('/api/containers');
  });
  bench('location subtree + status + expiring within 30 days, sort expiresOn', async () => {
    await get('/api/containers?locationId=1&status=open&expiringWithinDays=30&sort=expiresOn.asc');
  });
  bench('storage group + sort chemical, page 20', async () => {
    await get('/api/containers?storageGroup=flammable&sort=chemical.asc&page=20');
  });
  bench('search "synonym 12" (chemical) + sort quantity desc', async () => {
    await get('/api/containers?q=synonym%2012&sort=quantity.desc');
  });
  bench('below reorder point', async () => {
    await get('/api/containers?belowReorderPoint=true');
  });
  bench('exact label code', async () => {
    await get('/api/containers?q=LW-54321');
  });
});

describe(`lab areas on ${containerCount.toLocaleString('en')} containers`, () => {
  bench('GET /api/lab-areas (totals of a room holding a third of them)', async () => {
    await get('/api/lab-areas');
  });
  bench('GET /api/lab-areas/:id (every counted container listed)', async () => {
    await get(`/api/lab-areas/${labAreaId}`);
  });
});

describe(`stock overview on ${containerCount.toLocaleString('en')} containers`, () => {
  bench('GET /api/stock (first page by name)', async () => {
    await get('/api/stock');
  });
  bench('GET /api/stock?belowReorderPoint=true&locationId=41', async () => {
    await get('/api/stock?belowReorderPoint=true&locationId=41');
  });
  bench('GET /api/search?q=LW-00042', async () => {
    await get('/api/search?q=LW-00042');
  });
});
