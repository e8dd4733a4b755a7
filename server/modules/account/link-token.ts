import { randomBytes } from 'node:crypto';
import { AppError } from '../../lib/errors.ts';
import { sha256Hex } from '../../lib/secret-hash.ts';

/** A secret for an e-mailed link (256 bits, URL-safe) and the SHA-256 that is stored instead of it. */
export function newLinkToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashLinkToken(token) };
}

export const hashLinkToken = sha256Hex;

type LinkKind = 'invitation' | 'password-reset link' | 'sign-up link';

export const linkUnknown = (kind: LinkKind) =>
  new AppError({ code: 'invalid_link', status: 404, field: 'token', message: `This ${kind} is not valid. Check that the whole link from the e-mail was opened, or ask for a new one.` });
export const linkUsed = (kind: LinkKind) =>
  new AppError({ code: 'link_used', status: 410, field: 'token', message: `This ${kind} has already been used; each link works once. Ask for a new one if you still need it.` });
export const linkExpired = (kind: LinkKind, validFor: string) =>
  new AppError({ code: 'link_expired', status: 410, field: 'token', message: `This ${kind} has expired (links are valid for ${validFor}). Ask for a new one.` });
