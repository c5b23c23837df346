import { z } from 'zod';
import { accountAbilitiesSchema, workspaceAbilitiesSchema } from './actions';
import { text } from './text';
import {
  EMAIL_MAX_LENGTH,
  NAME_MAX_LENGTH,
  PASSWORD_MAX_LENGTH,
  PASSWORD_MIN_LENGTH,
} from './limits';

export const ROLES = ['admin', 'chemist', 'reviewer', 'engineer'] as const;
/** admin: manages members; chemist: authors routes; reviewer: reviews; engineer: scale-up engineer. */
export const roleSchema = z.enum(ROLES);
export type Role = z.infer<typeof roleSchema>;

/** Human labels for the roles, shared so every screen says the same thing. */
export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Admin',
  chemist: 'Chemist',
  reviewer: 'Reviewer',
  engineer: 'Scale-up engineer',
};

// Trim and lower-case run before the format check, so " Ann@Example.com " is accepted as ann@example.com.
export const emailSchema = text()
  .trim()
  .toLowerCase()
  .max(EMAIL_MAX_LENGTH)
  .email({ message: 'Enter a valid e-mail address.' });

/** A new password: what the forms and the server both accept. */
export const newPasswordSchema = text()
  .min(PASSWORD_MIN_LENGTH, { message: `Use at least ${PASSWORD_MIN_LENGTH} characters.` })
  .max(PASSWORD_MAX_LENGTH, { message: `Use at most ${PASSWORD_MAX_LENGTH} characters.` });

export const personNameSchema = text()
  .trim()
  .min(1, { message: 'Enter a name.' })
  .max(NAME_MAX_LENGTH);

export const signInSchema = z.object({
  email: emailSchema,
  // Existing passwords are checked, not re-validated against today's rules.
  password: text().min(1, { message: 'Enter your password.' }).max(PASSWORD_MAX_LENGTH),
});
export type SignInInput = z.infer<typeof signInSchema>;

export const sessionUserSchema = z.object({
  id: text(),
  email: text(),
  name: text(),
});
export type SessionUser = z.infer<typeof sessionUserSchema>;

export const sessionWorkspaceSchema = z.object({
  id: text(),
  name: text(),
  slug: text(),
  roles: z.array(roleSchema),
});
export type SessionWorkspace = z.infer<typeof sessionWorkspaceSchema>;

/**
 * What the signed-in user may do, for showing or hiding controls:
 * `global` holds account-wide actions, `workspaces[id]` the actions allowed in
 * that workspace. The server decides again on every request.
 */
export const abilitiesSchema = z.object({
  global: accountAbilitiesSchema,
  workspaces: z.record(text(), workspaceAbilitiesSchema),
});
export type Abilities = z.infer<typeof abilitiesSchema>;

export const sessionSchema = z.object({
  user: sessionUserSchema,
  workspaces: z.array(sessionWorkspaceSchema),
  csrfToken: text(),
  abilities: abilitiesSchema,
});
export type Session = z.infer<typeof sessionSchema>;

export const changePasswordSchema = z.object({
  currentPassword: text()
    .min(1, { message: 'Enter your current password.' })
    .max(PASSWORD_MAX_LENGTH),
  newPassword: newPasswordSchema,
});
export type ChangePasswordInput = z.infer<typeof changePasswordSchema>;
