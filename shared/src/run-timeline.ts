import { DEVIATION_REASONS, TIMELINE_KINDS } from '@lotwise/chem';
import { z } from 'zod';
import { procedureStepSchema } from './procedures';

export const timelineKinds = TIMELINE_KINDS;
export const timelineKindSchema = z.enum(TIMELINE_KINDS, {
  message: `must be one of: ${TIMELINE_KINDS.join(', ')}`,
});
export const deviationReasonSchema = z.enum(DEVIATION_REASONS);

/** Photos taken at the bench: images only, checked by their content. */
export const runPhotoContentTypes = ['image/jpeg', 'image/png', 'image/webp'] as const;
/** Largest photo accepted, bytes (a phone photo at full size is 2–6 MB). */
export const runPhotoMaxBytes = 12 * 1024 * 1024;

/** An id the device gives each entry, so a resend is stored once (a UUID, or similar). */
export const clientIdSchema = z
  .string()
  .trim()
  .min(8, 'must be at least 8 characters')
  .max(64, 'is at most 64 characters')
  .regex(/^[A-Za-z0-9_-]+$/, 'may hold only letters, digits, - and _');

/**
 * `POST /api/runs/:id/timeline`: one entry, as taken at the bench.
 * - `reading`: `temperatureC`; `stepIndex` (default: the step under way at `at`).
 * - `note`: `text`. `photo`: `uploadId` from `POST /api/runs/:id/photos`, `text` a caption.
 * - `step-start` / `step-end`: `stepIndex`.
 * - `timer-start`: `stepIndex` (runs the step's duration) or `durationMinutes`; `timer-end`
 *   stops the timer started by the entry whose client id is `timerClientId` (default: the
 *   latest running timer of `stepIndex`).
 * Sending the same `clientId` again answers the stored entry (200) and stores nothing.
 */
export const timelineEntryInputSchema = z
  .object({
    clientId: clientIdSchema,
    kind: timelineKindSchema,
    /** When it happened (ISO 8601 with offset); the time a reading was taken. */
    at: z.iso.datetime({ offset: true, message: 'must be a date and time (ISO 8601)' }),
    stepIndex: z.number().int().min(0).nullable().default(null),
    temperatureC: z
      .number({ message: 'must be a temperature in °C' })
      .min(-200, 'must be at least -200 °C')
      .max(1000, 'must be at most 1000 °C')
      .nullable()
      .default(null),
    text: z.string().trim().max(2000, 'is at most 2000 characters').default(''),
    uploadId: z.number().int().positive().nullable().default(null),
    durationMinutes: z
      .number()
      .gt(0, 'must be more than 0 minutes')
      .max(10080, 'is at most 10080 minutes (a week)')
      .nullable()
      .default(null),
    timerClientId: clientIdSchema.nullable().default(null),
  })
  .strict()
  .superRefine((entry, ctx) => {
    const need = (field: keyof typeof entry, message: string) =>
      ctx.addIssue({ code: 'custom', path: [field], message });
    if (entry.kind === 'reading' && entry.temperatureC === null) {
      need('temperatureC', 'a reading needs a temperature');
    }
    if (entry.kind === 'note' && !entry.text) need('text', 'write the note');
    if (entry.kind === 'photo' && entry.uploadId === null) {
      need('uploadId', 'upload the photo first (POST /api/runs/:id/photos)');
    }
    if ((entry.kind === 'step-start' || entry.kind === 'step-end') && entry.stepIndex === null) {
      need('stepIndex', 'name the step');
    }
    if (
      entry.kind === 'timer-start' &&
      entry.stepIndex === null &&
      entry.durationMinutes === null
    ) {
      need('durationMinutes', 'give the step (whose duration it runs) or a duration');
    }
  });
export type TimelineEntryInput = z.input<typeof timelineEntryInputSchema>;
export type TimelineEntryParsed = z.output<typeof timelineEntryInputSchema>;

export const deviationSchema = z.object({
  reason: deviationReasonSchema,
  stepIndex: z.number().int(),
  /** In words, with the window or time it was measured against. */
  message: z.string(),
  /** What the step says to do when outside its window; empty when it says nothing. */
  instruction: z.string(),
});
export type DeviationView = z.infer<typeof deviationSchema>;

export const timelineEntrySchema = z.object({
  id: z.number().int(),
  clientId: z.string(),
  kind: timelineKindSchema,
  at: z.string(),
  stepIndex: z.number().int().nullable(),
  temperatureC: z.number().nullable(),
  text: z.string(),
  /** A photo: its id, and where to fetch it. */
  uploadId: z.number().int().nullable(),
  photoUrl: z.string().nullable(),
  /** A timer: its length and when it ends (stored, so it rings after the page was closed). */
  durationMinutes: z.number().nullable(),
  endsAt: z.string().nullable(),
  /** A timer-end: the client id of the timer it stopped. */
  timerClientId: z.string().nullable(),
  deviation: deviationSchema.nullable(),
  recordedBy: z.object({ id: z.number().int(), displayName: z.string() }).nullable(),
  /** When it reached the server. */
  receivedAt: z.string(),
});
export type TimelineEntry = z.infer<typeof timelineEntrySchema>;

/** A step with what happened to it in this run. */
export const timelineStepSchema = procedureStepSchema.extend({
  /** The scaled amount of the step's line, e.g. "12.5 mL", when it adds one. */
  additionAmount: z.string().nullable(),
  additionChemical: z.string().nullable(),
  /** "5–7 °C", "at most 30 °C"; null without a window. */
  windowText: z.string().nullable(),
  startedAt: z.string().nullable(),
  endedAt: z.string().nullable(),
});
export type TimelineStepView = z.infer<typeof timelineStepSchema>;

/** `GET /api/runs/:id/timeline`: entries ordered by `at` (then by arrival). */
export const runTimelineSchema = z.object({
  runId: z.number().int(),
  status: z.enum(['open', 'recorded']),
  steps: z.array(timelineStepSchema),
  entries: z.array(timelineEntrySchema),
  /** The step under way now (latest started, not ended); null when none is. */
  currentStepIndex: z.number().int().nullable(),
  /** Timers started and not stopped, soonest end first (their `timer-start` entries). */
  runningTimers: z.array(timelineEntrySchema),
  /** Every entry that deviated, in time order. */
  deviations: z.array(
    z.object({ entryId: z.number().int(), at: z.string(), deviation: deviationSchema }),
  ),
});
export type RunTimeline = z.infer<typeof runTimelineSchema>;

/** `POST /api/runs/:id/timeline` answers the stored entry; `created` false on a resend. */
export const timelineAppendResultSchema = z.object({
  entry: timelineEntrySchema,
  created: z.boolean(),
});
export type TimelineAppendResult = z.infer<typeof timelineAppendResultSchema>;

/** `POST /api/runs/:id/photos` (multipart `file`, field `clientId`): the stored photo. */
export const runPhotoSchema = z.object({
  uploadId: z.number().int(),
  runId: z.number().int(),
  clientId: z.string(),
  fileName: z.string(),
  contentType: z.string(),
  size: z.number().int(),
  url: z.string(),
  uploadedAt: z.string(),
});
export type RunPhoto = z.infer<typeof runPhotoSchema>;
