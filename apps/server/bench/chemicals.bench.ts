import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { casCheckDigit } from '@lotwise/chem';
import {
  chemicalListQuerySchema,
  type ChemicalCreateParsed,
  type ChemicalListQuery,
} from '@lotwise/shared';
import request from 'supertest';
import { afterAll, bench, describe } from 'vitest';
import { createApp } from '../src/app';
import { createDataSource } from '../src/db/data-source';
import { openStore } from '../src/db/repositories';
import { hashPassword } from '../src/modules/auth/passwords';
import { newChemicalValues } from '../src/modules/chemicals/chemicals.service';
import { testConfig } from '../src/test/harness';

const count = 10_000;
const stems = ['acid', 'chloride', 'sulfate', 'nitrate', 'acetate', 'oxide', 'alcohol', 'ester'];
const formulas = ['NaCl', 'C2H6O', 'CuSO4·5H2O', 'C9H8O4', 'KMnO4', 'H2SO4', 'C6H14', 'NaHCO3'];
const states = ['solid', 'liquid', 'solution'] as const;
const groups = ['low-hazard', 'flammable', 'oxidizer', 'base', 'inorganic-acid'] as const;

function chemical(i: number): ChemicalCreateParsed {
  const digits = String(100000 + i);
  const cas = `${digits.slice(0, -2)}-${digits.slice(-2)}-${casCheckDigit(digits)}`;
  const state = states[i % states.length]!;
  return {
    name: `Bench ${stems[i % stems.length]} ${i}`,
    synonyms: [`bench synonym ${i}`, `${stems[(i + 3) % stems.length]} no. ${i}`],
    casNumber: cas,
    formula: formulas[i % formulas.length]!,
    physicalState: state,
    density: state === 'solid' ? null : 0.8 + (i % 50) / 100,
    bulkDensity: null,
    defaultPurityPercent: 100,
    ghsPictograms: i % 3 === 0 ? ['GHS02', 'GHS07'] : ['GHS05'],
    hazardStatements: ['H225'],
    storageGroup: groups[i % groups.length]!,
    peroxideClass: null,
    stockUnit: state === 'solid' ? 'g' : 'mL',
    reorderPoint: i % 7 === 0 ? null : i % 500,
    reorderQuantity: null,
    restricted: false,
    notes: '',
    flashPointC: state === 'solid' ? null : 10 + (i % 80),
    boilingPointC: state === 'solid' ? null : 120,
    flashPointSource: '',
    boilingPointSource: '',
  };
}

const dir = mkdtempSync(path.join(tmpdir(), 'lotwise-bench-'));
const config = testConfig(dir);
const dataSource = createDataSource(config.databasePath);
await dataSource.initialize();
await dataSource.runMigrations({ transaction: 'all' });
const store = openStore(dataSource);
await store.transaction(async (repos) => {
  for (let i = 0; i < count; i++) await repos.chemicals.insert(newChemicalValues(chemical(i)));
});
await store.repos.users.insert({
  email: 'bench@example.test',
  displayName: 'Bench',
  role: 'viewer',
  active: true,
  passwordHash: await hashPassword('bench-password', 4),
  inviteTokenHash: null,
  inviteExpiresAt: null,
  lastLoginAt: null,
  createdAt: new Date().toISOString(),
  updatedAt: new Date().toISOString(),
});
const app = createApp({ dataSource, config });
const login = await request(app)
  .post('/api/auth/login')
  .send({ email: 'bench@example.test', password: 'bench-password' });
const cookie = String([login.headers['set-cookie']].flat()[0]).split(';')[0]!;

afterAll(async () => {
  await dataSource.destroy();
  rmSync(dir, { recursive: true, force: true });
});

const query = (raw: Record<string, string>): ChemicalListQuery =>
  chemicalListQuerySchema.parse(raw);
const cases: [string, ChemicalListQuery][] = [
  ['first page, default sort (name)', query({})],
  ['search "acid" + sort name + page 3', query({ q: 'acid', sort: 'name.asc', page: '3' })],
  ['search by CAS fragment + sort molar mass desc', query({ q: '12-3', sort: 'molarMass.desc' })],
  [
    'search synonym + pictogram + storage group + sort updatedAt',
    query({
      q: 'synonym 9',
      pictogram: 'GHS02',
      storageGroup: 'flammable',
      sort: 'updatedAt.desc',
    }),
  ],
  ['search with no match', query({ q: 'no such reagent' })],
];

describe(`chemicals list query on ${count.toLocaleString('en')} chemicals (repository)`, () => {
  for (const [name, q] of cases) {
    bench(name, async () => {
      await store.repos.chemicals.list(q);
    });
  }
});

describe(`GET /api/chemicals on ${count.toLocaleString('en')} chemicals (HTTP, in-process)`, () => {
  bench('search "acid" + sort name + page 3, pageSize 25', async () => {
    await request(app)
      .get('/api/chemicals?q=acid&sort=name.asc&page=3')
      .set('Cookie', cookie)
      .expect(200);
  });
  bench('first page, pageSize 200', async () => {
    await request(app).get('/api/chemicals?pageSize=200').set('Cookie', cookie).expect(200);
  });
});
