import { createHash, randomBytes } from 'node:crypto';

// API tokens: "pwt_" + 32 random bytes in base64url. Only the SHA-256 is stored; a fast hash is
// right here because the secret has 256 bits of entropy (no dictionary to guard against).
export const TOKEN_PREFIX = 'pwt_';

export function newTokenSecret(): string {
  return TOKEN_PREFIX + randomBytes(32).toString('base64url');
}

export function hashToken(secret: string): string {
  return createHash('sha256').update(secret, 'utf8').digest('hex');
}

/** What people see of a token after it is created: enough to tell two apart, not enough to use. */
export function displayPrefix(secret: string): string {
  return secret.slice(0, TOKEN_PREFIX.length + 6);
}
