import { z } from 'zod';

/** A personal API token as listed: never the secret itself. */
export const apiTokenSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  hint: z.string(),
  createdAt: z.string(),
  lastUsedAt: z.string().nullable(),
  revokedAt: z.string().nullable(),
});
export type ApiToken = z.infer<typeof apiTokenSchema>;
export const apiTokenListSchema = z.object({ tokens: z.array(apiTokenSchema) });

/** POST /tokens */
export const createTokenBodySchema = z.strictObject({
  name: z.string().trim().min(1, 'Name the token after what will use it.').max(80, 'Use at most 80 characters.'),
});
export type CreateTokenBody = z.infer<typeof createTokenBodySchema>;

/** The one answer that carries the secret: shown once, stored only as a hash. */
export const createdTokenSchema = z.object({ token: apiTokenSchema, secret: z.string() });

export const tokenIdParamsSchema = z.strictObject({ tokenId: z.coerce.number().int().positive() });
