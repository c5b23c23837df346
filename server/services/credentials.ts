import { QueryTypes, type Transaction } from 'sequelize';
import { database } from '../db/sequelize';
import { gone, notFound, validationFailed } from '../errors';
import { Membership, PasswordReset, User } from '../models';
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

/** Sets a new password from a reset link: single use, 1 hour. Signs the user out everywhere. */
export async function completePasswordReset(
  token: string,
  password: string,
  transaction: Transaction | null,
): Promise<void> {
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
  // The reset also lifts a lockout: proving control of the mailbox is enough.
  await reset.user.update(
    { passwordHash: await hashPassword(password), failedSignIns: 0, lockedUntil: null },
    { transaction },
  );
  await endSessionsOf(reset.user.id, transaction);
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
}

export async function changePassword(
  user: User,
  currentPassword: string,
  newPassword: string,
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

/** Deletes every stored session of the user (sessions are rows of connect-pg-simple's table). */
async function endSessionsOf(userId: string, transaction: Transaction | null): Promise<void> {
  await database().query(`DELETE FROM session WHERE sess -> 'passport' ->> 'user' = :userId`, {
    replacements: { userId },
    type: QueryTypes.DELETE,
    transaction,
  });
}
