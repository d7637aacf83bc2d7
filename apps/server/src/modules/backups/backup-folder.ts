import { existsSync, mkdirSync, readdirSync, statSync, unlinkSync } from 'node:fs';
import path from 'node:path';
import { backupNamePattern, type Backup, type BackupKind } from '@lotwise/shared';
import type { Config } from '../../config';

/** A backup being written; renamed to its final name only once it is complete and checked. */
export const partialSuffix = '.partial';

/** `20261202T224000Z`: the UTC time in a file name (no colons, sorts as text). */
export function compactUtc(at: Date): string {
  return at
    .toISOString()
    .replace(/[-:]/g, '')
    .replace(/\.\d{3}Z$/, 'Z');
}

function parseCompactUtc(text: string): Date {
  const [, y, mo, d, h, mi, s] = /^(\d{4})(\d{2})(\d{2})T(\d{2})(\d{2})(\d{2})Z$/.exec(text) ?? [];
  return new Date(Date.UTC(+y!, +mo! - 1, +d!, +h!, +mi!, +s!));
}

/** The backup a file name describes, or null for any other file. */
export function parseBackupName(name: string): Pick<Backup, 'name' | 'kind' | 'takenAt'> | null {
  const match = backupNamePattern.exec(name);
  if (!match) return null;
  return {
    name,
    kind: match[2] as BackupKind,
    takenAt: parseCompactUtc(match[1]!).toISOString(),
  };
}

/**
 * Creates the backups folder when missing, readable by this user only (it holds copies of
 * every account and password hash). An existing folder keeps the mode its owner gave it.
 */
export function ensureBackupFolder(dir: string): void {
  if (!existsSync(dir)) mkdirSync(dir, { recursive: true, mode: 0o700 });
  if (!statSync(dir).isDirectory()) {
    throw new Error(`The backups folder ${dir} is not a folder. Point BACKUP_DIR at a folder.`);
  }
}

/** A free path for a new backup of `kind` taken at `at`: `-2`, `-3`… when the second is taken. */
export function newBackupPath(dir: string, kind: BackupKind, at: Date): string {
  const stem = `lotwise-${compactUtc(at)}-${kind}`;
  for (let n = 1; n < 10000; n++) {
    const name = n === 1 ? `${stem}.sqlite` : `${stem}-${n}.sqlite`;
    const file = path.join(dir, name);
    if (!existsSync(file) && !existsSync(file + partialSuffix)) return file;
  }
  throw new Error(`The backups folder ${dir} has no free name for a backup at ${at.toISOString()}`);
}

/** The backups in `dir`, newest first; other files in the folder are left out. */
export function listBackups(dir: string): Backup[] {
  if (!existsSync(dir)) return [];
  const backups: Backup[] = [];
  for (const name of readdirSync(dir)) {
    const parsed = parseBackupName(name);
    if (!parsed) continue;
    const stats = statSync(path.join(dir, name), { throwIfNoEntry: false });
    if (!stats?.isFile()) continue;
    backups.push({ ...parsed, bytes: stats.size });
  }
  // Newest first; within one second, the later of `…-manual.sqlite`, `…-manual-2.sqlite` first.
  const sequence = (name: string) => Number(backupNamePattern.exec(name)?.[3] ?? 1);
  return backups.sort((a, b) =>
    a.takenAt === b.takenAt
      ? sequence(b.name) - sequence(a.name) || a.name.localeCompare(b.name)
      : b.takenAt.localeCompare(a.takenAt),
  );
}

/**
 * The path of the backup called `name` in `dir`, or null when there is none. Only names of
 * the backup pattern are accepted (no separators, no `..`), and the path is checked to stay
 * in the folder all the same.
 */
export function backupFile(dir: string, name: string): string | null {
  if (!parseBackupName(name)) return null;
  const folder = path.resolve(dir);
  const file = path.resolve(folder, name);
  if (path.dirname(file) !== folder) return null;
  const stats = statSync(file, { throwIfNoEntry: false });
  return stats?.isFile() ? file : null;
}

/** Deletes the scheduled backups beyond the newest `keep`; backups taken by hand stay. */
export function pruneScheduledBackups(dir: string, keep: number): string[] {
  const old = listBackups(dir)
    .filter((backup) => backup.kind === 'scheduled')
    .slice(keep);
  for (const backup of old) unlinkSync(path.join(dir, backup.name));
  return old.map((backup) => backup.name);
}

/**
 * Deletes backups a stopped process left half-written (`*.partial`) once they are older than
 * `olderThanMs`, so one being written right now by another process is left alone.
 */
export function removeStalePartials(dir: string, olderThanMs: number, now = Date.now()): string[] {
  if (!existsSync(dir)) return [];
  const removed: string[] = [];
  for (const name of readdirSync(dir)) {
    if (!name.startsWith('lotwise-') || !name.endsWith(partialSuffix)) continue;
    const file = path.join(dir, name);
    const stats = statSync(file, { throwIfNoEntry: false });
    if (stats?.isFile() && now - stats.mtimeMs > olderThanMs) {
      unlinkSync(file);
      removed.push(name);
    }
  }
  return removed;
}

/** The time of the newest backup in the backups folder (any kind), or null when there is none. */
export function latestBackup(config: Pick<Config, 'backup'>): Date | null {
  const newest = listBackups(config.backup.dir)[0];
  return newest ? new Date(newest.takenAt) : null;
}
