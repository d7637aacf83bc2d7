import Database from 'better-sqlite3';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { formatLabelCode } from '@lotwise/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { searchTextOf } from '../../apps/server/src/modules/chemicals/chemicals.service';
import { selfCheck } from './check';
import { generateLab, type GeneratedLab } from './generate';

const dir = mkdtempSync(path.join(tmpdir(), 'lotwise-bench-test-'));
const databasePath = path.join(dir, 'lab.sqlite');
let lab: GeneratedLab;
let db: Database.Database;

beforeAll(async () => {
  lab = await generateLab(databasePath, { scale: 0.005 });
  db = new Database(databasePath);
});
afterAll(() => {
  db.close();
  rmSync(dir, { recursive: true, force: true });
});

describe('generateLab', () => {
  it('when a tiny lab is generated, then it holds the sizes asked for and about ten ledger rows a container', () => {
    expect(lab.counts).toMatchObject({
      chemicals: lab.size.chemicals,
      containers: lab.size.containers,
      lots: lab.size.chemicals * lab.size.lotsPerChemical,
      procedures: lab.size.procedures,
      procedureLines: lab.size.procedures * 4,
      users: 5,
    });
    expect(lab.counts.ledgerEntries / lab.counts.containers).toBeGreaterThan(8);
    expect(lab.counts.ledgerEntries / lab.counts.containers).toBeLessThan(13);
  });

  it('when a tiny lab is generated, then every balance is the sum of its ledger and statuses agree with balances', () => {
    expect(() => selfCheck(db)).not.toThrow();
    const statuses = db
      .prepare(
        'SELECT status, MIN(quantity_micro) AS low, MAX(quantity_micro) AS high FROM containers GROUP BY status',
      )
      .all() as { status: string; low: number; high: number }[];
    const byStatus = Object.fromEntries(statuses.map((row) => [row.status, row]));
    expect(byStatus.empty).toMatchObject({ low: 0, high: 0 });
    expect(byStatus.disposed).toMatchObject({ low: 0, high: 0 });
    expect(byStatus.open!.low).toBeGreaterThan(0);
    expect(byStatus.sealed!.low).toBeGreaterThan(0);
  });

  it('when a tiny lab is generated, then chemicals carry the search key and containers the label codes Lotwise writes', () => {
    const chemical = db
      .prepare(
        'SELECT name, synonyms, cas_number AS cas, formula, search_text AS searchText FROM chemicals WHERE id = 7',
      )
      .get() as {
      name: string;
      synonyms: string;
      cas: string | null;
      formula: string | null;
      searchText: string;
    };
    expect(chemical.searchText).toBe(
      searchTextOf({
        name: chemical.name,
        synonyms: JSON.parse(chemical.synonyms),
        casNumber: chemical.cas,
        formula: chemical.formula,
      }),
    );
    const container = db
      .prepare('SELECT label_code AS code, label_number AS n FROM containers WHERE id = 123')
      .get() as { code: string; n: number };
    expect(container.code).toBe(formatLabelCode(container.n));
  });

  it('when a stored balance no longer matches its ledger, then the self-check fails loudly', () => {
    db.prepare(
      "UPDATE containers SET quantity_micro = quantity_micro + 1 WHERE status = 'open' AND id = (SELECT MIN(id) FROM containers WHERE status = 'open')",
    ).run();
    try {
      expect(() => selfCheck(db)).toThrow(/not the sum of their ledger/);
    } finally {
      db.prepare(
        "UPDATE containers SET quantity_micro = quantity_micro - 1 WHERE status = 'open' AND id = (SELECT MIN(id) FROM containers WHERE status = 'open')",
      ).run();
    }
  });
});
