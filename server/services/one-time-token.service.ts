import { sha256 } from '@oslojs/crypto/sha2';
import { encodeBase32LowerCaseNoPadding, encodeHexLowerCase } from '@oslojs/encoding';
import { randomBytes } from 'node:crypto';

// Tokens for links sent by e-mail (invitations, password resets): 32 random bytes
// (256 bits) as 52 base32 characters; only the SHA-256 hash is stored, so a copy of the
// database cannot be used to sign in.

export function newOneTimeToken(): { token: string; tokenHash: string } {
  const token = encodeBase32LowerCaseNoPadding(randomBytes(32));
  return { token, tokenHash: hashOneTimeToken(token) };
}

export function hashOneTimeToken(token: string): string {
  return encodeHexLowerCase(sha256(new TextEncoder().encode(token)));
}
