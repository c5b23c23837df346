import { QueryTypes, type Transaction } from 'sequelize';
import { database } from '../db/sequelize';
import { gone, notFound, validationFailed } from '../errors';
import { ApiToken, Membership, PasswordReset, User } from '../models';
import { recordAudit } from './audit';
import { passwordResetMail, queueMail } from './mail';
import { hashPassword, verifyPassword } from './passwords';
import { randomSecret, sha256 } from './secrets';

export const RESET_MINUTES = 60;

/**
 * Starts a password reset. Does nothing visible for unknown addresses: the
 * caller always answers 202, so the API does not reveal who has an account.
 */
export async function requestPasswordReset(
  email: string,
  appUrl: string,
  transaction: Transaction | null,
): Promise<void> {
  const user = await User.findOne({ where: { email }, transaction });
  if (!user) return;
  const token = randomSecret();
  await PasswordReset.create(
    {
      userId: user.id,
      tokenHash: sha256(token),
      expiresAt: new Date(Date.now() + RESET_MINUTES * 60_000),
    },
    { transaction },
  );
  await queueMail(
    passwordResetMail({
      to: user.email,
      workspaceIds: (
        await Membership.findAll({
          where: { userId: user.id },
          attributes: ['workspaceId'],
          transaction,
        })
      ).map((m) => m.workspaceId as string),
      name: user.name,
      url: `${appUrl}/reset-password/${token}`,
    }),
    transaction,
  );
}

/**
 * Sets a new password from a reset link: single use, 1 hour. Signs the user out everywhere,
 * revokes their API tokens and kills their other reset links. Returns the account's e-mail.
 */
export async function completePasswordReset(
  token: string,
  password: string,
  transaction: Transaction | null,
): Promise<string> {
  const reset = await PasswordReset.findOne({
    where: { tokenHash: sha256(token) },
    include: [{ model: User, as: 'user', required: true }],
    transaction,
    lock: transaction ? { level: transaction.LOCK.UPDATE, of: PasswordReset } : undefined,
  });
  if (!reset?.user) throw notFound('The reset link');
  if (reset.usedAt) throw gone('reset_used', 'This reset link has already been used.');
  if (reset.expiresAt.getTime() <= Date.now())
    throw gone('reset_expired', 'This reset link has expired. Ask for a new one.');
  await reset.update({ usedAt: new Date() }, { transaction });
  await reset.user.update({ passwordHash: await hashPassword(password) }, { transaction });
  // Whoever knew the old password loses every way in: sessions, tokens, other reset links.
  await endCredentialsOf(reset.user.id, null, transaction);
  await recordAudit(
    {
      workspaceId: null,
      actorId: reset.user.id,
      action: 'password.reset',
      entityType: 'user',
      entityId: reset.user.id,
    },
    transaction,
  );
  return reset.user.email;
}

/**
 * Changes the password (the current one proves it is the owner). Every other
 * session, every API token and every outstanding reset link of the account
 * ends; the session making the change (keepSessionId) stays.
 */
export async function changePassword(
  user: User,
  currentPassword: string,
  newPassword: string,
  keepSessionId: string | null,
  transaction: Transaction | null,
): Promise<void> {
  if (!(await verifyPassword(user.passwordHash, currentPassword))) {
    throw validationFailed([
      { path: 'currentPassword', message: 'The current password is incorrect.' },
    ]);
  }
  await User.update(
    { passwordHash: await hashPassword(newPassword) },
    { where: { id: user.id }, transaction },
  );
  await endCredentialsOf(user.id, keepSessionId, transaction);
  await recordAudit(
    {
      workspaceId: null,
      actorId: user.id,
      action: 'password.changed',
      entityType: 'user',
      entityId: user.id,
    },
    transaction,
  );
}

/**
 * Ends what lets someone act as the user without the new password: stored
 * sessions (rows of connect-pg-simple's table) but the one to keep, API
 * tokens, and reset links not yet used.
 */
async function endCredentialsOf(
  userId: string,
  keepSessionId: string | null,
  transaction: Transaction | null,
): Promise<void> {
  await database().query(
    `DELETE FROM session WHERE sess -> 'passport' ->> 'user' = :userId AND sid IS DISTINCT FROM :keep`,
    { replacements: { userId, keep: keepSessionId }, type: QueryTypes.DELETE, transaction },
  );
  await ApiToken.update(
    { revokedAt: new Date() },
    { where: { userId, revokedAt: null }, transaction },
  );
  await PasswordReset.update(
    { usedAt: new Date() },
    { where: { userId, usedAt: null }, transaction },
  );
}
