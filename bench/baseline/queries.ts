import type Database from 'better-sqlite3';

/**
 * The bench's baseline: each question answered by hand-written SQL on better-sqlite3, with
 * no ORM, no session, no validation — what the same answer costs at the least. Shapes follow
 * the API's roughly (same rows, same columns that matter); the work is the same (a draw reads
 * the container, checks the balance, appends a ledger row and updates the container in one
 * BEGIN IMMEDIATE transaction).
 */

const micro = 1_000_000;
const fromMicro = (value: number) => value / micro;
const toMicro = (value: number) => Math.round(value * micro);
const todayIso = () => new Date().toISOString().slice(0, 10);
const escapeLike = (text: string) => text.replace(/[\\%_]/g, (c) => `\\${c}`);

type Row = Record<string, unknown>;

export class BaselineError extends Error {
  constructor(
    readonly status: number,
    message: string,
  ) {
    super(message);
  }
}

export function baselineQueries(db: Database.Database) {
  const containerColumns = `c.id, c.label_code AS labelCode, c.label_number AS labelNumber,
    c.lot_id AS lotId, c.chemical_id AS chemicalId, c.location_id AS locationId, c.status,
    c.quantity_micro AS quantity, c.unit, c.tare_mass AS tareMass, c.capacity,
    c.capacity_unit AS capacityUnit, c.opened_on AS openedOn, c.expires_on AS expiresOn,
    c.peroxide_due_on AS peroxideDueOn, c.notes, c.created_at AS createdAt,
    c.updated_at AS updatedAt, ch.name AS chemicalName, ch.formula AS chemicalFormula,
    ch.cas_number AS chemicalCasNumber, ch.storage_group AS chemicalStorageGroup,
    ch.ghs_pictograms AS chemicalGhsPictograms, ch.hazard_statements AS chemicalHazardStatements,
    ch.stock_unit AS chemicalStockUnit, l.supplier_name AS lotSupplierName,
    l.supplier_lot_number AS lotSupplierLotNumber, l.purity_percent AS lotPurityPercent,
    l.expires_on AS lotExpiresOn, loc.name AS locationName, loc.path AS locationPath`;
  const containerJoins = `FROM containers c JOIN chemicals ch ON ch.id = c.chemical_id
    JOIN lots l ON l.id = c.lot_id JOIN locations loc ON loc.id = c.location_id`;
  // Hand-tuned as a person writing SQL would: `+c.status` keeps SQLite on the location index
  // (a subtree is a few thousand rows) instead of the status index (half the table).
  const subtreeFilter = `c.location_id IN (SELECT id FROM locations WHERE id_path LIKE ? ESCAPE '\\')`;

  const statements = {
    locationIdPath: db.prepare('SELECT id_path AS idPath FROM locations WHERE id = ?'),
    containersPage: db.prepare(
      `SELECT ${containerColumns} ${containerJoins}
       WHERE ${subtreeFilter} AND +c.status = ?
       ORDER BY CASE WHEN c.expires_on IS NULL THEN 1 ELSE 0 END, c.expires_on, c.id
       LIMIT ? OFFSET ?`,
    ),
    containersCount: db.prepare(
      `SELECT COUNT(*) AS n FROM containers c WHERE ${subtreeFilter} AND +c.status = ?`,
    ),
    stockPage: db.prepare(
      `WITH page AS (
         SELECT id, name, formula, cas_number, storage_group, ghs_pictograms, hazard_statements,
                stock_unit, reorder_point, reorder_quantity
         FROM chemicals ORDER BY LOWER(name), id LIMIT ? OFFSET ?)
       SELECT p.id, p.name, p.formula, p.cas_number AS casNumber, p.storage_group AS storageGroup,
              p.ghs_pictograms AS ghsPictograms, p.hazard_statements AS hazardStatements,
              p.stock_unit AS stockUnit, p.reorder_point AS reorderPoint,
              p.reorder_quantity AS reorderQuantity,
              COALESCE(SUM(CASE WHEN c.status IN ('sealed', 'open') AND (c.expires_on IS NULL OR c.expires_on >= :today)
                                THEN c.quantity_micro END), 0) AS total,
              COUNT(c.id) AS containerCount,
              COALESCE(SUM(CASE WHEN c.status IN ('sealed', 'open') AND (c.expires_on IS NULL OR c.expires_on >= :today)
                                THEN 1 END), 0) AS usableContainerCount,
              COALESCE(SUM(CASE WHEN c.status IN ('sealed', 'open') AND c.expires_on < :today THEN 1 END), 0)
                AS expiredContainerCount,
              MIN(CASE WHEN c.status IN ('sealed', 'open') AND (c.expires_on IS NULL OR c.expires_on >= :today)
                       THEN c.expires_on END) AS nextExpiresOn
       FROM page p LEFT JOIN containers c ON c.chemical_id = p.id AND c.status <> 'disposed'
       GROUP BY p.id ORDER BY LOWER(p.name), p.id`,
    ),
    chemicalsCount: db.prepare('SELECT COUNT(*) AS n FROM chemicals'),
    chemicalsPage: db.prepare(
      `SELECT id, name, synonyms, cas_number AS casNumber, formula, molar_mass AS molarMass,
              physical_state AS physicalState, density, default_purity_percent AS defaultPurityPercent,
              ghs_pictograms AS ghsPictograms, hazard_statements AS hazardStatements,
              storage_group AS storageGroup, peroxide_class AS peroxideClass, stock_unit AS stockUnit,
              reorder_point AS reorderPoint, reorder_quantity AS reorderQuantity, restricted, notes,
              created_at AS createdAt, updated_at AS updatedAt
       FROM chemicals ORDER BY LOWER(name), id LIMIT ? OFFSET ?`,
    ),
    searchLabels: db.prepare(
      `SELECT c.id, c.label_code AS labelCode, c.status, c.chemical_id AS chemicalId,
              ch.name AS chemicalName, loc.path AS locationPath
       FROM containers c JOIN chemicals ch ON ch.id = c.chemical_id
       JOIN locations loc ON loc.id = c.location_id
       WHERE c.label_code >= ? AND c.label_code < ? ORDER BY c.label_code LIMIT ?`,
    ),
    searchChemicals: db.prepare(
      `SELECT id, name, cas_number AS casNumber, formula, synonyms FROM chemicals
       WHERE search_text LIKE ? ESCAPE '\\'
       ORDER BY CASE WHEN LOWER(name) = ? OR cas_number = ? THEN 0 ELSE 1 END, LOWER(name) LIMIT ?`,
    ),
    user: db.prepare(
      `SELECT id, email, display_name AS displayName, role, active, last_login_at AS lastLoginAt,
              created_at AS createdAt, updated_at AS updatedAt FROM users WHERE id = ?`,
    ),
    plan: db.prepare(
      `SELECT id, procedure_id AS procedureId, scale_factor AS scaleFactor, benches,
              overage_percent AS overagePercent, planned_on AS plannedOn FROM prep_plans WHERE id = ?`,
    ),
    procedureLines: db.prepare(
      `SELECT pl.position, pl.chemical_id AS chemicalId, pl.role, pl.quantity, pl.unit,
              ch.name, ch.stock_unit AS stockUnit, ch.density, ch.default_purity_percent AS purity,
              ch.ghs_pictograms AS ghsPictograms, ch.hazard_statements AS hazardStatements
       FROM procedure_lines pl JOIN chemicals ch ON ch.id = pl.chemical_id
       WHERE pl.procedure_id = ? ORDER BY pl.position`,
    ),
    container: db.prepare(
      `SELECT id, label_code AS labelCode, lot_id AS lotId, chemical_id AS chemicalId,
              location_id AS locationId, status, quantity_micro AS quantity, unit, opened_on AS openedOn
       FROM containers WHERE id = ?`,
    ),
    purity: db.prepare(
      `SELECT COALESCE(l.purity_percent, ch.default_purity_percent) AS purity
       FROM lots l JOIN chemicals ch ON ch.id = l.chemical_id WHERE l.id = ?`,
    ),
    insertEntry: db.prepare(
      `INSERT INTO ledger_entries (container_id, reason, unit, note, user_id, run_id, created_at,
         quantity_micro, balance_after_micro) VALUES (?, 'drawn', ?, ?, ?, ?, ?, ?, ?)`,
    ),
    updateContainer: db.prepare(
      'UPDATE containers SET quantity_micro = ?, status = ?, opened_on = ?, updated_at = ? WHERE id = ?',
    ),
    run: db.prepare(
      'SELECT id, procedure_id AS procedureId, status, scale_factor AS scaleFactor FROM runs WHERE id = ?',
    ),
    insertRunInput: db.prepare(
      `INSERT INTO run_inputs (run_id, line_index, purpose, container_id, lot_id, chemical_id,
         ledger_entry_id, quantity, unit, purity_percent) VALUES (?, ?, '', ?, ?, ?, ?, ?, ?, ?)`,
    ),
    recordRun: db.prepare(
      `UPDATE runs SET status = 'recorded', performed_on = ?, recorded_at = ?, updated_at = ?
       WHERE id = ?`,
    ),
  };

  /** Usable containers of these chemicals with what other plans hold of them. */
  function usableStock(chemicalIds: number[], asOf: string) {
    const marks = chemicalIds.map(() => '?').join(', ');
    const rows = db
      .prepare(
        `SELECT c.id, c.label_code AS labelCode, c.lot_id AS lotId, c.chemical_id AS chemicalId,
                c.location_id AS locationId, loc.path AS locationPath, c.status,
                c.quantity_micro AS quantity, c.unit, c.expires_on AS expiresOn,
                COALESCE(l.purity_percent, ch.default_purity_percent) AS purity,
                COALESCE((SELECT SUM(r.quantity_micro) FROM reservations r
                          WHERE r.container_id = c.id AND r.status = 'active' AND r.until >= ?), 0) AS held
         FROM containers c JOIN lots l ON l.id = c.lot_id JOIN chemicals ch ON ch.id = c.chemical_id
         JOIN locations loc ON loc.id = c.location_id
         WHERE c.chemical_id IN (${marks}) AND c.status IN ('sealed', 'open') AND c.quantity_micro > 0
           AND (c.expires_on IS NULL OR c.expires_on >= ?)
         ORDER BY c.id`,
      )
      .all(asOf, ...chemicalIds, asOf) as Row[];
    return rows;
  }

  /** One draw inside the caller's transaction; throws BaselineError when it cannot be drawn. */
  function drawFrom(
    containerId: number,
    amount: number,
    userId: number,
    runId: number | null,
    now: string,
  ) {
    const container = statements.container.get(containerId) as Row | undefined;
    if (!container) throw new BaselineError(404, `no container #${containerId}`);
    if (container.status === 'empty' || container.status === 'disposed') {
      throw new BaselineError(409, `container #${containerId} is ${String(container.status)}`);
    }
    const drawn = toMicro(amount);
    const balance = Number(container.quantity) - drawn;
    if (balance < 0) throw new BaselineError(409, `container #${containerId} holds less`);
    const status = balance === 0 ? 'empty' : 'open';
    const openedOn = (container.openedOn as string | null) ?? now.slice(0, 10);
    const entryId = Number(
      statements.insertEntry.run(
        containerId,
        container.unit,
        '',
        userId,
        runId,
        now,
        -drawn,
        balance,
      ).lastInsertRowid,
    );
    statements.updateContainer.run(balance, status, openedOn, now, containerId);
    return {
      entry: {
        id: entryId,
        containerId,
        reason: 'drawn',
        quantity: -amount,
        unit: container.unit,
        balanceAfter: fromMicro(balance),
        runId,
        createdAt: now,
      },
      container: { ...container, quantity: fromMicro(balance), status, openedOn, updatedAt: now },
    };
  }

  return {
    containers(locationId: number, status: string, page: number, pageSize: number) {
      const location = statements.locationIdPath.get(locationId) as { idPath: string } | undefined;
      if (!location) throw new BaselineError(404, `no location #${locationId}`);
      const prefix = `${escapeLike(location.idPath)}%`;
      const total = (statements.containersCount.get(prefix, status) as { n: number }).n;
      const rows = statements.containersPage.all(
        prefix,
        status,
        pageSize,
        (page - 1) * pageSize,
      ) as Row[];
      const items = rows.map((row) => ({
        ...row,
        quantity: fromMicro(Number(row.quantity)),
        chemicalGhsPictograms: JSON.parse(String(row.chemicalGhsPictograms)),
        chemicalHazardStatements: JSON.parse(String(row.chemicalHazardStatements)),
      }));
      return { items, total, page, pageSize };
    },

    stock(page: number, pageSize: number) {
      const total = (statements.chemicalsCount.get() as { n: number }).n;
      const rows = statements.stockPage.all(pageSize, (page - 1) * pageSize, {
        today: todayIso(),
      }) as Row[];
      const items = rows.map((row) => ({
        ...row,
        total: fromMicro(Number(row.total)),
        ghsPictograms: JSON.parse(String(row.ghsPictograms)),
        hazardStatements: JSON.parse(String(row.hazardStatements)),
      }));
      return { items, total, page, pageSize };
    },

    chemicals(page: number, pageSize: number) {
      const total = (statements.chemicalsCount.get() as { n: number }).n;
      const rows = statements.chemicalsPage.all(pageSize, (page - 1) * pageSize) as Row[];
      const items = rows.map((row) => ({
        ...row,
        synonyms: JSON.parse(String(row.synonyms)),
        ghsPictograms: JSON.parse(String(row.ghsPictograms)),
        hazardStatements: JSON.parse(String(row.hazardStatements)),
        restricted: row.restricted === 1,
      }));
      return { items, total, page, pageSize };
    },

    search(q: string, limit: number) {
      const prefix = q.trim().toUpperCase();
      const containers = statements.searchLabels.all(prefix, `${prefix}\uffff`, limit) as Row[];
      const needle = q.toLowerCase();
      const chemicals = (
        statements.searchChemicals.all(`%${escapeLike(needle)}%`, needle, q, limit) as Row[]
      ).map((row) => {
        const synonyms = JSON.parse(String(row.synonyms)) as string[];
        return {
          id: row.id,
          name: row.name,
          casNumber: row.casNumber,
          formula: row.formula,
          matchedSynonym: String(row.name).toLowerCase().includes(needle)
            ? null
            : (synonyms.find((s) => s.toLowerCase().includes(needle)) ?? null),
        };
      });
      return { containers, chemicals };
    },

    me(userId: number) {
      const user = statements.user.get(userId) as Row | undefined;
      if (!user) throw new BaselineError(401, 'not signed in');
      return { user: { ...user, active: user.active === 1, invitePending: false } };
    },

    /** The plan's requirement per line against usable stock, containers taken soonest-expiring first. */
    stockCheck(planId: number) {
      const plan = statements.plan.get(planId) as Row | undefined;
      if (!plan) throw new BaselineError(404, `no plan #${planId}`);
      const lines = statements.procedureLines.all(plan.procedureId) as Row[];
      const drawn = lines.filter((line) => line.role !== 'product');
      const today = todayIso();
      const asOf = String(plan.plannedOn) > today ? String(plan.plannedOn) : today;
      const stock = usableStock([...new Set(drawn.map((line) => Number(line.chemicalId)))], asOf);
      const factor =
        Number(plan.scaleFactor) * Number(plan.benches) * (1 + Number(plan.overagePercent) / 100);
      let shortCount = 0;
      const checked = drawn.map((line) => {
        const required = Number(line.quantity) * factor;
        const candidates = stock
          .filter((row) => row.chemicalId === line.chemicalId)
          .map((row): Row & { available: number } => ({
            ...row,
            available:
              (fromMicro(Number(row.quantity) - Number(row.held)) * Number(row.purity)) /
              Number(line.purity),
          }))
          .sort(
            (a, b) =>
              String(a.expiresOn ?? '9999').localeCompare(String(b.expiresOn ?? '9999')) ||
              (a.status === 'open' ? 0 : 1) - (b.status === 'open' ? 0 : 1) ||
              a.available - b.available,
          );
        let covered = 0;
        const suggestions: Row[] = [];
        for (const row of candidates) {
          if (covered >= required) break;
          const take = Math.min(row.available, required - covered);
          covered += take;
          suggestions.push({
            containerId: row.id,
            labelCode: row.labelCode,
            locationPath: row.locationPath,
            take,
          });
        }
        const available = candidates.reduce((sum, row) => sum + row.available, 0);
        const shortfall = Math.max(0, required - available);
        if (shortfall > 0) shortCount++;
        return {
          chemicalId: line.chemicalId,
          chemicalName: line.name,
          role: line.role,
          required,
          unit: line.stockUnit,
          available,
          shortfall,
          suggestions,
          ghsPictograms: JSON.parse(String(line.ghsPictograms)),
          hazardStatements: JSON.parse(String(line.hazardStatements)),
        };
      });
      return { ...plan, stockCheck: { ok: shortCount === 0, shortCount, lines: checked } };
    },

    draw: db.transaction((containerId: number, amount: number, userId: number) =>
      drawFrom(containerId, amount, userId, null, new Date().toISOString()),
    ),

    /** Every draw of the run, its inputs and the run marked recorded, in one transaction. */
    recordRun: db.transaction(
      (
        runId: number,
        body: { lines: { lineIndex: number; draws: { containerId: number; amount: number }[] }[] },
        userId: number,
      ) => {
        const now = new Date().toISOString();
        const run = statements.run.get(runId) as Row | undefined;
        if (!run) throw new BaselineError(404, `no run #${runId}`);
        if (run.status !== 'open')
          throw new BaselineError(409, `run #${runId} is already recorded`);
        const lines = statements.procedureLines.all(run.procedureId) as Row[];
        const inputs = [];
        for (const line of body.lines) {
          const procedureLine = lines[line.lineIndex];
          if (!procedureLine || procedureLine.role === 'product') {
            throw new BaselineError(400, `line ${line.lineIndex} is not drawn from stock`);
          }
          for (const draw of line.draws) {
            const container = statements.container.get(draw.containerId) as Row | undefined;
            if (!container || container.chemicalId !== procedureLine.chemicalId) {
              throw new BaselineError(
                400,
                `container #${draw.containerId} does not hold line ${line.lineIndex}'s chemical`,
              );
            }
            const { entry } = drawFrom(draw.containerId, draw.amount, userId, runId, now);
            const purity = (statements.purity.get(container.lotId) as { purity: number }).purity;
            statements.insertRunInput.run(
              runId,
              line.lineIndex,
              draw.containerId,
              container.lotId,
              container.chemicalId,
              entry.id,
              draw.amount,
              container.unit,
              purity,
            );
            inputs.push({ ...entry, lineIndex: line.lineIndex, purity });
          }
        }
        statements.recordRun.run(now.slice(0, 10), now, now, runId);
        return { id: runId, status: 'recorded', inputs };
      },
    ),
  };
}
export type BaselineQueries = ReturnType<typeof baselineQueries>;
