import { z } from 'zod';

/**
 * What the web app may know of the server's set-up before anyone signs in. `publicUrl` is the
 * address people open Lotwise at (`PUBLIC_URL`, no trailing slash): printed QR codes carry it,
 * so a phone's own camera app opens the container even when the label was printed from
 * another address.
 */
export const publicSettingsSchema = z.object({
  publicUrl: z.string(),
});
export type PublicSettings = z.infer<typeof publicSettingsSchema>;
