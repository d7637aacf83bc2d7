import path from 'node:path';
import type { BackupKind, BackupTaken } from '@lotwise/shared';
import type { Config } from '../../config';
import {
  ensureBackupFolder,
  newBackupPath,
  parseBackupName,
  pruneScheduledBackups,
} from './backup-folder';
import { BackupError, copyDatabase, type CopyOptions } from './database-copy';

export type BackupSettings = Pick<Config, 'databasePath' | 'backup'>;

/** The backup this process is taking, per backups folder: one at a time. */
const running = new Map<string, Promise<unknown>>();

/** True while this process is taking a backup into `dir`. */
export function backupRunning(dir: string): boolean {
  return running.has(path.resolve(dir));
}

/** Another backup is being taken into the same folder by this process. */
export class BackupBusyError extends BackupError {
  override name = 'BackupBusyError';
}

export interface TakenBackup extends BackupTaken {
  file: string;
  /** Scheduled backups deleted after this one, beyond BACKUP_KEEP. */
  pruned: string[];
}

/**
 * Takes a backup of the database into the backups folder under a new timestamped name. A
 * scheduled one then deletes the scheduled backups beyond `config.backup.keep`.
 */
export async function takeBackup(
  config: BackupSettings,
  kind: BackupKind,
  options: Partial<CopyOptions> = {},
): Promise<TakenBackup> {
  const dir = path.resolve(config.backup.dir);
  if (running.has(dir)) {
    throw new BackupBusyError('A backup is being taken right now; it will be listed when done.');
  }
  const work = (async (): Promise<TakenBackup> => {
    ensureBackupFolder(dir);
    const destination = newBackupPath(dir, kind, new Date());
    const copy = await copyDatabase(config.databasePath, destination, {
      check: 'counts',
      ...options,
    });
    const pruned = kind === 'scheduled' ? pruneScheduledBackups(dir, config.backup.keep) : [];
    const name = path.basename(copy.file);
    return {
      ...parseBackupName(name)!,
      file: copy.file,
      bytes: copy.bytes,
      rowCounts: copy.rowCounts,
      pruned,
    };
  })();
  running.set(dir, work);
  try {
    return await work;
  } finally {
    running.delete(dir);
  }
}
