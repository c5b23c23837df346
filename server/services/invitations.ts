import { Op, type Transaction } from 'sequelize';
import type { Role } from '@shared/schemas/session';
import { conflict, gone, notFound, validationFailed, invalidCredentials } from '../errors';
import { Invitation, Membership, User, Workspace } from '../models';
import { recordAudit } from './audit';
import { invitationMail, queueMail } from './mail';
import { addMember } from './members';
import { hashPassword, verifyPassword } from './passwords';
import { randomSecret, sha256 } from './secrets';

export const INVITATION_DAYS = 7;

/** Invites someone by e-mail: stores the hashed token and queues the mail in the same transaction. */
export async function inviteMember(input: {
  workspace: Workspace;
  inviter: User;
  email: string;
  roles: Role[];
  appUrl: string;
  transaction: Transaction | null;
}): Promise<Invitation> {
  const { workspace, inviter, email, roles, transaction } = input;
  const alreadyMember = await Membership.count({
    where: { workspaceId: workspace.id },
    include: [{ model: User, as: 'user', where: { email }, required: true }],
    transaction,
  });
  if (alreadyMember)
    throw conflict('already_member', `${email} is already a member of this workspace.`);

  const token = randomSecret();
  const expiresAt = new Date(Date.now() + INVITATION_DAYS * 24 * 3600_000);
  // A new invitation replaces any still-open one for the same address.
  await Invitation.update(
    { expiresAt: new Date() },
    {
      where: {
        workspaceId: workspace.id,
        email,
        acceptedAt: null,
        expiresAt: { [Op.gt]: new Date() },
      },
      transaction,
    },
  );
  const invitation = await Invitation.create(
    {
      workspaceId: workspace.id,
      invitedById: inviter.id,
      email,
      roles,
      tokenHash: sha256(token),
      expiresAt,
    },
    { transaction },
  );
  await queueMail(
    invitationMail({
      to: email,
      workspaceId: workspace.id,
      workspaceName: workspace.name,
      inviterName: inviter.name,
      roles,
      url: `${input.appUrl}/invitations/${token}`,
      expiresAt,
    }),
    transaction,
  );
  await recordAudit(
    {
      workspaceId: workspace.id,
      actorId: inviter.id,
      action: 'member.invited',
      entityType: 'invitation',
      entityId: invitation.id,
      after: { email, roles },
    },
    transaction,
  );
  return invitation;
}

/** The workspace's invitations not yet accepted and not expired (or revoked), newest first. */
export async function listPendingInvitations(
  workspaceId: string,
  transaction: Transaction | null,
): Promise<Invitation[]> {
  return Invitation.findAll({
    where: { workspaceId, acceptedAt: null, expiresAt: { [Op.gt]: new Date() } },
    include: [{ model: User, as: 'invitedBy', attributes: ['id', 'name'] }],
    order: [
      ['createdAt', 'DESC'],
      ['id', 'ASC'],
    ],
    limit: 500,
    transaction,
  });
}

/** A pending invitation of this workspace by id: 404 when unknown, another workspace's, used or expired. */
export async function loadPendingInvitation(
  workspaceId: string,
  invitationId: string,
  transaction: Transaction | null,
): Promise<Invitation> {
  const invitation = await Invitation.findOne({
    where: {
      id: invitationId,
      workspaceId,
      acceptedAt: null,
      expiresAt: { [Op.gt]: new Date() },
    },
    transaction,
    lock: transaction ? transaction.LOCK.UPDATE : undefined,
  });
  if (!invitation) throw notFound('The pending invitation');
  return invitation;
}

/**
 * Sends a pending invitation again: a new link (the old one stops working) valid for another
 * INVITATION_DAYS, mailed in the same transaction, with an audit entry.
 */
export async function resendInvitation(input: {
  invitation: Invitation;
  workspace: Workspace;
  actor: User;
  appUrl: string;
  transaction: Transaction | null;
}): Promise<Invitation> {
  const { invitation, workspace, actor, transaction } = input;
  const token = randomSecret();
  const before = { expiresAt: invitation.expiresAt.toISOString() };
  invitation.tokenHash = sha256(token);
  invitation.expiresAt = new Date(Date.now() + INVITATION_DAYS * 24 * 3600_000);
  await invitation.save({ transaction });
  await queueMail(
    invitationMail({
      to: invitation.email,
      workspaceId: workspace.id,
      workspaceName: workspace.name,
      inviterName: actor.name,
      roles: invitation.roles,
      url: `${input.appUrl}/invitations/${token}`,
      expiresAt: invitation.expiresAt,
    }),
    transaction,
  );
  await recordAudit(
    {
      workspaceId: workspace.id,
      actorId: actor.id,
      action: 'member.invitation-resent',
      entityType: 'invitation',
      entityId: invitation.id,
      before,
      after: { email: invitation.email, expiresAt: invitation.expiresAt.toISOString() },
    },
    transaction,
  );
  return invitation;
}

/** Withdraws a pending invitation: its link stops working at once; an audit entry says who. */
export async function revokeInvitation(input: {
  invitation: Invitation;
  actorId: string;
  transaction: Transaction | null;
}): Promise<void> {
  const { invitation, actorId, transaction } = input;
  invitation.expiresAt = new Date();
  await invitation.save({ transaction });
  await recordAudit(
    {
      workspaceId: invitation.workspaceId,
      actorId,
      action: 'member.invitation-revoked',
      entityType: 'invitation',
      entityId: invitation.id,
      before: { email: invitation.email, roles: invitation.roles },
    },
    transaction,
  );
}

/** Finds an open invitation by its token: 404 when unknown, 410 when used or expired. */
export async function loadOpenInvitation(
  token: string,
  transaction: Transaction | null,
): Promise<Invitation> {
  const invitation = await Invitation.findOne({
    where: { tokenHash: sha256(token) },
    include: [{ model: Workspace, as: 'workspace', required: true }],
    transaction,
    lock: transaction ? { level: transaction.LOCK.UPDATE, of: Invitation } : undefined,
  });
  if (!invitation) throw notFound('The invitation');
  if (invitation.acceptedAt)
    throw gone('invitation_used', 'This invitation has already been used.');
  if (invitation.expiresAt.getTime() <= Date.now())
    throw gone('invitation_expired', 'This invitation has expired. Ask an admin for a new one.');
  return invitation;
}

export async function userExists(email: string, transaction: Transaction | null): Promise<boolean> {
  return (await User.count({ where: { email }, transaction })) > 0;
}

/**
 * Accepts an invitation: a new person gets an account with the name and
 * password given; someone with an account proves it with their password.
 * Either way they become a member with the invited roles.
 */
export async function acceptInvitation(input: {
  invitation: Invitation;
  name: string | undefined;
  password: string;
  transaction: Transaction | null;
}): Promise<User> {
  const { invitation, transaction } = input;
  let user = await User.findOne({ where: { email: invitation.email }, transaction });
  if (user) {
    if (!(await verifyPassword(user.passwordHash, input.password))) throw invalidCredentials();
  } else {
    if (!input.name) throw validationFailed([{ path: 'name', message: 'Enter a name.' }]);
    user = await User.create(
      {
        email: invitation.email,
        name: input.name,
        passwordHash: await hashPassword(input.password),
      },
      { transaction },
    );
  }
  const membership = await addMember(
    invitation.workspaceId as string,
    user.id,
    invitation.roles,
    transaction,
  );
  await invitation.update({ acceptedAt: new Date() }, { transaction });
  await recordAudit(
    {
      workspaceId: invitation.workspaceId as string,
      actorId: user.id,
      action: 'invitation.accepted',
      entityType: 'membership',
      entityId: membership.id,
      after: { userId: user.id, roles: membership.roles },
    },
    transaction,
  );
  return user;
}
