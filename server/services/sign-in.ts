import { User } from '../models';
import { recordAudit } from './audit';
import { burnPasswordCheck, verifyPassword } from './passwords';

/** Why the password is checked: signing in, or re-entered to sign a decision. */
export type CredentialPurpose = 'sign-in' | 'signature';

/**
 * Checks an e-mail and password: the user, or null for wrong credentials. An
 * unknown e-mail costs the same time as a wrong password. Slowing down repeated
 * failures is the sign-in throttle's job (sign-in-throttle.ts), applied by the
 * routes before they call this; every attempt goes to the account chain of the
 * audit trail. Runs outside any request transaction so a failure is recorded
 * even though the request fails.
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
  if (await verifyPassword(user.passwordHash, password)) {
    if (purpose === 'sign-in') await auditAccount('session.signed_in', user.id, user.id, null);
    return user;
  }
  await auditAccount('session.sign_in_failed', user.id, user.id, { purpose });
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

export async function recordSignOut(userId: string): Promise<void> {
  await auditAccount('session.signed_out', userId, userId, null);
}
