import { z } from 'zod';

/** `page` (1-based) and `pageSize` (1–100) from a query string. */
export const pagingQuery = {
  page: z.coerce.number().int().min(1).max(1_000_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(20),
};

/** Escapes `%`, `_` and `\` for a LIKE pattern with ESCAPE '\'. */
export const likeContains = (q: string) => `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
