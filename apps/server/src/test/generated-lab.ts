import { casCheckDigit } from '@lotwise/chem';
import { storageGroupCodes } from '@lotwise/shared';
import type { DataSource } from 'typeorm';

/** How many rows of each kind a generated lab holds. */
export interface LabSize {
  chemicals: number;
  /** Containers per chemical on average (spread unevenly). */
  containersPerChemical: number;
  rooms: number;
  cabinetsPerRoom: number;
  shelvesPerCabinet: number;
  users: number;
  procedures: number;
  plans: number;
  runs: number;
  outbox: number;
  audit: number;
  orders: number;
}

export const smallLab: LabSize = {
  chemicals: 1500,
  containersPerChemical: 12,
  rooms: 3,
  cabinetsPerRoom: 5,
  shelvesPerCabinet: 3,
  users: 30,
  procedures: 120,
  plans: 2000,
  runs: 2000,
  outbox: 3000,
  audit: 3000,
  orders: 800,
};

export interface GeneratedLab {
  chemicalIds: number[];
  locationIds: { rooms: number[]; cabinets: number[]; shelves: number[] };
  userIds: number[];
  procedureIds: number[];
  today: string;
}

interface RawDatabase {
  prepare(sql: string): { run(...values: unknown[]): { lastInsertRowid: number | bigint } };
  transaction<T>(work: () => T): () => T;
}

/**
 * The same lab on either database: on SQLite through better-sqlite3 (generateLab); on
 * PostgreSQL the statements are recorded first (each table's ids count from 1, as in a
 * migrated, empty database) and then sent in one transaction, consecutive rows of one
 * statement as multi-row INSERTs.
 */
export async function generateLabIn(
  dataSource: DataSource,
  size: LabSize = smallLab,
): Promise<GeneratedLab> {
  if (dataSource.options.type !== 'postgres') return generateLab(dataSource, size);
  const recorded: { sql: string; values: unknown[] }[] = [];
  const lastIds = new Map<string, number>();
  const recorder: RawDatabase = {
    prepare: (sql) => ({
      run: (...values) => {
        recorded.push({ sql, values });
        const table = /^INSERT INTO (\w+)/.exec(sql)?.[1];
        if (!table) return { lastInsertRowid: 0 };
        const id = (lastIds.get(table) ?? 0) + 1;
        lastIds.set(table, id);
        return { lastInsertRowid: id };
      },
    }),
    transaction: (work) => work,
  };
  const lab = generateOn(recorder, size);
  await dataSource.transaction(async (manager) => {
    for (let start = 0; start < recorded.length;) {
      const { sql } = recorded[start]!;
      let end = start + 1;
      const insert = /^(INSERT INTO .*? VALUES )(\(.*\))$/.exec(sql);
      if (insert)
        while (end < recorded.length && end - start < 500 && recorded[end]!.sql === sql) end++;
      const rows = recorded.slice(start, end);
      let n = 0;
      const numbered = (text: string) => text.replace(/\?/g, () => `$${++n}`);
      const text = insert
        ? insert[1] + rows.map(() => numbered(insert[2]!)).join(', ')
        : numbered(sql);
      await manager.query(
        text,
        rows.flatMap((row) => row.values),
      );
      start = end;
    }
  });
  return lab;
}

/**
 * Fills a migrated, empty database with an invented lab of `size` in one transaction, straight
 * through better-sqlite3 (no services: far faster, for tests of query plans and benchmarks).
 * Deterministic: the same size gives the same rows. Names are made up ("Reagent 0042").
 */
export function generateLab(dataSource: DataSource, size: LabSize = smallLab): GeneratedLab {
  const db = (dataSource.driver as unknown as { databaseConnection: RawDatabase })
    .databaseConnection;
  return generateOn(db, size);
}

function generateOn(db: RawDatabase, size: LabSize): GeneratedLab {
  let seed = 20260417;
  const random = () => {
    seed = (seed * 1103515245 + 12345) % 2147483648;
    return seed / 2147483648;
  };
  const pick = <T>(list: readonly T[]): T => list[Math.floor(random() * list.length)]!;
  const now = '2026-04-17T09:00:00.000Z';
  const today = '2026-04-17';
  const day = (offset: number) =>
    new Date(Date.UTC(2026, 3, 17) + offset * 86_400_000).toISOString().slice(0, 10);
  const stamp = (offset: number) => `${day(offset)}T08:00:00.000Z`;

  const lab: GeneratedLab = {
    chemicalIds: [],
    locationIds: { rooms: [], cabinets: [], shelves: [] },
    userIds: [],
    procedureIds: [],
    today,
  };

  db.transaction(() => {
    const user = db.prepare(
      'INSERT INTO users (email, display_name, password_hash, role, active, created_at, updated_at, session_version) VALUES (?, ?, NULL, ?, ?, ?, ?, 0)',
    );
    for (let i = 1; i <= size.users; i++) {
      const role = i === 1 ? 'admin' : pick(['manager', 'member', 'member', 'viewer']);
      const id = user.run(`lab.person.${i}@example.test`, `Lab person ${i}`, role, 1, now, now);
      lab.userIds.push(Number(id.lastInsertRowid));
    }

    const location = db.prepare(
      "INSERT INTO locations (name, kind, parent_id, path, id_path, depth, storage_groups, notes, created_at, updated_at) VALUES (?, ?, ?, ?, 'pending', ?, '[]', '', ?, ?)",
    );
    const setIdPath = db.prepare('UPDATE locations SET id_path = ? WHERE id = ?');
    const place = (
      name: string,
      kind: string,
      parent: { id: number; path: string; idPath: string } | null,
    ) => {
      const path = parent ? `${parent.path} / ${name}` : name;
      const id = Number(
        location.run(
          name,
          kind,
          parent?.id ?? null,
          path,
          parent ? path.split(' / ').length - 1 : 0,
          now,
          now,
        ).lastInsertRowid,
      );
      const idPath = `${parent ? parent.idPath : '/'}${id}/`;
      setIdPath.run(idPath, id);
      return { id, path, idPath };
    };
    for (let r = 1; r <= size.rooms; r++) {
      const room = place(`Room ${r}`, 'room', null);
      lab.locationIds.rooms.push(room.id);
      for (let c = 1; c <= size.cabinetsPerRoom; c++) {
        const cabinet = place(`Cabinet ${r}.${c}`, 'cabinet', room);
        lab.locationIds.cabinets.push(cabinet.id);
        for (let s = 1; s <= size.shelvesPerCabinet; s++) {
          lab.locationIds.shelves.push(place(`Shelf ${r}.${c}.${s}`, 'shelf', cabinet).id);
        }
      }
    }
    const shelves = lab.locationIds.shelves;

    const chemical = db.prepare(
      "INSERT INTO chemicals (name, synonyms, cas_number, formula, molar_mass, physical_state, density, default_purity_percent, ghs_pictograms, hazard_statements, storage_group, stock_unit, reorder_point, reorder_quantity, restricted, notes, search_text, created_at, updated_at) VALUES (?, '[]', ?, ?, ?, ?, ?, 99, ?, '[]', ?, ?, ?, ?, ?, '', ?, ?, ?)",
    );
    const lot = db.prepare(
      "INSERT INTO lots (chemical_id, source, supplier_name, received_on, expires_on, notes, created_at, updated_at) VALUES (?, 'purchased', 'Northgate Lab Supply (fictional)', ?, ?, '', ?, ?)",
    );
    const container = db.prepare(
      "INSERT INTO containers (label_code, label_number, lot_id, chemical_id, location_id, status, unit, expires_on, notes, created_at, updated_at, quantity_micro) VALUES (?, ?, ?, ?, ?, ?, ?, ?, '', ?, ?, ?)",
    );
    let label = 0;
    for (let i = 1; i <= size.chemicals; i++) {
      const name = `Reagent ${String(i).padStart(5, '0')} ${pick(['acid', 'oxide', 'chloride', 'nitrate', 'sulfate'])}`;
      const digits = String(100000 + i * 37);
      const cas = `${digits.slice(0, -2)}-${digits.slice(-2)}-${casCheckDigit(digits)}`;
      const liquid = random() < 0.3;
      const unit = liquid ? 'mL' : 'g';
      const reorderPoint = random() < 0.4 ? Math.round(random() * 500) : null;
      const chemicalId = Number(
        chemical.run(
          name,
          cas,
          'NaCl',
          58.44,
          liquid ? 'liquid' : 'solid',
          liquid ? 1.1 : null,
          JSON.stringify(random() < 0.3 ? ['GHS07'] : []),
          pick(storageGroupCodes),
          unit,
          reorderPoint,
          reorderPoint === null ? null : reorderPoint * 2,
          0,
          `${name}\n${cas}\nnacl`.toLowerCase(),
          stamp(-Math.floor(random() * 700)),
          now,
        ).lastInsertRowid,
      );
      lab.chemicalIds.push(chemicalId);
      // Uneven: a few chemicals hold many containers, many hold one or two, some none.
      const count = Math.floor(random() * random() * size.containersPerChemical * 3);
      let lotId = 0;
      for (let k = 0; k < count; k++) {
        const expiresOn = random() < 0.7 ? day(Math.floor(random() * 900) - 200) : null;
        if (k % 3 === 0) {
          lotId = Number(
            lot.run(chemicalId, day(-Math.floor(random() * 700)), expiresOn, now, now)
              .lastInsertRowid,
          );
        }
        label++;
        const roll = random();
        const status =
          roll < 0.55 ? 'sealed' : roll < 0.85 ? 'open' : roll < 0.93 ? 'empty' : 'disposed';
        const quantityMicro =
          status === 'sealed' || status === 'open'
            ? Math.round(random() * 1000) * 1_000_000 + Math.round(random() * 999_999)
            : 0;
        container.run(
          `LW-${String(label).padStart(6, '0')}`,
          label,
          lotId,
          chemicalId,
          pick(shelves),
          status,
          unit,
          expiresOn,
          now,
          stamp(-Math.floor(random() * 400)),
          quantityMicro,
        );
      }
    }

    const procedure = db.prepare(
      "INSERT INTO procedures (title, reference, base_scale, cautions, caution_flags, created_by_id, created_at, updated_at) VALUES (?, '', '{}', '', '[]', ?, ?, ?)",
    );
    for (let i = 1; i <= size.procedures; i++) {
      lab.procedureIds.push(
        Number(
          procedure.run(`Preparation ${i}`, pick(lab.userIds), now, stamp(-i)).lastInsertRowid,
        ),
      );
    }
    const plan = db.prepare(
      "INSERT INTO prep_plans (procedure_id, scale_factor, benches, overage_percent, planned_on, status, notes, created_by_id, created_at, updated_at) VALUES (?, 1, ?, 10, ?, ?, '', ?, ?, ?)",
    );
    for (let i = 1; i <= size.plans; i++) {
      plan.run(
        pick(lab.procedureIds),
        1 + Math.floor(random() * 12),
        day(Math.floor(random() * 600) - 400),
        pick(['draft', 'reserved', 'recorded', 'recorded', 'cancelled', 'lapsed']),
        pick(lab.userIds),
        now,
        stamp(-Math.floor(random() * 400)),
      );
    }
    const run = db.prepare(
      "INSERT INTO runs (procedure_id, scale_factor, status, performed_by_id, performed_on, percent_yield, appearance, observation_notes, notes, warnings, notices, created_at, updated_at) VALUES (?, 1, ?, ?, ?, ?, '', '', '', '[]', '[]', ?, ?)",
    );
    for (let i = 1; i <= size.runs; i++) {
      const recorded = random() < 0.9;
      run.run(
        pick(lab.procedureIds),
        recorded ? 'recorded' : 'open',
        pick(lab.userIds),
        recorded ? day(-Math.floor(random() * 600)) : null,
        recorded ? Math.round(random() * 1000) / 10 : null,
        stamp(-Math.floor(random() * 600)),
        now,
      );
    }
    const outbox = db.prepare(
      "INSERT INTO outbox (user_id, recipient_email, kind, subject, text, html, delivery, status, attempts, next_attempt_at, created_at, updated_at) VALUES (?, ?, ?, ?, '', '', 'immediate', ?, ?, ?, ?, ?)",
    );
    for (let i = 1; i <= size.outbox; i++) {
      const status = pick(['sent', 'sent', 'sent', 'sent', 'queued', 'failed']);
      outbox.run(
        pick(lab.userIds),
        `lab.person.${1 + Math.floor(random() * size.users)}@example.test`,
        pick(['expiry', 'low_stock', 'peroxide']),
        `Notice ${i}`,
        status,
        Math.floor(random() * 4),
        status === 'queued' ? stamp(Math.floor(random() * 3)) : null,
        stamp(-Math.floor(random() * 500)),
        now,
      );
    }
    const audit = db.prepare(
      "INSERT INTO audit_events (actor_id, action, target_type, target_id, detail, created_at) VALUES (?, ?, ?, ?, '{}', ?)",
    );
    for (let i = 1; i <= size.audit; i++) {
      const targetType = pick(['chemical', 'container', 'user', 'location']);
      audit.run(
        pick(lab.userIds),
        `${targetType}.${pick(['create', 'update', 'delete'])}`,
        targetType,
        1 + Math.floor(random() * 500),
        stamp(-Math.floor(random() * 700)),
      );
    }
    const supplier = db.prepare(
      "INSERT INTO suppliers (name, contact_name, email, phone, website, ordering_notes, minimum_order_minor, shipping_fee_minor, hazardous_fee_minor, archived, created_at, updated_at) VALUES (?, '', 'orders@supplier.example.test', '', '', '', 0, 900, 0, ?, ?, ?)",
    );
    const supplierIds = [1, 2, 3].map((n) =>
      Number(supplier.run(`Generated supplier ${n} (fictional)`, 0, now, now).lastInsertRowid),
    );
    const order = db.prepare(
      "INSERT INTO orders (supplier_id, title, status, fee_rule, shipping_fee_minor, hazardous_fee_minor, currency, claim_deadline, supplier_reference, notes, coordinator_id, cancel_reason, created_at, updated_at) VALUES (?, ?, ?, 'even', 900, 0, 'EUR', ?, '', '', ?, '', ?, ?)",
    );
    for (let i = 1; i <= size.orders; i++) {
      order.run(
        pick(supplierIds),
        `Shared order ${i}`,
        pick(['draft', 'open', 'funded', 'ordered', 'received', 'closed', 'closed', 'cancelled']),
        random() < 0.5 ? day(Math.floor(random() * 300) - 200) : null,
        pick(lab.userIds),
        stamp(-Math.floor(random() * 700)),
        now,
      );
    }
  })();
  return lab;
}
