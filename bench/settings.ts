import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const repoRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');

function numberFrom(name: string, fallback: number): number {
  const raw = process.env[name];
  if (raw === undefined || raw === '') return fallback;
  const value = Number(raw);
  if (!Number.isFinite(value) || value <= 0)
    throw new Error(`${name} must be a positive number (got ${raw})`);
  return value;
}

/** What a bench run does, from the environment (see DEVELOPERS.md). */
export interface BenchSettings {
  /** Measured seconds per question (BENCH_SECONDS, default 10). */
  seconds: number;
  /** Warm-up seconds before each measurement, not counted (BENCH_WARMUP_SECONDS, default 2). */
  warmupSeconds: number;
  /** Concurrent connections (BENCH_CONNECTIONS, default 10). */
  connections: number;
  /** Connections drawing while the search is measured again (BENCH_WRITE_CONNECTIONS, default 2). */
  writeConnections: number;
  /** Lab size factor (BENCH_SCALE, default 1: 100,000 containers). */
  scale: number;
  /** Rows of the timed CSV import (BENCH_IMPORT_ROWS, default 10,000). */
  importRows: number;
  /** Use apps/web/dist and a compiled server as they are instead of building them (BENCH_SKIP_BUILD=1). */
  skipBuild: boolean;
  /** `before` writes bench/results-before.json and the "before" table (BENCH_SAVE_AS). */
  saveAs: 'latest' | 'before';
  /** Keep the generated database file (BENCH_KEEP_DB=1) and print where it is. */
  keepDatabase: boolean;
  /** Share of non-2xx answers above which the bench fails (BENCH_MAX_ERROR_SHARE, default 0.02). */
  maxErrorShare: number;
}

export function benchSettings(): BenchSettings {
  const flag = (name: string) => ['1', 'true', 'yes'].includes(process.env[name] ?? '');
  return {
    seconds: numberFrom('BENCH_SECONDS', 10),
    warmupSeconds: numberFrom('BENCH_WARMUP_SECONDS', 2),
    connections: Math.round(numberFrom('BENCH_CONNECTIONS', 10)),
    writeConnections: Math.round(numberFrom('BENCH_WRITE_CONNECTIONS', 2)),
    scale: numberFrom('BENCH_SCALE', 1),
    importRows: Math.round(numberFrom('BENCH_IMPORT_ROWS', 10_000)),
    skipBuild: flag('BENCH_SKIP_BUILD'),
    saveAs: process.env.BENCH_SAVE_AS === 'before' ? 'before' : 'latest',
    keepDatabase: flag('BENCH_KEEP_DB'),
    maxErrorShare: numberFrom('BENCH_MAX_ERROR_SHARE', 0.02),
  };
}
