import Database from 'better-sqlite3';
import { addDays } from '@lotwise/chem';
import { formatLabelCode, storageGroupCodes, type StorageGroup } from '@lotwise/shared';
import { createDataSource } from '../../apps/server/src/db/data-source';
import { hashPassword } from '../../apps/server/src/modules/auth/passwords';
import {
  molarMassOf,
  searchTextOf,
  storedFormula,
} from '../../apps/server/src/modules/chemicals/chemicals.service';
import { countRows, selfCheck, type LabCounts } from './check';
import {
  benchCasNumber,
  benchChemicalName,
  benchFormulas,
  benchPassword,
  benchUsers,
  labSize,
  locationTree,
  seededRandom,
  type LabSize,
} from './shape';

const micro = 1_000_000;
const dayMs = 86_400_000;

/** What was generated, as counted in the file afterwards. */
export interface GeneratedLab {
  size: LabSize;
  counts: LabCounts;
  /** Wall time of the whole generation (migrations, inserts, self-check), ms. */
  milliseconds: number;
  /** The procedure the bench plans and records runs of (its drawn lines have open stock). */
  benchProcedureId: number;
}

type Status = 'sealed' | 'open' | 'empty' | 'disposed';

/** sealed 20 %, open 55 %, empty 15 %, disposed 10 % — a lab with a few years of history. */
function statusOf(roll: number): Status {
  if (roll < 0.2) return 'sealed';
  if (roll < 0.75) return 'open';
  if (roll < 0.9) return 'empty';
  return 'disposed';
}

const iso = (ms: number) => new Date(ms).toISOString();
const isoDate = (ms: number) => iso(ms).slice(0, 10);

/**
 * Generates a lab into a new SQLite file at `databasePath`: the real migrations first, then
 * plain INSERTs through prepared statements in one transaction. Every container's stored
 * quantity is the sum of its ledger entries (whole millionths), each entry's balance is the
 * running sum, statuses agree with balances (empty and disposed hold 0), chemicals carry the
 * search key the chemicals service writes and containers the label codes `formatLabelCode`
 * makes. The file is not analysed: that is the server's job.
 */
export async function generateLab(
  databasePath: string,
  options: { scale?: number; now?: Date; log?: (line: string) => void } = {},
): Promise<GeneratedLab> {
  const started = performance.now();
  const size = labSize(options.scale ?? 1);
  const log = options.log ?? (() => {});
  const nowMs = (options.now ?? new Date()).getTime();
  const now = iso(nowMs);
  const random = seededRandom(20_260_101);

  const dataSource = createDataSource(databasePath);
  await dataSource.initialize();
  await dataSource.runMigrations({ transaction: 'all' });
  await dataSource.destroy();
  log(`migrations applied (${Math.round(performance.now() - started)} ms)`);

  const passwordHash = await hashPassword(benchPassword, 9);
  const db = new Database(databasePath);
  db.pragma('journal_mode = WAL');
  db.pragma('synchronous = OFF');
  db.pragma('foreign_keys = OFF');
  db.pragma('cache_size = -200000');

  const insertUser = db.prepare(
    `INSERT INTO users (id, email, display_name, password_hash, role, active, created_at, updated_at)
     VALUES (?, ?, ?, ?, ?, 1, ?, ?)`,
  );
  const insertChemical = db.prepare(
    `INSERT INTO chemicals (id, name, synonyms, cas_number, formula, molar_mass, physical_state,
       density, default_purity_percent, ghs_pictograms, hazard_statements, storage_group,
       peroxide_class, stock_unit, reorder_point, reorder_quantity, restricted, notes,
       search_text, extra_hazard_groups, created_at, updated_at)
     VALUES (?, ?, ?, ?, ?, ?, ?, ?, 99, ?, ?, ?, NULL, ?, ?, ?, 0, '', ?, '[]', ?, ?)`,
  );
  const insertLocation = db.prepare(
    `INSERT INTO locations (id, name, kind, parent_id, path, id_path, depth, storage_groups, notes,
       created_at, updated_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?, '', ?, ?)`,
  );
  const insertLot = db.prepare(
    `INSERT INTO lots (id, chemical_id, source, supplier_name, supplier_lot_number, grade,
       purity_percent, received_on, expires_on, notes, created_at, updated_at)
     VALUES (?, ?, 'purchased', ?, ?, ?, ?, ?, ?, '', ?, ?)`,
  );
  const insertContainer = db.prepare(
    `INSERT INTO containers (id, label_code, label_number, lot_id, chemical_id, location_id, status,
       unit, tare_mass, capacity, capacity_unit, opened_on, expires_on, peroxide_due_on, notes,
       created_at, updated_at, quantity_micro, owner_id)
     VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, NULL, '', ?, ?, ?, NULL)`,
  );
  const insertEntry = db.prepare(
    `INSERT INTO ledger_entries (container_id, reason, unit, note, user_id, from_location_id,
       created_at, quantity_micro, balance_after_micro) VALUES (?, ?, ?, '', ?, ?, ?, ?, ?)`,
  );
  const insertProcedure = db.prepare(
    `INSERT INTO procedures (id, title, reference, base_scale, expected_yield_percent, cautions,
       caution_flags, created_by_id, created_at, updated_at)
     VALUES (?, ?, 'Invented bench procedure.', 'One bench: 2.0 g of the limiting reagent.', 70, ?, ?, 2, ?, ?)`,
  );
  const insertLine = db.prepare(
    `INSERT INTO procedure_lines (procedure_id, position, chemical_id, role, quantity, unit,
       coefficient, optional, notes) VALUES (?, ?, ?, ?, ?, ?, ?, 0, '')`,
  );

  // Users.
  const userIds: number[] = [];
  db.transaction(() => {
    benchUsers.forEach((user, index) => {
      insertUser.run(index + 1, user.email, user.displayName, passwordHash, user.role, now, now);
      userIds.push(index + 1);
    });
  })();
  const drawers = userIds.slice(1);

  // Chemicals: a third liquids counted in mL, the rest solids in g.
  const chemicals: { unit: 'g' | 'mL'; solid: boolean }[] = [];
  const groupsFor = (solid: boolean): StorageGroup[] =>
    storageGroupCodes.filter((g) =>
      solid
        ? ['low-hazard', 'inorganic-acid', 'base', 'oxidizer'].includes(g)
        : ['flammable', 'organic-acid'].includes(g),
    );
  db.transaction(() => {
    for (let i = 1; i <= size.chemicals; i++) {
      const solid = i % 3 !== 0;
      const name = benchChemicalName(i);
      const synonyms = [`bench reagent ${i}`];
      const casNumber = i % 10 === 0 ? null : benchCasNumber(i);
      const formula = storedFormula(benchFormulas[i % benchFormulas.length]!);
      const groups = groupsFor(solid);
      insertChemical.run(
        i,
        name,
        JSON.stringify(synonyms),
        casNumber,
        formula,
        molarMassOf(formula),
        solid ? 'solid' : 'liquid',
        solid ? null : 0.7 + (i % 60) / 100,
        JSON.stringify(solid ? ['GHS07'] : ['GHS02', 'GHS07']),
        JSON.stringify(solid ? ['H315', 'H319'] : ['H225', 'H319']),
        groups[i % groups.length]!,
        solid ? 'g' : 'mL',
        i % 4 === 0 ? 2000 : null,
        i % 4 === 0 ? 5000 : null,
        searchTextOf({ name, synonyms, casNumber, formula }),
        now,
        now,
      );
      chemicals[i] = { unit: solid ? 'g' : 'mL', solid };
    }
  })();

  // Locations: buildings › rooms › cabinets › shelves, ids in insertion order.
  const shelves: number[] = [];
  let locationId = 0;
  db.transaction(() => {
    const add = (
      name: string,
      kind: string,
      parent: { id: number; path: string; idPath: string; depth: number } | null,
      groups: string[],
    ) => {
      const id = ++locationId;
      const path = parent ? `${parent.path} › ${name}` : name;
      const idPath = `${parent ? parent.idPath : '/'}${id}/`;
      const depth = parent ? parent.depth + 1 : 0;
      insertLocation.run(
        id,
        name,
        kind,
        parent?.id ?? null,
        path,
        idPath,
        depth,
        JSON.stringify(groups),
        now,
        now,
      );
      return { id, path, idPath, depth };
    };
    for (let b = 0; b < locationTree.buildings; b++) {
      const letter = String.fromCharCode(65 + b);
      const building = add(`Building ${letter}`, 'other', null, []);
      for (let r = 1; r <= locationTree.roomsPerBuilding; r++) {
        const room = add(`Room ${letter}${r}0${r}`, 'room', building, []);
        for (let c = 1; c <= locationTree.cabinetsPerRoom; c++) {
          const group = storageGroupCodes[(r + c) % storageGroupCodes.length]!;
          const cabinet = add(`Cabinet ${c}`, 'cabinet', room, [group]);
          for (let s = 1; s <= locationTree.shelvesPerCabinet; s++) {
            shelves.push(add(`Shelf ${s}`, 'shelf', cabinet, [group]).id);
          }
        }
      }
    }
  })();

  // Lots: four per chemical, received over the last three years, some already expired.
  const lotCount = size.chemicals * size.lotsPerChemical;
  const lotReceivedMs: number[] = [];
  const lotExpiresOn: string[] = [];
  const suppliers = ['Northgate Lab Supply (fictional)', 'Fernhill Reagents (fictional)'];
  db.transaction(() => {
    for (let lot = 1; lot <= lotCount; lot++) {
      const chemicalId = Math.floor((lot - 1) / size.lotsPerChemical) + 1;
      const received = nowMs - Math.floor(random() * 3 * 365) * dayMs - 400 * dayMs;
      const expires = addDays(isoDate(received), 365 * 2 + Math.floor(random() * 3 * 365));
      lotReceivedMs[lot] = received;
      lotExpiresOn[lot] = expires;
      insertLot.run(
        lot,
        chemicalId,
        suppliers[lot % suppliers.length]!,
        `BL-${String(lot).padStart(6, '0')}`,
        lot % 3 === 0 ? 'Technical' : 'Laboratory reagent',
        lot % 2 === 0 ? 99.5 : null,
        isoDate(received),
        expires,
        iso(received),
        iso(received),
      );
    }
  })();
  log(`chemicals, places and lots written (${Math.round(performance.now() - started)} ms)`);

  // Containers and their ledgers: received, then draws, then emptied or disposed.
  let entries = 0;
  db.transaction(() => {
    for (let c = 1; c <= size.containers; c++) {
      const lot = ((c - 1) % lotCount) + 1;
      const chemicalId = Math.floor((lot - 1) / size.lotsPerChemical) + 1;
      const { unit } = chemicals[chemicalId]!;
      const location = shelves[Math.floor(random() * shelves.length)]!;
      const status = statusOf(random());
      const received = lotReceivedMs[lot]! + Math.floor(random() * 30) * dayMs;
      const initial = (500 + Math.floor(random() * 2000)) * micro;
      const draws =
        status === 'open'
          ? 10 + Math.floor(random() * 9)
          : status === 'empty'
            ? 8
            : status === 'disposed'
              ? 2
              : 0;
      const step = Math.max(1, Math.floor((nowMs - received) / (draws + 2)));
      const ledger: [reason: string, quantity: number, user: number | null, at: number][] = [
        ['received', initial, drawers[0]!, received],
      ];
      let balance = initial;
      for (let j = 1; j <= draws; j++) {
        // 1 to 21 units with a fraction: never more than 400 units over 18 draws.
        const amount = (1 + Math.floor(random() * 20)) * micro + Math.floor(random() * 1000) * 1000;
        balance -= amount;
        ledger.push(['drawn', -amount, drawers[(c + j) % drawers.length]!, received + j * step]);
      }
      if (status === 'empty')
        ledger.push([
          'drawn',
          -balance,
          drawers[c % drawers.length]!,
          received + (draws + 1) * step,
        ]);
      if (status === 'disposed')
        ledger.push(['disposed', -balance, drawers[0]!, received + (draws + 1) * step]);
      if (status === 'empty' || status === 'disposed') balance = 0;
      const last = ledger[ledger.length - 1]![3];
      insertContainer.run(
        c,
        formatLabelCode(c),
        c,
        lot,
        chemicalId,
        location,
        status,
        unit,
        unit === 'g' ? 100 + (c % 400) : null,
        initial / micro,
        unit,
        status === 'sealed' ? null : isoDate(received + step),
        lotExpiresOn[lot]!,
        iso(received),
        iso(last),
        balance,
      );
      let running = 0;
      for (const [reason, quantity, user, at] of ledger) {
        running += quantity;
        insertEntry.run(
          c,
          reason,
          unit,
          user,
          reason === 'disposed' ? location : null,
          iso(at),
          quantity,
          running,
        );
        entries++;
      }
    }
  })();
  log(
    `${size.containers.toLocaleString('en')} containers and ${entries.toLocaleString('en')} ledger entries written (${Math.round(performance.now() - started)} ms)`,
  );

  // Procedures: limiting reagent, reagent (solids), solvent (liquid), product. Their chemicals
  // have open stock, so a plan's stock check finds containers and a run has something to draw.
  const stocked = (solid: boolean) =>
    (
      db
        .prepare(
          `SELECT c.chemical_id AS id FROM containers c JOIN chemicals ch ON ch.id = c.chemical_id
           WHERE c.status = 'open' AND c.quantity_micro >= 100000000 AND ch.physical_state = ?
           GROUP BY c.chemical_id HAVING COUNT(*) >= 6 ORDER BY c.chemical_id`,
        )
        .all(solid ? 'solid' : 'liquid') as { id: number }[]
    ).map((row) => row.id);
  const solids = stocked(true);
  const liquids = stocked(false);
  if (solids.length < 3 || liquids.length < 1)
    throw new Error('The generated lab has too little open stock for procedures.');
  db.transaction(() => {
    for (let p = 1; p <= size.procedures; p++) {
      const pick = (list: number[], k: number) => list[(p * 7 + k * 13) % list.length]!;
      const limiting = pick(solids, 0);
      let reagent = pick(solids, 1);
      if (reagent === limiting) reagent = solids[(solids.indexOf(limiting) + 1) % solids.length]!;
      const solvent = pick(liquids, 2);
      const product = ((p * 31) % size.chemicals) + 1;
      insertProcedure.run(
        p,
        `Bench preparation ${String(p).padStart(3, '0')}`,
        'Work in the fume hood; the solvent is flammable: heat with a mantle, never a flame.',
        JSON.stringify({
          exothermicAddition: false,
          keepBelowC: null,
          flammableSolvent: true,
          toxicGas: false,
          fumeHood: true,
        }),
        now,
        now,
      );
      insertLine.run(p, 0, limiting, 'limiting-reagent', 2, 'g', 1);
      insertLine.run(p, 1, reagent, 'reagent', 3, 'g', 1);
      insertLine.run(p, 2, solvent, 'solvent', 20, 'mL', null);
      insertLine.run(p, 3, product, 'product', null, null, 1);
    }
  })();

  db.pragma('synchronous = FULL');
  db.pragma('wal_checkpoint(TRUNCATE)');
  selfCheck(db, size);
  const counts = countRows(db);
  db.close();
  return {
    size,
    counts,
    milliseconds: Math.round(performance.now() - started),
    benchProcedureId: 1,
  };
}
