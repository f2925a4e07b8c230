import { createHash, randomBytes } from 'node:crypto';

/** A random URL-safe secret (256 bits). */
export function newSecret(): string {
  return randomBytes(32).toString('base64url');
}

/**
 * SHA-256 of a high-entropy secret. Link and API tokens are stored only as
 * this hash; a slow password hash is not needed for 256 random bits.
 */
export function hashSecret(secret: string): string {
  return createHash('sha256').update(secret, 'utf8').digest('hex');
}
