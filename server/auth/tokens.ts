import crypto from 'node:crypto';

/** A random 256-bit token, base64url. */
export const randomToken = (): string => crypto.randomBytes(32).toString('base64url');

/** A random 128-bit id, base64url (22 characters). */
export const newId = (): string => crypto.randomBytes(16).toString('base64url');

/** SHA-256 hex of a token: what the database keeps instead of the token. */
export const hashToken = (token: string): string => crypto.createHash('sha256').update(token).digest('hex');
