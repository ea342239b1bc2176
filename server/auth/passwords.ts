import bcrypt from 'bcryptjs';

/** Hashes a password with bcrypt at `rounds`. */
export const hashPassword = (password: string, rounds: number): Promise<string> => bcrypt.hash(password, rounds);

/** Compares a password with a bcrypt hash (constant-time inside bcrypt). */
export const verifyPassword = (password: string, hash: string): Promise<boolean> => bcrypt.compare(password, hash);

/**
 * A valid hash of a random password, compared against when an account does not exist (same time either way).
 * Returns a getter: the hash is made asynchronously on first use and then reused, so start-up does not pay for it.
 */
export function decoyHash(rounds: number): () => Promise<string> {
  let hash: Promise<string> | undefined;
  return () => (hash ??= bcrypt.hash(`decoy-${Math.random()}`, rounds));
}
