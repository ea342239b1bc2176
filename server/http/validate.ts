import { z } from 'zod';
import { HttpError, zodDetails } from './errors';

/** Parses `value` with `schema` or throws a 400 naming every bad field. */
export function parseOr400<S extends z.ZodType>(schema: S, value: unknown, what = 'Invalid request'): z.output<S> {
  const result = schema.safeParse(value);
  if (!result.success) throw new HttpError(400, what, zodDetails(result.error));
  return result.data;
}

/** Ids made by this server: url-safe letters and digits, nothing that can walk a path. */
export const idSchema = z
  .string()
  .regex(/^[A-Za-z0-9_-]{1,64}$/, 'must be an id of letters, digits, "-" or "_"');

/** E-mail addresses, trimmed and lower-cased. */
export const emailSchema = z
  .string()
  .trim()
  .max(254)
  .pipe(z.email({ message: 'must be an e-mail address' }))
  .transform((v) => v.toLowerCase());

/** Passwords: long enough to matter, short enough for bcrypt's 72-byte input. */
export const passwordSchema = z
  .string()
  .min(10, 'must be at least 10 characters')
  .refine((v) => Buffer.byteLength(v, 'utf8') <= 72, { message: 'must be at most 72 bytes' });
