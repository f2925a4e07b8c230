import { z } from 'zod';
import { emailSchema } from './auth';
import { roleSchema } from './roles';

export const roleListSchema = z
  .array(roleSchema)
  .min(1, 'Pick at least one role.')
  .transform((r) => [...new Set(r)].sort());

/** One person as the admin list shows them. */
export const userSummarySchema = z.object({
  id: z.number().int(),
  email: z.string(),
  displayName: z.string(),
  roles: z.array(roleSchema),
  active: z.boolean(),
  /** 'active' once a password is set, 'invited' until then, 'deactivated' after. */
  status: z.enum(['active', 'invited', 'deactivated']),
});
export type UserSummary = z.infer<typeof userSummarySchema>;
export const userListSchema = z.object({ users: z.array(userSummarySchema) });

/** POST /users: invite a person by e-mail with their roles. */
export const inviteBodySchema = z.strictObject({
  email: emailSchema,
  displayName: z.string().trim().min(1, 'Enter a name.').max(120, 'Use at most 120 characters.'),
  roles: roleListSchema,
});
export type InviteBody = z.input<typeof inviteBodySchema>;

/** PUT /users/:userId/roles */
export const rolesBodySchema = z.strictObject({ roles: roleListSchema });
export type RolesBody = z.input<typeof rolesBodySchema>;

/** POST /users/:userId/deactivate: the reason goes into the trail. */
export const deactivateBodySchema = z.strictObject({
  reason: z.string().trim().min(1, 'Say why, for the trail.').max(500),
});
export type DeactivateBody = z.infer<typeof deactivateBodySchema>;

/** Path parameter of every /users/:userId route. */
export const userIdParamsSchema = z.strictObject({ userId: z.coerce.number().int().positive() });
