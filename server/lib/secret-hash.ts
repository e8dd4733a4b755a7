import { createHash } from 'node:crypto';

/**
 * The SHA-256 (hex) stored instead of a secret: API tokens and e-mailed link tokens are random
 * 192–256-bit strings, so a fast unsalted hash is enough to make a leaked table useless.
 */
export const sha256Hex = (secret: string) => createHash('sha256').update(secret).digest('hex');
