import type { AuditAction, BackupList, BackupTaken } from '@lotwise/shared';
import { nowIso } from '../../db/sql';
import type { Config } from '../../config';
import type { Store } from '../../db/store';
import { AppError } from '../../lib/app-error';
import { backupFile, listBackups } from './backup-folder';
import { BackupError } from './database-copy';
import { backupRunning, takeBackup, type BackupSettings } from './take-backup';

/** The admin's view of the backups folder: list, take one now, download one. */
export function backupsService(store: Store, config: BackupSettings & Pick<Config, 'databaseUrl'>) {
  const audit = (actorId: number, action: AuditAction, name: string) =>
    store.repos.audit.insert({
      actorId,
      action,
      targetType: 'backup',
      targetId: null,
      detail: { name },
      createdAt: nowIso(),
    });

  return {
    list(): BackupList {
      return {
        items: listBackups(config.backup.dir),
        schedule: {
          intervalHours: config.backup.intervalHours,
          keep: config.backup.keep,
          folder: config.backup.dir,
        },
        running: backupRunning(config.backup.dir),
      };
    },

    async takeNow(actorId: number): Promise<BackupTaken> {
      if (config.databaseUrl !== null) {
        throw AppError.conflict(
          'This lab keeps its data in PostgreSQL, whose backups are taken with pg_dump (see docs/operations.md); the backups here are copies of an SQLite file.',
        );
      }
      try {
        const { file: _file, pruned: _pruned, ...taken } = await takeBackup(config, 'manual');
        await audit(actorId, 'backup.created', taken.name);
        return taken;
      } catch (error) {
        // Busy, or the database file is not there to copy: the admin is told why.
        if (error instanceof BackupError) throw AppError.conflict(error.message);
        throw error;
      }
    },

    /** The file to send for `name`; the download is written to the audit trail first. */
    async fileToDownload(name: string, actorId: number): Promise<string> {
      const file = backupFile(config.backup.dir, name);
      if (!file) throw AppError.notFound(`There is no backup called ${name}.`);
      await audit(actorId, 'backup.downloaded', name);
      return file;
    },
  };
}
export type BackupsService = ReturnType<typeof backupsService>;
