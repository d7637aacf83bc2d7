import { z } from 'zod';
import { regexes } from 'zod/v4/core';
import { emailAddressMessage } from './email-address';
import { roles } from './roles';

export const roleSchema = z.enum(roles, { message: `must be one of: ${roles.join(', ')}` });

export const emailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .pipe(z.email({ pattern: regexes.email, message: emailAddressMessage }));

/** Minimum password rules: long enough to matter, short enough for bcrypt (72 bytes). */
export const passwordSchema = z
  .string()
  .min(10, 'must be at least 10 characters')
  .max(72, 'must be at most 72 characters');

export const loginBodySchema = z.object({
  email: emailSchema,
  password: z.string().min(1, 'is required'),
});
export type LoginBody = z.infer<typeof loginBodySchema>;

export const userSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  displayName: z.string(),
  role: roleSchema,
  active: z.boolean(),
  /** True while the user has been invited and has not chosen a password yet. */
  invitePending: z.boolean(),
  lastLoginAt: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type User = z.infer<typeof userSchema>;

export const meResponseSchema = z.object({ user: userSchema });
export type MeResponse = z.infer<typeof meResponseSchema>;

export const acceptInviteBodySchema = z.object({
  token: z.string().min(1, 'is required'),
  password: passwordSchema,
});
export type AcceptInviteBody = z.infer<typeof acceptInviteBodySchema>;

/** A signed-in user changes their own password; every other session of theirs ends. */
export const changePasswordBodySchema = z.object({
  currentPassword: z.string().min(1, 'is required'),
  newPassword: passwordSchema,
});
export type ChangePasswordBody = z.infer<typeof changePasswordBodySchema>;
