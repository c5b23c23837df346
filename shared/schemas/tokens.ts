import { z } from 'zod';
import { TOKEN_NAME_MAX_LENGTH } from './limits';

export const createTokenSchema = z.object({
  name: z.string().trim().min(1, { message: 'Name the token.' }).max(TOKEN_NAME_MAX_LENGTH),
});
export type CreateTokenInput = z.infer<typeof createTokenSchema>;

export const apiTokenSchema = z.object({
  id: z.string(),
  name: z.string(),
  createdAt: z.string(),
  lastUsedAt: z.string().nullable(),
});
export type ApiToken = z.infer<typeof apiTokenSchema>;
export const apiTokenListSchema = z.array(apiTokenSchema);

/** Returned once, on creation: the secret is never shown again. */
export const createdTokenSchema = apiTokenSchema.extend({
  token: z.string(),
});
export type CreatedToken = z.infer<typeof createdTokenSchema>;
