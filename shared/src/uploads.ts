import { z } from 'zod';

/** A stored upload as the API describes it (never where it is kept on disk). */
export const storedFileSchema = z.object({
  /** The name the file had when uploaded (sanitized); downloads use it. */
  fileName: z.string(),
  /** Bytes. */
  size: z.number().int(),
  /** Detected from the file's content, not from its name. */
  contentType: z.string(),
  uploadedAt: z.string(),
});
export type StoredFile = z.infer<typeof storedFileSchema>;

/** Safety data sheets are PDFs. */
export const sdsContentTypes = ['application/pdf'] as const;
/** Certificates of analysis: PDF, or a scan as PNG or JPEG. */
export const certificateContentTypes = ['application/pdf', 'image/png', 'image/jpeg'] as const;
export type UploadContentType = (typeof certificateContentTypes)[number];
