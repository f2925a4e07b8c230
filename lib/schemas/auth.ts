import { z } from 'zod';
import { roleSchema } from './roles';

/** An e-mail address as accounts store it: trimmed and lower-cased. */
export const emailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .pipe(z.email('Enter an e-mail address such as name@example.test.').max(254));

/** A new password: long enough to resist guessing, short enough to hash cheaply. */
export const newPasswordSchema = z
  .string()
  .min(12, 'Use at least 12 characters.')
  .max(200, 'Use at most 200 characters.');

/** The signed-in person, as GET /auth/me and POST /auth/sign-in return them. */
export const meSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  displayName: z.string(),
  roles: z.array(roleSchema),
});
export type Me = z.infer<typeof meSchema>;

/** POST /auth/sign-in */
export const signInBodySchema = z.strictObject({
  email: emailSchema,
  password: z.string().min(1, 'Enter your password.').max(200, 'Use at most 200 characters.'),
});
export type SignInBody = z.infer<typeof signInBodySchema>;

/** PUT /auth/password */
export const changePasswordBodySchema = z.strictObject({
  currentPassword: z.string().min(1, 'Enter your current password.').max(200),
  newPassword: newPasswordSchema,
});
export type ChangePasswordBody = z.infer<typeof changePasswordBodySchema>;

/** A single-use link token from an invitation or reset e-mail. */
export const linkTokenSchema = z.string().regex(/^[A-Za-z0-9_-]{32,64}$/, 'This link is incomplete; open it again from the e-mail.');

/** POST /auth/invitation/accept and POST /auth/password-reset/complete */
export const setPasswordBodySchema = z.strictObject({
  token: linkTokenSchema,
  password: newPasswordSchema,
});
export type SetPasswordBody = z.infer<typeof setPasswordBodySchema>;

/** The answer to a completed invitation or reset: whose password was set. */
export const passwordSetSchema = z.object({ email: z.string() });

/** POST /auth/password-reset/request */
export const resetRequestBodySchema = z.strictObject({ email: emailSchema });
export type ResetRequestBody = z.infer<typeof resetRequestBodySchema>;

/** An answer that only says the request was taken. */
export const acceptedSchema = z.object({ accepted: z.literal(true) });
