import { QueryTypes } from 'sequelize';
import { database } from '../db/sequelize';
import { accountLocked } from '../errors';
import { User } from '../models';
import { burnPasswordCheck, verifyPassword } from './passwords';

export const MAX_FAILED_SIGN_INS = 5;
export const LOCKOUT_MINUTES = 15;

/**
 * Checks an e-mail and password. Returns the user, or null for wrong
 * credentials; throws 423 while the account is locked. Five failures in a row
 * lock the account for 15 minutes. Runs outside any request transaction so a
 * failure is counted even though the request fails.
 */
export async function verifyCredentials(email: string, password: string): Promise<User | null> {
  const user = await User.findOne({ where: { email: email.trim().toLowerCase() } });
  if (!user) {
    await burnPasswordCheck(password);
    return null;
  }
  if (user.lockedUntil && user.lockedUntil.getTime() > Date.now()) {
    throw accountLocked(Math.max(1, Math.ceil((user.lockedUntil.getTime() - Date.now()) / 60_000)));
  }
  if (await verifyPassword(user.passwordHash, password)) {
    if (user.failedSignIns !== 0 || user.lockedUntil) {
      await user.update({ failedSignIns: 0, lockedUntil: null });
    }
    return user;
  }
  await recordFailure(user.id);
  return null;
}

// One statement, so concurrent failures cannot undercount.
async function recordFailure(userId: string): Promise<void> {
  await database().query(
    `UPDATE users SET
       locked_until = CASE WHEN failed_sign_ins + 1 >= :max THEN now() + make_interval(mins => :minutes) ELSE locked_until END,
       failed_sign_ins = CASE WHEN failed_sign_ins + 1 >= :max THEN 0 ELSE failed_sign_ins + 1 END,
       updated_at = now()
     WHERE id = :userId`,
    {
      replacements: { max: MAX_FAILED_SIGN_INS, minutes: LOCKOUT_MINUTES, userId },
      type: QueryTypes.UPDATE,
    },
  );
}
