import { z } from 'zod';
import { HttpError, zodDetails } from './errors';

/** Parses `value` with `schema` or throws a 400 naming every bad field. */
export function parseOr400<S extends z.ZodType>(schema: S, value: unknown, what = 'Invalid request'): z.output<S> {
  const result = schema.safeParse(value);
  if (!result.success) throw new HttpError(400, what, zodDetails(result.error));
  return result.data;
}

/** Ids, e-mail addresses and passwords are checked as the shared API contract says. */
export { emailSchema, idSchema, passwordSchema } from '@seamwright/api';
