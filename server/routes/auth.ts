import { and, eq, gt, isNull } from 'drizzle-orm';
import express, { type Router } from 'express';
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
import { passwordResets, sessions, users } from '../db/schema';
import { HttpError } from '../http/errors';
import { parseOr400 } from '../http/validate';
import { passwordResetMail } from '../services/mail-templates';

const RESET_MS = 60 * 60_000;

/** Accounts and sessions: `/api/auth/…`. */
export function authRouter(ctx: AppContext, csrf: Csrf): Router {
  const { db, config } = ctx;
  const router = express.Router();
  const limits = createRateLimits(config);
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
    const { created, tokenHash } = db.transaction(
      (tx) => {
        const row = tx
          .insert(users)
          .values({ id, email: body.email, displayName: body.displayName, passwordHash, role: body.role, createdAt: new Date() })
          .onConflictDoNothing({ target: users.email })
          .returning()
          .get();
        if (!row) throw new HttpError(409, 'An account with this e-mail already exists', [{ path: 'email', message: 'already registered' }]);
        if (previous) tx.delete(sessions).where(eq(sessions.tokenHash, previous)).run();
        return { created: row, tokenHash: startSession(tx, config, res, row.id) };
      },
      { behavior: 'immediate' },
    );
    req.sessionTokenHash = tokenHash;
    req.user = created;
    res.status(201).json({ user: publicUser(created), csrfToken: csrf.issue(req, res) });
  });

  router.post('/sign-in', ...limits.signIn, async (req, res) => {
    const body = parseOr400(signInBodySchema, req.body);
    // Awaited for every sign-in, known e-mail or not, so the one-time cost of making it tells nothing.
    const fallback = await decoy();
    const user = db.select().from(users).where(eq(users.email, body.email)).get();
    const ok = await verifyPassword(body.password, user?.passwordHash ?? fallback);
    if (!user || !ok) throw new HttpError(401, 'Wrong e-mail or password');
    if (user.disabled) throw new HttpError(403, 'This account is disabled');
    if (req.sessionTokenHash) endSession(db, config, res, req.sessionTokenHash);
    req.sessionTokenHash = startSession(db, config, res, user.id);
    req.user = user;
    res.json({ user: publicUser(user), csrfToken: csrf.issue(req, res) });
  });

  router.post('/sign-out', (req, res) => {
    endSession(db, config, res, req.sessionTokenHash);
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

  router.post('/change-password', requireUser, async (req, res) => {
    const body = parseOr400(changePasswordBodySchema, req.body);
    const user = currentUser(req);
    if (!(await verifyPassword(body.currentPassword, user.passwordHash))) {
      throw new HttpError(401, 'The current password is wrong', [{ path: 'currentPassword', message: 'does not match' }]);
    }
    const passwordHash = await hashPassword(body.newPassword, config.bcryptRounds);
    db.transaction((tx) => {
      tx.update(users).set({ passwordHash }).where(eq(users.id, user.id)).run();
      endUserSessions(tx, user.id, req.sessionTokenHash);
    });
    res.json({ ok: true });
  });

  router.post('/password-reset', ...limits.reset, async (req, res) => {
    const body = parseOr400(resetRequestBodySchema, req.body);
    const user = db.select().from(users).where(eq(users.email, body.email)).get();
    if (user && !user.disabled) {
      const token = randomToken();
      const now = Date.now();
      db.insert(passwordResets)
        .values({ tokenHash: hashToken(token), userId: user.id, createdAt: new Date(now), expiresAt: new Date(now + RESET_MS) })
        .run();
      const link = `${config.publicUrl}/reset-password?token=${encodeURIComponent(token)}`;
      try {
        await ctx.mailer.send({ to: user.email, ...passwordResetMail(user.displayName, link) });
      } catch (err) {
        ctx.log('password-reset mail failed', err);
        throw new HttpError(503, 'The e-mail could not be sent; try again later');
      }
    }
    res.status(202).json({ ok: true });
  });

  router.post('/password-reset/confirm', async (req, res) => {
    const body = parseOr400(resetConfirmBodySchema, req.body);
    const tokenHash = hashToken(body.token);
    const passwordHash = await hashPassword(body.newPassword, config.bcryptRounds);
    const done = db.transaction((tx) => {
      const reset = tx
        .select()
        .from(passwordResets)
        .where(and(eq(passwordResets.tokenHash, tokenHash), isNull(passwordResets.usedAt), gt(passwordResets.expiresAt, new Date())))
        .get();
      if (!reset) return false;
      tx.update(passwordResets).set({ usedAt: new Date() }).where(eq(passwordResets.tokenHash, tokenHash)).run();
      tx.update(users).set({ passwordHash }).where(eq(users.id, reset.userId)).run();
      endUserSessions(tx, reset.userId);
      return true;
    });
    if (!done) throw new HttpError(400, 'This reset link is invalid or has expired', [{ path: 'token', message: 'invalid or expired' }]);
    res.json({ ok: true });
  });

  return router;
}
