import { createHash, randomBytes } from 'node:crypto';

/** A one-time token for an e-mailed link (invitation, password reset), and the hash that is stored. */
export function newOneTimeToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashToken(token) };
}

export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}
