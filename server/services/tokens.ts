import { createHash, randomBytes } from 'node:crypto';

/** A fresh URL-safe token (256 bits) and the SHA-256 hex we store instead of it. */
export function newToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashToken(token) };
}

export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}
