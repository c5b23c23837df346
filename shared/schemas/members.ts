import { z } from 'zod';
import { text } from './text';
import { listQuerySchema, listReplySchema } from './lists';
import { emailSchema, newPasswordSchema, personNameSchema, roleSchema } from './session';

const rolesSchema = z
  .array(roleSchema)
  .min(1, { message: 'Choose at least one role.' })
  .refine((roles) => new Set(roles).size === roles.length, {
    message: 'Each role may appear once.',
  });

export const memberSchema = z.object({
  userId: text(),
  email: text(),
  name: text(),
  roles: z.array(roleSchema),
  joinedAt: text(),
});
export type Member = z.infer<typeof memberSchema>;
export const memberListSchema = listReplySchema(memberSchema);
/** By name; q matches part of the name or e-mail; role keeps those who hold it. */
export const memberListQuerySchema = listQuerySchema(
  ['name'],
  'Sort members by name (name).',
).extend({ role: roleSchema.optional() });
export type MemberListQuery = z.input<typeof memberListQuerySchema>;

export const inviteSchema = z.object({
  email: emailSchema,
  roles: rolesSchema,
});
export type InviteInput = z.infer<typeof inviteSchema>;

export const invitationSchema = z.object({
  id: text(),
  email: text(),
  roles: z.array(roleSchema),
  expiresAt: text(),
});
export type Invitation = z.infer<typeof invitationSchema>;

/** An invitation not yet accepted, as the members page lists it for resending or revoking. */
export const pendingInvitationSchema = invitationSchema.extend({
  invitedBy: z.object({ id: text(), name: text() }).nullable(),
  createdAt: text(),
});
export type PendingInvitation = z.infer<typeof pendingInvitationSchema>;
export const pendingInvitationListSchema = z.object({ items: z.array(pendingInvitationSchema) });

export const updateRolesSchema = z.object({
  roles: rolesSchema,
});
export type UpdateRolesInput = z.infer<typeof updateRolesSchema>;

/** What the public invitation page shows before the invitee accepts. */
export const invitationInfoSchema = z.object({
  workspaceName: text(),
  email: text(),
  roles: z.array(roleSchema),
  expiresAt: text(),
  /** True when the e-mail already has an account: the page then asks for its password. */
  existingUser: z.boolean(),
});
export type InvitationInfo = z.infer<typeof invitationInfoSchema>;

/**
 * Accepting: a new person picks a name and a password (name required then);
 * someone who already has an account gives their current password and the
 * name is ignored.
 */
export const acceptInvitationSchema = z.object({
  name: personNameSchema.optional(),
  password: newPasswordSchema,
});
export type AcceptInvitationInput = z.infer<typeof acceptInvitationSchema>;
