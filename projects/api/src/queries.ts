/*
 * Query strings and path parameters the server takes, as the zod schemas it validates them with
 * (docs/api.md, "Strict input"): one place for the routes and anyone building a URL.
 */
import { z } from 'zod';
import { patternScopeSchema } from './schemas';

/** `page` (1-based) and `pageSize` (1–100), as read from a query string. */
export const pagingQueryShape = {
  page: z.coerce.number().int().min(1).max(1_000_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(20),
};

/** A search text in a list's query string. */
const searchText = z.string().trim().max(120).optional();

/** `GET …?page&pageSize`: a page of a list and nothing else. */
export const pageQuerySchema = z.strictObject(pagingQueryShape);

/** `GET /api/patterns`: the pattern list. */
export const patternListQuerySchema = z.strictObject({
  ...pagingQueryShape,
  q: searchText,
  sort: z.enum(['updated', 'created', 'title']).default('updated'),
  order: z.enum(['asc', 'desc']).default('desc'),
  scope: patternScopeSchema.default('all'),
});

/** A revision number in a path (`/revisions/:number`) or a query. */
export const revisionNumberParamSchema = z.coerce.number().int().min(1).max(1_000_000_000);

/** `GET /api/patterns/:id/revisions`: a page of revisions, optionally from one number to another. */
export const revisionListQuerySchema = z
  .strictObject({ ...pagingQueryShape, from: revisionNumberParamSchema.optional(), to: revisionNumberParamSchema.optional() })
  .refine((q) => q.from === undefined || q.to === undefined || q.from <= q.to, { message: 'from must not be after to', path: ['from'] });

/** `GET /api/admin/users` and `GET /api/shop/listings`: a page, with an optional search text. */
export const searchPageQuerySchema = z.strictObject({ ...pagingQueryShape, q: searchText });

/** A section id in a path (`/sewing-log/:sectionId`). */
export const sectionIdParamSchema = z.string().regex(/^[A-Za-z0-9_-]{1,64}$/, 'must be a section id');
