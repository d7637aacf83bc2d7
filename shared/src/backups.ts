import { z } from 'zod';

/** How a backup came to be: the server's schedule, or a person (admin page, command line). */
export const backupKinds = ['scheduled', 'manual'] as const;
export type BackupKind = (typeof backupKinds)[number];

/**
 * The file name of a backup in the backups folder: `lotwise-<UTC time>-<kind>[-n].sqlite`,
 * e.g. `lotwise-20261202T224000Z-scheduled.sqlite`. Only names of this form are listed and
 * downloaded, so a name can never reach outside the folder.
 */
export const backupNamePattern =
  /^lotwise-(\d{8}T\d{6}Z)-(scheduled|manual)(?:-(\d{1,4}))?\.sqlite$/;

export const backupNameSchema = z
  .string()
  .max(80)
  .regex(backupNamePattern, 'is not the name of a Lotwise backup');

export const backupNameParamsSchema = z.object({ name: backupNameSchema });

/** One backup file. */
export const backupSchema = z.object({
  name: z.string(),
  kind: z.enum(backupKinds),
  /** The moment the backup holds (UTC, ISO 8601). */
  takenAt: z.string(),
  /** File size in bytes. */
  bytes: z.number().int().nonnegative(),
});
export type Backup = z.infer<typeof backupSchema>;

/** The backups folder as the admin page shows it: newest first, with the schedule. */
export const backupListSchema = z.object({
  items: z.array(backupSchema),
  schedule: z.object({
    /** Hours between scheduled backups; 0: the server takes none. */
    intervalHours: z.number().int().nonnegative(),
    /** Scheduled backups kept. */
    keep: z.number().int().positive(),
    /** The folder on the server that holds the files. */
    folder: z.string(),
  }),
  /** True while a backup is being taken. */
  running: z.boolean(),
});
export type BackupList = z.infer<typeof backupListSchema>;

/** A backup just taken, with the rows it checked in the copy. */
export const backupTakenSchema = backupSchema.extend({
  /** Rows per table, counted in the database at the backup's moment and found in the copy. */
  rowCounts: z.record(z.string(), z.number().int().nonnegative()),
});
export type BackupTaken = z.infer<typeof backupTakenSchema>;
