import { database } from '../db/sequelize';
import { accountLocked } from '../errors';
import { User } from '../models';
import { recordAudit } from './audit';
import { burnPasswordCheck, verifyPassword } from './passwords';

/** Why the password is checked: signing in, or re-entered to sign a decision. */
export type CredentialPurpose = 'sign-in' | 'signature';

export const MAX_FAILED_SIGN_INS = 5;
export const LOCKOUT_MINUTES = 15;

/**
 * Checks an e-mail and password. Returns the user, or null for wrong
 * credentials; throws 423 while the account is locked. Five failures in a row
 * lock the account for 15 minutes. Runs outside any request transaction so a
 * failure is counted even though the request fails.
 */
export async function verifyCredentials(
  email: string,
  password: string,
  purpose: CredentialPurpose = 'sign-in',
): Promise<User | null> {
  const normalised = email.trim().toLowerCase();
  const user = await User.findOne({ where: { email: normalised } });
  if (!user) {
    await burnPasswordCheck(password);
    await auditAccount('session.sign_in_failed', null, null, { email: normalised, purpose });
    return null;
  }
  if (user.lockedUntil && user.lockedUntil.getTime() > Date.now()) {
    await auditAccount('session.sign_in_refused', user.id, user.id, { reason: 'locked', purpose });
    throw accountLocked(Math.max(1, Math.ceil((user.lockedUntil.getTime() - Date.now()) / 60_000)));
  }
  if (await verifyPassword(user.passwordHash, password)) {
    if (user.failedSignIns !== 0 || user.lockedUntil) {
      await user.update({ failedSignIns: 0, lockedUntil: null });
    }
    if (purpose === 'sign-in') await auditAccount('session.signed_in', user.id, user.id, null);
    return user;
  }
  const lockedNow = await recordFailure(user.id);
  await auditAccount('session.sign_in_failed', user.id, user.id, { purpose });
  if (lockedNow)
    await auditAccount('session.locked_out', null, user.id, { minutes: LOCKOUT_MINUTES });
  return null;
}

/** Account events go to the account chain of the audit trail, outside any request transaction. */
function auditAccount(
  action: string,
  actorId: string | null,
  userId: string | null,
  after: unknown,
) {
  return recordAudit(
    { workspaceId: null, actorId, action, entityType: 'user', entityId: userId, after },
    null,
  );
}

// One statement, so concurrent failures cannot undercount. True when this failure locked the account.
async function recordFailure(userId: string): Promise<boolean> {
  const [rows] = (await database().query(
    `UPDATE users SET
       locked_until = CASE WHEN failed_sign_ins + 1 >= :max THEN now() + make_interval(mins => :minutes) ELSE locked_until END,
       failed_sign_ins = CASE WHEN failed_sign_ins + 1 >= :max THEN 0 ELSE failed_sign_ins + 1 END,
       updated_at = now()
     WHERE id = :userId
     RETURNING (failed_sign_ins = 0) AS locked`,
    { replacements: { max: MAX_FAILED_SIGN_INS, minutes: LOCKOUT_MINUTES, userId } },
  )) as unknown as [Array<{ locked: boolean }>];
  return rows[0]?.locked ?? false;
}

export async function recordSignOut(userId: string): Promise<void> {
  await auditAccount('session.signed_out', userId, userId, null);
}
