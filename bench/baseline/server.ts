import Database from 'better-sqlite3';
import express, { type Request, type Response } from 'express';
import { BaselineError, baselineQueries } from './queries';

/**
 * The baseline server the bench runs beside Lotwise: a bare Express app, one route per
 * question, hand-written SQL on one better-sqlite3 connection to the same file (WAL). Run as
 * a child process: `DATABASE_PATH=… PORT=… node --import tsx bench/baseline/server.ts`.
 */
const databasePath = process.env.DATABASE_PATH;
const port = Number(process.env.PORT ?? 0);
if (!databasePath) throw new Error('DATABASE_PATH is required');

const db = new Database(databasePath);
db.pragma('journal_mode = WAL');
db.pragma('foreign_keys = ON');
db.pragma('busy_timeout = 5000');
const queries = baselineQueries(db);
/** The signed-in account of the bench (the technician): no session is checked here. */
const userId = Number(process.env.BENCH_USER_ID ?? 2);

const app = express();
app.use(express.json({ limit: '1mb' }));

const answer =
  (work: (req: Request) => unknown, status = 200) =>
  (req: Request, res: Response) => {
    try {
      res.status(status).json(work(req));
    } catch (error) {
      if (error instanceof BaselineError) res.status(error.status).json({ error: error.message });
      else res.status(500).json({ error: String(error) });
    }
  };
const int = (value: unknown, fallback: number) => (value === undefined ? fallback : Number(value));

app.get('/health', (_req, res) => {
  res.json({ ok: true });
});
app.get(
  '/containers',
  answer((req) =>
    queries.containers(
      int(req.query.locationId, 1),
      String(req.query.status ?? 'open'),
      int(req.query.page, 1),
      int(req.query.pageSize, 50),
    ),
  ),
);
app.get(
  '/stock',
  answer((req) => queries.stock(int(req.query.page, 1), int(req.query.pageSize, 50))),
);
app.get(
  '/chemicals',
  answer((req) => queries.chemicals(int(req.query.page, 1), int(req.query.pageSize, 50))),
);
app.get(
  '/search',
  answer((req) => queries.search(String(req.query.q ?? ''), int(req.query.limit, 10))),
);
app.get(
  '/me',
  answer(() => queries.me(userId)),
);
app.get(
  '/plans/:id/stock-check',
  answer((req) => queries.stockCheck(Number(req.params.id))),
);
app.post(
  '/containers/:id/draws',
  answer(
    (req) => queries.draw.immediate(Number(req.params.id), Number(req.body.amount), userId),
    201,
  ),
);
app.post(
  '/runs/:id/record',
  answer((req) => queries.recordRun.immediate(Number(req.params.id), req.body, userId)),
);

const server = app.listen(port, '127.0.0.1', () => {
  console.log(`baseline listening on ${port}`);
});
const stop = () => {
  server.close();
  db.close();
  process.exit(0);
};
process.once('SIGTERM', stop);
process.once('SIGINT', stop);
