import argon2 from 'argon2';

// argon2id with the library's defaults (64 MiB, 3 passes) as recommended for interactive sign-in.
export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, { type: argon2.argon2id });
}

export async function verifyPassword(hash: string, password: string): Promise<boolean> {
  try {
    return await argon2.verify(hash, password);
  } catch {
    // A malformed stored hash must never let anyone in.
    return false;
  }
}

let dummyHash: Promise<string> | null = null;
/**
 * Spends the same time as a real check when the e-mail is unknown, so response
 * time does not reveal which addresses have accounts.
 */
export async function burnPasswordCheck(password: string): Promise<void> {
  dummyHash ??= hashPassword('phasewright-no-such-account');
  await verifyPassword(await dummyHash, password);
}
