import { createHash, randomBytes } from 'node:crypto';

/** 256 random bits, URL-safe. Only its hash is stored, so a database leak opens no invitation. */
export function newInvitationToken(): string {
  return randomBytes(32).toString('base64url');
}

export function hashInvitationToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}
