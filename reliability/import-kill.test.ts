import { expect, it } from 'vitest';
import { ApiClient, demoUsers, ledgerCheck } from './lib/api';
import { onSqlite } from './lib/database';
import { reportFigure } from './lib/figures';
import { inspectDatabase, openProbe } from './lib/inspect';
import { labMaker } from './lib/lab';
import { serverForThisFile } from './lib/suite';

const lotwise = serverForThisFile('import');
const { database } = lotwise;

const rows = 20_000;
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));
const cell = (text: string) => (/[",\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text);

interface ImportState {
  id: number;
  status: string;
  processedRows: number;
  totalRows: number;
  failure: string | null;
}

/** A delivery of `rows` containers of chemicals the lab knows, onto one shelf. */
function stockCsv(
  chemicals: { name: string; casNumber: string | null; stockUnit: string }[],
  shelfPath: string,
  tag: string,
): string {
  const today = new Date().toISOString().slice(0, 10);
  const lines = [
    'Chemical,CAS RN,Quantity,Unit,Location,Supplier,Supplier lot no.,Received on,Status',
  ];
  for (let i = 0; i < rows; i++) {
    const chemical = chemicals[i % chemicals.length]!;
    lines.push(
      [
        chemical.name,
        chemical.casNumber ?? '',
        String(100 + (i % 400)),
        chemical.stockUnit,
        shelfPath,
        'Fictional Reagents Ltd (invented)',
        `REL-${tag}-${Math.floor(i / 10)}`,
        today,
        'sealed',
      ]
        .map(cell)
        .join(','),
    );
  }
  return `${lines.join('\n')}\n`;
}

async function until(
  client: ApiClient,
  id: number,
  done: (state: ImportState) => boolean,
  timeoutMs: number,
  everyMs = 50,
): Promise<ImportState> {
  const started = performance.now();
  for (;;) {
    const state = await client.json<ImportState>('GET', `/api/imports/${id}`);
    if (done(state)) return state;
    if (performance.now() - started > timeoutMs) {
      throw new Error(
        `Import #${id} is ${state.status} (${state.processedRows} rows) after ${timeoutMs} ms`,
      );
    }
    await sleep(everyMs);
  }
}

it('when the server is killed while a 20,000-row stock import commits, then nothing of it remains and the import shows as failed after the restart', async () => {
  const server = await lotwise.start();
  const manager = await ApiClient.signIn(server.origin, demoUsers.manager);
  const admin = await ApiClient.signIn(server.origin, demoUsers.admin);
  const lab = labMaker(manager);
  const shelf = await lab.shelf('Import shelf');
  const chemicals = await manager.json<{
    items: { name: string; casNumber: string | null; stockUnit: string }[];
  }>('GET', '/api/chemicals?pageSize=50');
  const totals = async () => ({
    containers: (await admin.json<{ total: number }>('GET', '/api/containers?pageSize=1')).total,
    lots: (await admin.json<{ total: number }>('GET', '/api/lots?pageSize=1')).total,
  });
  const before = await totals();

  const form = new FormData();
  const csv = stockCsv(chemicals.items, shelf.path, lab.tag);
  form.append('file', new Blob([csv], { type: 'text/csv' }), `reliability-${rows}.csv`);
  const created = await manager.json<ImportState>('POST', '/api/imports', form);
  const ready = await until(manager, created.id, (s) => s.status !== 'validating', 120_000);
  expect(ready.status).toBe('ready');

  // `committing` with a growing processedRows: the rows are being written in the open
  // transaction. Kill half-way through.
  const commitStarted = performance.now();
  const committing = await manager.json<ImportState>('POST', `/api/imports/${created.id}/commit`);
  expect(committing.status).toBe('committing');
  const killAt = Math.round(rows * (0.3 + Math.random() * 0.4));
  const seen = await until(
    manager,
    created.id,
    (s) => s.status !== 'committing' || s.processedRows >= killAt,
    120_000,
    10,
  );
  await server.kill('SIGKILL');
  const killedAfterMs = Math.round(performance.now() - commitStarted);
  expect(seen.status).toBe('committing');

  await server.restart();
  const after = await manager.json<ImportState>('GET', `/api/imports/${created.id}`);
  const afterTotals = await totals();
  const check = await ledgerCheck(admin);
  const again = await manager.send('POST', `/api/imports/${created.id}/commit`);
  await server.stop();

  const probe = await openProbe(database);
  const marker = `%import #${created.id}%`;
  const [left] = await probe.all<Record<string, unknown>>(
    `SELECT (SELECT COUNT(*) FROM ledger_entries WHERE note LIKE ?) AS entries,
            (SELECT COUNT(*) FROM lots WHERE notes LIKE ?) AS lots,
            (SELECT COUNT(*) FROM locations WHERE notes LIKE ?) AS locations,
            (SELECT status FROM imports WHERE id = ?) AS status`,
    [marker, marker, marker, created.id],
  );
  await probe.close();
  const report = await inspectDatabase(database);
  const remaining = Number(left?.entries) + Number(left?.lots) + Number(left?.locations);

  reportFigure(
    'import-kill',
    `${rows}-row stock import killed ${(killedAfterMs / 1000).toFixed(1)} s into its commit at ${seen.processedRows}/${rows} rows written: after restart ${remaining} rows of it remain (containers ${before.containers} -> ${afterTotals.containers}, lots ${before.lots} -> ${afterTotals.lots}), import ${after.status}, a second commit answers ${again.status}; ledger check ${check.ok ? 'ok' : 'FAILED'}${onSqlite ? `, integrity ${report.integrityProblems.length ? 'FAILED' : 'ok'}` : ''}`,
    {
      rows,
      writtenAtKill: seen.processedRows,
      remaining,
      status: after.status,
      ledgerCheck: check.ok,
    },
  );

  expect(after.status).toBe('failed');
  expect(after.failure).toMatch(/server stopped/i);
  expect(afterTotals).toEqual(before);
  expect(remaining).toBe(0);
  expect(left?.status).toBe('failed');
  expect(again.status).toBe(409);
  expect(check.ok).toBe(true);
  expect(report.integrityProblems).toEqual([]);
  expect(report.foreignKeyProblems).toBe(0);
  expect(report.balanceMismatches).toBe(0);
});
