import path from 'node:path';
import { parseArgs } from 'node:util';
import { formatBytes, formatNumber } from '@lotwise/shared';
import type { Config } from '../config';
import { ensureBackupFolder, newBackupPath } from '../modules/backups/backup-folder';
import { BackupError, copyDatabase } from '../modules/backups/database-copy';
import type { CommandIo } from './user-create-command';

export const backupUsage = `Usage: npm run backup [-- FILE]

Writes a consistent copy of the Lotwise database while the server runs (SQLite's online
backup API), checks it (integrity check, rows of every table) and prints what it wrote.
Without FILE the copy goes to the backups folder (BACKUP_DIR, default: backups beside the
database) as lotwise-<UTC time>-manual.sqlite. FILE must not exist yet.`;

/** Bytes as a person reads them, with the exact count. */
export function describeSize(bytes: number): string {
  const exact = `${formatNumber(bytes, 0)} bytes`;
  return bytes < 1024 ? exact : `${formatBytes(bytes)} (${exact})`;
}

/** Lines listing rows per table, aligned. */
export function rowCountLines(rowCounts: Record<string, number>): string[] {
  const width = Math.max(...Object.keys(rowCounts).map((table) => table.length));
  return Object.entries(rowCounts).map(
    ([table, rows]) => `  ${table.padEnd(width)}  ${formatNumber(rows, 0).padStart(10)}`,
  );
}

/** Runs `backup`; answers the process exit code. Relative paths start at `cwd`. */
export async function runBackup(
  argv: string[],
  config: Pick<Config, 'databasePath' | 'backup'>,
  io: CommandIo,
  cwd = process.cwd(),
): Promise<number> {
  let parsed;
  try {
    parsed = parseArgs({
      args: argv,
      options: { help: { type: 'boolean', short: 'h', default: false } },
      allowPositionals: true,
      strict: true,
    });
  } catch (error) {
    io.err(`${(error as Error).message}\n\n${backupUsage}`);
    return 1;
  }
  if (parsed.values.help) {
    io.out(backupUsage);
    return 0;
  }
  if (parsed.positionals.length > 1) {
    io.err(`Name one file at most.\n\n${backupUsage}`);
    return 1;
  }
  try {
    const given = parsed.positionals[0];
    let destination: string;
    if (given) {
      destination = path.resolve(cwd, given);
    } else {
      ensureBackupFolder(config.backup.dir);
      destination = newBackupPath(config.backup.dir, 'manual', new Date());
    }
    if (destination === path.resolve(config.databasePath)) {
      io.err('FILE is the database itself; name a new file.');
      return 1;
    }
    const started = performance.now();
    const copy = await copyDatabase(config.databasePath, destination, { check: 'integrity' });
    io.out(`Backup written: ${copy.file}`);
    io.out(`Size: ${describeSize(copy.bytes)}`);
    io.out(`The database as it was at ${copy.takenAt.toISOString()}`);
    io.out(
      `Checked in ${Math.round(performance.now() - started)} ms: SQLite's integrity check passed, and every table has the rows the database had:`,
    );
    for (const line of rowCountLines(copy.rowCounts)) io.out(line);
    return 0;
  } catch (error) {
    if (error instanceof BackupError) {
      io.err(`No backup was written: ${error.message}`);
      return 1;
    }
    throw error;
  }
}
