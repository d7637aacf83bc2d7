import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { parseArgs } from 'node:util';
import type { Config } from '../config';
import type { CheckedDatabase } from '../modules/backups/database-check';
import { checkBackupFile, restoreDatabase, RestoreRefused } from '../modules/backups/restore';
import { rowCountLines } from './backup-command';
import type { CommandIo } from './user-create-command';

export const restoreUsage = `Usage: npm run restore -- FILE [--check]

Puts the backup FILE in place of the Lotwise database (DATABASE_PATH), with the server
stopped. FILE is checked first: SQLite's integrity and foreign-key checks, that it is a
Lotwise database, and that its schema is this version's or an older one (a newer one is
refused). The database it replaces is kept beside it as <name>.replaced-<UTC time>.
  --check   check FILE only; change nothing`;

function describeCheck(file: string, check: CheckedDatabase): string[] {
  const schema =
    check.migrationsApplied === check.migrationsKnown
      ? `the schema of this version (${check.migrationsKnown} migrations)`
      : `an older schema (${check.migrationsApplied} of ${check.migrationsKnown} migrations; Lotwise brings it up to date when it starts)`;
  return [
    `${file} is a sound Lotwise database: integrity and foreign keys are clean, ${schema}.`,
    'Rows per table:',
    ...rowCountLines(check.rowCounts),
  ];
}

/** Runs `restore`; answers the process exit code. Relative paths start at `cwd`. */
export function runRestore(
  argv: string[],
  config: Pick<Config, 'databasePath'>,
  io: CommandIo,
  cwd = process.cwd(),
): number {
  let parsed;
  try {
    parsed = parseArgs({
      args: argv,
      options: {
        check: { type: 'boolean', default: false },
        help: { type: 'boolean', short: 'h', default: false },
      },
      allowPositionals: true,
      strict: true,
    });
  } catch (error) {
    io.err(`${(error as Error).message}\n\n${restoreUsage}`);
    return 1;
  }
  if (parsed.values.help) {
    io.out(restoreUsage);
    return 0;
  }
  if (parsed.positionals.length !== 1) {
    io.err(`Name the backup file to restore.\n\n${restoreUsage}`);
    return 1;
  }
  const source = path.resolve(cwd, parsed.positionals[0]!);
  try {
    if (parsed.values.check) {
      const scratch = mkdtempSync(path.join(tmpdir(), 'lotwise-check-'));
      try {
        for (const line of describeCheck(source, checkBackupFile(source, scratch))) io.out(line);
      } finally {
        rmSync(scratch, { recursive: true, force: true });
      }
      return 0;
    }
    const result = restoreDatabase(config.databasePath, source);
    for (const line of describeCheck(source, result.check)) io.out(line);
    if (result.replacedBy) {
      io.out(
        result.replacedWasDamaged
          ? `The database it replaced could not be opened; its files are kept as they were: ${result.replacedBy} (with -wal and -shm where there were any).`
          : `The database it replaced is kept, complete, as ${result.replacedBy}`,
      );
    }
    io.out(`Restored to ${config.databasePath}. Start Lotwise again.`);
    return 0;
  } catch (error) {
    if (error instanceof RestoreRefused) {
      io.err(`Not restored: ${error.message}`);
      return 1;
    }
    throw error;
  }
}
