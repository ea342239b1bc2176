import { count, desc, eq, or } from 'drizzle-orm';
import express, { type RequestHandler, type Router } from 'express';
import { searchPageQuerySchema, userChangeBodySchema } from '@seamwright/api';
import type { AppContext } from '../app-context';
import { currentUser, endUserSessions, publicUser, requireUser } from '../auth/sessions';
import { HttpError } from '../http/errors';
import { likeContains } from '../http/paging';
import { idSchema, parseOr400 } from '../http/validate';


const requireAdmin: RequestHandler = (req, _res, next) => {
  next(currentUser(req).role === 'admin' ? undefined : new HttpError(403, 'Only administrators can do this'));
};

/** `/api/admin…`: user management and the development inbox. */
export function adminRouter(ctx: AppContext): Router {
  const { config } = ctx;
  const d = ctx.data;
  const { users } = d.t;
  const router = express.Router();
  router.use(requireUser, requireAdmin);

  router.get('/users', async (req, res) => {
    const q = parseOr400(searchPageQuerySchema, req.query, 'Invalid query');
    // Ignoring case alike on both databases, as SQLite's LIKE does.
    const where = q.q ? or(d.likeIgnoringCase(users.email, likeContains(q.q)), d.likeIgnoringCase(users.displayName, likeContains(q.q))) : undefined;
    const [{ n: total }] = await d.db.select({ n: count() }).from(users).where(where);
    const rows = await d.db
      .select()
      .from(users)
      .where(where)
      .orderBy(desc(users.createdAt), users.id)
      .limit(q.pageSize)
      .offset((q.page - 1) * q.pageSize);
    res.json({ items: rows.map(publicUser), total, page: q.page, pageSize: q.pageSize });
  });

  router.patch('/users/:userId', async (req, res) => {
    const me = currentUser(req);
    const userId = parseOr400(idSchema, req.params.userId, 'Invalid user id');
    const body = parseOr400(userChangeBodySchema, req.body);
    if (userId === me.id && ((body.role !== undefined && body.role !== 'admin') || body.disabled === true)) {
      throw new HttpError(400, 'You cannot demote or disable your own account');
    }
    const updated = await ctx.data.transaction(async (tx) => {
      const [row] = await tx.db.update(tx.t.users).set(body).where(eq(tx.t.users.id, userId)).returning();
      if (!row) throw new HttpError(404, 'User not found');
      if (row.disabled) await endUserSessions(tx, row.id);
      return row;
    });
    res.json({ user: publicUser(updated) });
  });

  router.get('/dev-inbox', async (_req, res) => {
    if (config.env === 'production') throw new HttpError(404, 'No such API route');
    let messages: unknown;
    try {
      const answer = await fetch(`${config.mailInboxUrl}/api/messages`, { signal: AbortSignal.timeout(3000) });
      if (!answer.ok) throw new Error(`inbox answered ${answer.status}`);
      messages = await answer.json();
    } catch {
      throw new HttpError(502, 'The development mail server is not running');
    }
    res.json({ messages: Array.isArray(messages) ? [...messages].reverse() : [] });
  });

  return router;
}
