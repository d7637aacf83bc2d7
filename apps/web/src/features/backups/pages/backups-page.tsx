import type { ReactNode } from 'react';
import { CalendarClock, DatabaseBackup, Download, Hand } from 'lucide-react';
import { formatBytes, type BackupKind, type BackupList } from '@lotwise/shared';
import { Badge } from '../../../components/ui/badge';
import { Button, buttonClasses } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { Notice } from '../../../components/ui/notice';
import { PageSpinner } from '../../../components/ui/spinner';
import { errorMessage } from '../../../lib/api-client';
import { formatCount, formatDateTime } from '../../../lib/format';
import { backupDownloadUrl, useBackups, useTakeBackup } from '../api';
import { TableScroll } from '../../../components/ui/table-scroll';

const kindBadge: Record<BackupKind, { label: string; icon: ReactNode }> = {
  scheduled: { label: 'scheduled', icon: <CalendarClock aria-hidden="true" /> },
  manual: { label: 'by hand', icon: <Hand aria-hidden="true" /> },
};

function ScheduleText({ schedule }: { schedule: BackupList['schedule'] }) {
  const folder = <code className="rounded bg-ink-100 px-1 text-ink-800">{schedule.folder}</code>;
  if (schedule.intervalHours === 0) {
    return (
      <>
        Scheduled backups are off (BACKUP_INTERVAL_HOURS is 0). Backups taken here go to {folder}.
      </>
    );
  }
  return (
    <>
      The server takes a backup every {schedule.intervalHours} hours and keeps the latest{' '}
      {schedule.keep} scheduled ones in {folder}. Backups taken here or with{' '}
      <code className="rounded bg-ink-100 px-1 text-ink-800">npm run backup</code> stay until
      someone deletes them on the server.
    </>
  );
}

/** Admin: the database backups on the server; take one now, download any of them. */
export function BackupsPage() {
  const backups = useBackups();
  const take = useTakeBackup();
  const running = take.isPending || backups.data?.running === true;
  const takeButton = (
    <Button
      variant="primary"
      icon={<DatabaseBackup aria-hidden="true" />}
      busy={running}
      onClick={() => take.mutate()}
    >
      {running ? 'Backing up…' : 'Back up now'}
    </Button>
  );

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div className="max-w-3xl">
          <h1 className="text-xl font-semibold text-ink-900">Backups</h1>
          <p className="text-sm text-ink-600">
            Each backup is a complete, consistent copy of the Lotwise database: every account, all
            stock and its history. Whoever holds a copy can read all of it, so keep downloads
            somewhere safe. To restore one, stop Lotwise and run{' '}
            <code className="rounded bg-ink-100 px-1 text-ink-800">npm run restore -- FILE</code> on
            the server (see the operations guide).
          </p>
        </div>
        {backups.isSuccess && backups.data.items.length > 0 && takeButton}
      </div>

      {take.isError && (
        <Notice tone="danger" title="No backup was taken">
          {errorMessage(take.error)}
        </Notice>
      )}
      {take.isSuccess && (
        <Notice tone="ok" title="Backup taken">
          {take.data.name}, {formatBytes(take.data.bytes)}: the rows of all{' '}
          {formatCount(Object.keys(take.data.rowCounts).length)} tables were found again in the
          copy.
        </Notice>
      )}

      {backups.isPending ? (
        <PageSpinner label="Loading the backups…" />
      ) : backups.isError ? (
        <ErrorState error={backups.error} onRetry={() => void backups.refetch()} />
      ) : (
        <>
          <p className="text-sm text-ink-700">
            <ScheduleText schedule={backups.data.schedule} />
          </p>
          {backups.data.items.length === 0 ? (
            <div className="rounded-lg border border-ink-200 bg-white">
              <EmptyState
                icon={<DatabaseBackup aria-hidden="true" />}
                title="No backups yet"
                action={takeButton}
              >
                {backups.data.schedule.intervalHours > 0
                  ? 'The first scheduled backup is taken soon after the server starts. You can take one now.'
                  : 'Take one now, and schedule them with BACKUP_INTERVAL_HOURS.'}
              </EmptyState>
            </div>
          ) : (
            <TableScroll className="rounded-lg border border-ink-200 bg-white">
              <table className="w-full text-left text-sm">
                <caption className="sr-only">Backups, newest first</caption>
                <thead className="bg-ink-50 text-ink-700">
                  <tr>
                    <th scope="col" className="px-3 py-2">
                      Taken
                    </th>
                    <th scope="col" className="px-3 py-2">
                      File
                    </th>
                    <th scope="col" className="px-3 py-2">
                      Kind
                    </th>
                    <th scope="col" className="px-3 py-2 text-right">
                      Size
                    </th>
                    <th scope="col" className="px-3 py-2">
                      <span className="sr-only">Download</span>
                    </th>
                  </tr>
                </thead>
                <tbody className="divide-y divide-ink-100">
                  {backups.data.items.map((backup) => (
                    <tr key={backup.name}>
                      <td className="px-3 py-2 whitespace-nowrap">
                        {formatDateTime(backup.takenAt)}
                      </td>
                      <td className="px-3 py-2 font-mono text-xs break-all text-ink-800">
                        {backup.name}
                      </td>
                      <td className="px-3 py-2">
                        <Badge tone="neutral" icon={kindBadge[backup.kind].icon}>
                          {kindBadge[backup.kind].label}
                        </Badge>
                      </td>
                      <td className="px-3 py-2 text-right whitespace-nowrap tabular-nums">
                        {formatBytes(backup.bytes)}
                      </td>
                      <td className="px-3 py-2 text-right">
                        <a
                          href={backupDownloadUrl(backup.name)}
                          download={backup.name}
                          className={buttonClasses('secondary', 'sm')}
                          aria-label={`Download ${backup.name}`}
                        >
                          <Download aria-hidden="true" className="size-4" />
                          Download
                        </a>
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </TableScroll>
          )}
        </>
      )}
    </div>
  );
}
