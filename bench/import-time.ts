import Database from 'better-sqlite3';
import { addDays } from '@lotwise/chem';
import { todayIso } from '@lotwise/shared';
import type { ApiSession } from './fixtures';

/** How long a stock import took through the API. */
export interface ImportTiming {
  rows: number;
  /** Upload until the check is `ready`, ms. */
  checkMs: number;
  /** Commit request until `committed`, ms: the figure held to the target. */
  commitMs: number;
  status: string;
}

const cell = (text: string) => (/[",\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text);

/**
 * A CSV of `rows` containers of chemicals the lab knows (matched by CAS RN and name), on
 * shelves it has, with generated label codes: what a lab adds after a large delivery.
 */
export function stockCsv(databasePath: string, rows: number): string {
  const db = new Database(databasePath, { readonly: true });
  try {
    const chemicals = db
      .prepare(
        'SELECT name, cas_number AS cas, stock_unit AS unit FROM chemicals ORDER BY id LIMIT 2000',
      )
      .all() as { name: string; cas: string | null; unit: string }[];
    const shelves = (
      db.prepare("SELECT path FROM locations WHERE kind = 'shelf' ORDER BY id").all() as {
        path: string;
      }[]
    ).map((row) => row.path);
    const received = addDays(todayIso(), -3);
    const expires = addDays(todayIso(), 700);
    const lines = [
      'Chemical,CAS RN,Quantity,Unit,Location,Supplier,Supplier lot no.,Received on,Expires on,Status',
    ];
    for (let i = 0; i < rows; i++) {
      const chemical = chemicals[i % chemicals.length]!;
      lines.push(
        [
          chemical.name,
          chemical.cas ?? '',
          String(100 + (i % 400)),
          chemical.unit,
          shelves[i % shelves.length]!,
          'Northgate Lab Supply (fictional)',
          `IMP-${String(Math.floor(i / 5)).padStart(5, '0')}`,
          received,
          expires,
          'sealed',
        ]
          .map(cell)
          .join(','),
      );
    }
    return `${lines.join('\n')}\n`;
  } finally {
    db.close();
  }
}

async function waitFor(
  session: ApiSession,
  id: number,
  done: (status: string) => boolean,
  timeoutMs: number,
): Promise<string> {
  const started = performance.now();
  for (;;) {
    const state = await session.request<{ status: string }>('GET', `/api/imports/${id}`);
    if (done(state.status)) return state.status;
    if (performance.now() - started > timeoutMs) {
      throw new Error(`Import #${id} still ${state.status} after ${timeoutMs} ms`);
    }
    await new Promise((resolve) => setTimeout(resolve, 25));
  }
}

/** Uploads the CSV as a file (multipart), waits for the check, commits and times the commit. */
export async function timeImport(
  session: ApiSession,
  csv: string,
  rows: number,
): Promise<ImportTiming> {
  const form = new FormData();
  form.append('file', new Blob([csv], { type: 'text/csv' }), 'bench-stock.csv');
  const uploadStarted = performance.now();
  const upload = await fetch(`${session.origin}/api/imports?kind=stock`, {
    method: 'POST',
    headers: session.headers,
    body: form,
  });
  const created = (await upload.json()) as { id?: number; status?: string };
  if (!upload.ok || created.id === undefined) {
    throw new Error(
      `The import upload answered ${upload.status}: ${JSON.stringify(created).slice(0, 500)}`,
    );
  }
  const checked = await waitFor(session, created.id, (s) => s !== 'validating', 300_000);
  const checkMs = Math.round(performance.now() - uploadStarted);
  if (checked !== 'ready') {
    const detail = await session.request<unknown>('GET', `/api/imports/${created.id}`);
    throw new Error(
      `The bench CSV did not pass the check (${checked}): ${JSON.stringify(detail).slice(0, 800)}`,
    );
  }
  const commitStarted = performance.now();
  await session.request('POST', `/api/imports/${created.id}/commit`);
  const status = await waitFor(
    session,
    created.id,
    (s) => s === 'committed' || s === 'failed',
    600_000,
  );
  const commitMs = Math.round(performance.now() - commitStarted);
  return { rows, checkMs, commitMs, status };
}
