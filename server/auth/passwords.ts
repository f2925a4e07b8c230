import argon2 from 'argon2';

const options = { type: argon2.argon2id } as const;

export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, options);
}

let dummyHash: Promise<string> | null = null;

/**
 * Checks a password against a stored argon2id hash. With no hash (unknown or
 * invited account) a dummy hash is checked instead, so the answer takes as
 * long either way and does not reveal which addresses have accounts.
 */
export async function verifyPassword(hash: string | null, password: string): Promise<boolean> {
  if (!hash) {
    dummyHash ??= argon2.hash('not-a-real-password-for-timing', options);
    await argon2.verify(await dummyHash, password);
    return false;
  }
  try {
    return await argon2.verify(hash, password);
  } catch {
    return false;
  }
}
