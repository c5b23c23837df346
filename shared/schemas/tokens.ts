import { z } from 'zod';
import { text } from './text';
import { TOKEN_NAME_MAX_LENGTH } from './limits';

export const TOKEN_SCOPES = ['read', 'read-write'] as const;
export const tokenScopeSchema = z.enum(TOKEN_SCOPES, {
  error: "Scope is 'read' (looks only) or 'read-write'.",
});
export type TokenScope = z.infer<typeof tokenScopeSchema>;
export const TOKEN_SCOPE_LABELS: Record<TokenScope, string> = {
  read: 'Read only',
  'read-write': 'Read and write',
};
/** How long a new token works, days. */
export const TOKEN_EXPIRY_DAYS = { default: 90, max: 365 } as const;

export const createTokenSchema = z.object({
  name: text().trim().min(1, { message: 'Name the token.' }).max(TOKEN_NAME_MAX_LENGTH),
  /** Read-only unless asked otherwise: a leaked script token should not be able to change records. */
  scope: tokenScopeSchema.default('read'),
  expiresInDays: z
    .number({ error: 'Give the number of days the token works.' })
    .int({ message: 'Give a whole number of days.' })
    .min(1, { message: 'A token works at least 1 day.' })
    .max(TOKEN_EXPIRY_DAYS.max, { message: `A token works at most ${TOKEN_EXPIRY_DAYS.max} days.` })
    .default(TOKEN_EXPIRY_DAYS.default),
});
export type CreateTokenInput = z.input<typeof createTokenSchema>;

export const apiTokenSchema = z.object({
  id: text(),
  name: text(),
  scope: tokenScopeSchema,
  createdAt: text(),
  expiresAt: text(),
  lastUsedAt: text().nullable(),
});
export type ApiToken = z.infer<typeof apiTokenSchema>;
export const apiTokenListSchema = z.array(apiTokenSchema);

/** Returned once, on creation: the secret is never shown again. */
export const createdTokenSchema = apiTokenSchema.extend({
  token: text(),
});
export type CreatedToken = z.infer<typeof createdTokenSchema>;
