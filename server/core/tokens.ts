import { createHash, randomBytes } from 'node:crypto';

/**
 * Single-use link tokens (invitations, password resets): 256 bits from the CSPRNG, sent to the user
 * once, stored only as their SHA-256.
 */
export function createLinkToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashLinkToken(token) };
}

export function hashLinkToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}
