import { createHash, randomBytes } from 'node:crypto';

/** a fresh random token: 32 bytes (256 bits) from the OS generator, base64url */
export function newToken(): string {
  return randomBytes(32).toString('base64url');
}

/** what the database keeps instead of a token: its sha256, hex (64 characters) */
export function hashToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

/** a token and its hash at once */
export function tokenPair(): { token: string; hash: string } {
  const token = newToken();
  return { token, hash: hashToken(token) };
}

export const HOUR_MS = 3600_000;
export const DAY_MS = 24 * HOUR_MS;
