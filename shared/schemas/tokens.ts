import { z } from 'zod';
import { text } from './text';
import { TOKEN_NAME_MAX_LENGTH } from './limits';

export const createTokenSchema = z.object({
  name: text().trim().min(1, { message: 'Name the token.' }).max(TOKEN_NAME_MAX_LENGTH),
});
export type CreateTokenInput = z.infer<typeof createTokenSchema>;

export const apiTokenSchema = z.object({
  id: text(),
  name: text(),
  createdAt: text(),
  lastUsedAt: text().nullable(),
});
export type ApiToken = z.infer<typeof apiTokenSchema>;
export const apiTokenListSchema = z.array(apiTokenSchema);

/** Returned once, on creation: the secret is never shown again. */
export const createdTokenSchema = apiTokenSchema.extend({
  token: text(),
});
export type CreatedToken = z.infer<typeof createdTokenSchema>;
