import { z } from 'zod';
import { emailSchema, passwordSchema, roleSchema, userSchema } from './auth';
import { listQuerySchema } from './list';
import { nameSchema } from './names';

const displayNameSchema = nameSchema(120);

/**
 * Create a user. With a password the account is ready at once; without one Lotwise
 * answers with an invitation link that the admin passes on.
 */
export const userCreateSchema = z.object({
  email: emailSchema,
  displayName: displayNameSchema,
  role: roleSchema,
  password: passwordSchema.optional(),
});
export type UserCreate = z.infer<typeof userCreateSchema>;

export const userPatchSchema = z
  .object({
    displayName: displayNameSchema,
    role: roleSchema,
    active: z.boolean(),
    password: passwordSchema,
  })
  .partial();
export type UserPatch = z.infer<typeof userPatchSchema>;

export const userListQuerySchema = listQuerySchema(
  ['email', 'displayName', 'role', 'createdAt', 'lastLoginAt'],
  'displayName.asc',
);
export type UserListQuery = z.infer<typeof userListQuerySchema>;

/** Answer to creating a user; `inviteUrl` only when no password was given. */
export const userCreatedSchema = z.object({
  user: userSchema,
  inviteUrl: z.string().nullable(),
});
export type UserCreated = z.infer<typeof userCreatedSchema>;
