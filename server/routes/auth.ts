import { and, eq, gt, isNull } from 'drizzle-orm';
import express, { type Request, type Router } from 'express';
import {
  changePasswordBodySchema,
  resetConfirmBodySchema,
  resetRequestBodySchema,
  signInBodySchema,
  signUpBodySchema,
} from '@seamwright/api';
import type { AppContext } from '../app-context';
import type { Csrf } from '../auth/csrf';
import { decoyHash, hashPassword, verifyPassword } from '../auth/passwords';
import { createRateLimits } from '../auth/rate-limits';
import { currentUser, endSession, endUserSessions, publicUser, requireUser, startSession } from '../auth/sessions';
import { hashToken, newId, randomToken } from '../auth/tokens';
import type { Data } from '../db/data';
import { HttpError } from '../http/errors';
import { parseOr400 } from '../http/validate';
import { passwordResetMail } from '../services/mail-templates';

const RESET_MS = 60 * 60_000;

/** Marks every outstanding reset token of an account used (after a reset or a password change). */
async function revokeResetTokens(d: Data, userId: string): Promise<void> {
  const { passwordResets } = d.t;
  await d.db
    .update(passwordResets)
    .set({ usedAt: new Date() })
    .where(and(eq(passwordResets.userId, userId), isNull(passwordResets.usedAt)));
}

/** Accounts and sessions: `/api/auth/…`. */
export function authRouter(ctx: AppContext, csrf: Csrf): Router {
  const { data, config } = ctx;
  const { passwordResets, sessions, users } = data.t;
  const router = express.Router();
  // A reset confirmation counts against the account its token belongs to; an unknown token is its own key.
  const resetAccountKey = async (req: Request) => {
    const token: unknown = (req.body as { token?: unknown } | undefined)?.token;
    if (typeof token !== 'string' || token.length > 200) return 'malformed';
    const tokenHash = hashToken(token);
    const [row] = await data.db.select({ userId: passwordResets.userId }).from(passwordResets).where(eq(passwordResets.tokenHash, tokenHash));
    return row ? row.userId : `token:${tokenHash}`;
  };
  const limits = createRateLimits(config, ctx.rateLimitSql, resetAccountKey);
  const decoy = decoyHash(config.bcryptRounds);

  router.get('/csrf', (req, res) => {
    res.json({ csrfToken: csrf.issue(req, res) });
  });

  router.post('/sign-up', ...limits.signUp, async (req, res) => {
    const body = parseOr400(signUpBodySchema, req.body);
    const passwordHash = await hashPassword(body.password, config.bcryptRounds);
    const id = newId();
    const previous = req.sessionTokenHash;
    // The account and its first session in one transaction; a session the browser already had ends
    // only when the account is made (a refused sign-up signs nobody out). The new cookie replaces it.
    const { created, tokenHash } = await data.transaction(async (tx) => {
      const [row] = await tx.db
        .insert(users)
        .values({ id, email: body.email, displayName: body.displayName, passwordHash, role: body.role, createdAt: new Date() })
        .onConflictDoNothing({ target: users.email })
        .returning();
      if (!row) throw new HttpError(409, 'An account with this e-mail already exists', [{ path: 'email', message: 'already registered' }]);
      if (previous) await tx.db.delete(sessions).where(eq(sessions.tokenHash, previous));
      return { created: row, tokenHash: await startSession(tx, config, res, row.id) };
    });
    req.sessionTokenHash = tokenHash;
    req.user = created;
    res.status(201).json({ user: publicUser(created), csrfToken: csrf.issue(req, res) });
  });

  router.post('/sign-in', ...limits.signIn, async (req, res) => {
    const body = parseOr400(signInBodySchema, req.body);
    // Awaited for every sign-in, known e-mail or not, so the one-time cost of making it tells nothing.
    const fallback = await decoy();
    const [user] = await data.db.select().from(users).where(eq(users.email, body.email));
    const ok = await verifyPassword(body.password, user?.passwordHash ?? fallback);
    if (!user || !ok) throw new HttpError(401, 'Wrong e-mail or password');
    if (user.disabled) throw new HttpError(403, 'This account is disabled');
    if (req.sessionTokenHash) await endSession(data, config, res, req.sessionTokenHash);
    req.sessionTokenHash = await startSession(data, config, res, user.id);
    req.user = user;
    res.json({ user: publicUser(user), csrfToken: csrf.issue(req, res) });
  });

  router.post('/sign-out', async (req, res) => {
    await endSession(data, config, res, req.sessionTokenHash);
    req.sessionTokenHash = undefined;
    req.user = undefined;
    res.json({ csrfToken: csrf.issue(req, res) });
  });

  // For the app's start: who is signed in (or null, without a 401 in the browser console) and a token.
  router.get('/session', (req, res) => {
    res.json({ user: req.user ? publicUser(req.user) : null, csrfToken: csrf.issue(req, res) });
  });

  router.get('/me', requireUser, (req, res) => {
    res.json({ user: publicUser(currentUser(req)) });
  });

  router.post('/change-password', requireUser, ...limits.changePassword, async (req, res) => {
    const body = parseOr400(changePasswordBodySchema, req.body);
    const user = currentUser(req);
    if (!(await verifyPassword(body.currentPassword, user.passwordHash))) {
      throw new HttpError(401, 'The current password is wrong', [{ path: 'currentPassword', message: 'does not match' }]);
    }
    const passwordHash = await hashPassword(body.newPassword, config.bcryptRounds);
    await data.transaction(async (tx) => {
      const changed = await tx.db.update(users).set({ passwordHash }).where(eq(users.id, user.id)).returning({ id: users.id });
      if (changed.length !== 1) throw new HttpError(404, 'This account no longer exists');
      await endUserSessions(tx, user.id, req.sessionTokenHash);
      // A reset link asked for before the change must not undo it.
      await revokeResetTokens(tx, user.id);
    });
    res.json({ ok: true });
  });

  router.post('/password-reset', ...limits.reset, async (req, res) => {
    const body = parseOr400(resetRequestBodySchema, req.body);
    const [user] = await data.db.select().from(users).where(eq(users.email, body.email));
    if (user && !user.disabled) {
      const token = randomToken();
      const now = Date.now();
      const link = `${config.publicUrl}/reset-password?token=${encodeURIComponent(token)}`;
      // The token and its mail are stored together; the outbox sends it after this answer, so the
      // answer's status and time are the same whether the address has an account or mail is down.
      await data.transaction(async (tx) => {
        await tx.db
          .insert(passwordResets)
          .values({ tokenHash: hashToken(token), userId: user.id, createdAt: new Date(now), expiresAt: new Date(now + RESET_MS) });
        await ctx.mailOutbox.enqueue(tx, 'password-reset', { to: user.email, ...passwordResetMail(user.displayName, link) });
      });
    }
    res.status(202).json({ ok: true });
  });

  router.post('/password-reset/confirm', ...limits.resetConfirm, async (req, res) => {
    const body = parseOr400(resetConfirmBodySchema, req.body);
    const tokenHash = hashToken(body.token);
    const refused = () =>
      new HttpError(400, 'This reset link is invalid or has expired', [{ path: 'token', message: 'invalid or expired' }]);
    const liveReset = async (d: Data) =>
      (
        await d.db
          .select()
          .from(passwordResets)
          .where(and(eq(passwordResets.tokenHash, tokenHash), isNull(passwordResets.usedAt), gt(passwordResets.expiresAt, new Date())))
      )[0];
    // The token first: a bogus one is refused without paying for a password hash.
    if (!(await liveReset(data))) throw refused();
    const passwordHash = await hashPassword(body.newPassword, config.bcryptRounds);
    const done = await data.transaction(async (tx) => {
      // Looked up again inside the write: another confirmation may have used it while we hashed.
      const reset = await liveReset(tx);
      if (!reset) return false;
      const changed = await tx.db.update(users).set({ passwordHash }).where(eq(users.id, reset.userId)).returning({ id: users.id });
      if (changed.length !== 1) return false;
      // This token and every other outstanding one of the account are spent.
      await revokeResetTokens(tx, reset.userId);
      await endUserSessions(tx, reset.userId);
      return true;
    });
    if (!done) throw refused();
    res.json({ ok: true });
  });

  return router;
}
