import { describe, expect, it } from 'vitest';
import { patternListQuerySchema, revisionListQuerySchema, sectionIdParamSchema, searchPageQuerySchema } from './queries';

describe('query and path schemas', () => {
  it('fills in the pattern list defaults and reads numbers from the query string', () => {
    expect(patternListQuerySchema.parse({ page: '3' })).toEqual({ page: 3, pageSize: 20, sort: 'updated', order: 'desc', scope: 'all' });
    expect(patternListQuerySchema.safeParse({ pageSize: '101' }).success).toBe(false);
    expect(patternListQuerySchema.safeParse({ scope: 'everyone' }).success).toBe(false);
    expect(patternListQuerySchema.safeParse({ extra: '1' }).success).toBe(false);
  });

  it('refuses a revision range that runs backwards, naming from', () => {
    expect(revisionListQuerySchema.parse({ from: '2', to: '5' })).toMatchObject({ from: 2, to: 5 });
    const r = revisionListQuerySchema.safeParse({ from: '6', to: '5' });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0]).toMatchObject({ path: ['from'], message: 'from must not be after to' });
  });

  it('trims the search text and keeps ids that cannot walk a path', () => {
    expect(searchPageQuerySchema.parse({ q: '  wheel  ' }).q).toBe('wheel');
    expect(sectionIdParamSchema.safeParse('sec-a_1').success).toBe(true);
    expect(sectionIdParamSchema.safeParse('../a').success).toBe(false);
  });
});
