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
import { sqliteRateLimitSql } from '../auth/rate-limit-store';
import { createRateLimits } from '../auth/rate-limits';
import { currentUser, endSession, endUserSessions, publicUser, requireUser, startSession } from '../auth/sessions';
import { hashToken, newId, randomToken } from '../auth/tokens';
import type { DbLike } from '../db/database';
import { passwordResets, sessions, users } from '../db/schema';
import { HttpError } from '../http/errors';
import { parseOr400 } from '../http/validate';
import { passwordResetMail } from '../services/mail-templates';

const RESET_MS = 60 * 60_000;

/** Marks every outstanding reset token of an account used (after a reset or a password change). */
function revokeResetTokens(db: DbLike, userId: string): void {
  db.update(passwordResets)
    .set({ usedAt: new Date() })
    .where(and(eq(passwordResets.userId, userId), isNull(passwordResets.usedAt)))
    .run();
}

/** Accounts and sessions: `/api/auth/…`. */
export function authRouter(ctx: AppContext, csrf: Csrf): Router {
  const { db, config } = ctx;
  const router = express.Router();
  // A reset confirmation counts against the account its token belongs to; an unknown token is its own key.
  const resetAccountKey = (req: Request) => {
    const token: unknown = (req.body as { token?: unknown } | undefined)?.token;
    if (typeof token !== 'string' || token.length > 200) return 'malformed';
    const tokenHash = hashToken(token);
    const row = db.select({ userId: passwordResets.userId }).from(passwordResets).where(eq(passwordResets.tokenHash, tokenHash)).get();
    return row ? row.userId : `token:${tokenHash}`;
  };
  const limits = createRateLimits(config, sqliteRateLimitSql(ctx.database.sqlite), resetAccountKey);
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

  router.post('/change-password', requireUser, ...limits.changePassword, async (req, res) => {
    const body = parseOr400(changePasswordBodySchema, req.body);
    const user = currentUser(req);
    if (!(await verifyPassword(body.currentPassword, user.passwordHash))) {
      throw new HttpError(401, 'The current password is wrong', [{ path: 'currentPassword', message: 'does not match' }]);
    }
    const passwordHash = await hashPassword(body.newPassword, config.bcryptRounds);
    db.transaction((tx) => {
      const changed = tx.update(users).set({ passwordHash }).where(eq(users.id, user.id)).run().changes;
      if (changed !== 1) throw new HttpError(404, 'This account no longer exists');
      endUserSessions(tx, user.id, req.sessionTokenHash);
      // A reset link asked for before the change must not undo it.
      revokeResetTokens(tx, user.id);
    });
    res.json({ ok: true });
  });

  router.post('/password-reset', ...limits.reset, (req, res) => {
    const body = parseOr400(resetRequestBodySchema, req.body);
    const user = db.select().from(users).where(eq(users.email, body.email)).get();
    if (user && !user.disabled) {
      const token = randomToken();
      const now = Date.now();
      const link = `${config.publicUrl}/reset-password?token=${encodeURIComponent(token)}`;
      // The token and its mail are stored together; the outbox sends it after this answer, so the
      // answer's status and time are the same whether the address has an account or mail is down.
      db.transaction((tx) => {
        tx.insert(passwordResets)
          .values({ tokenHash: hashToken(token), userId: user.id, createdAt: new Date(now), expiresAt: new Date(now + RESET_MS) })
          .run();
        ctx.mailOutbox.enqueue(tx, 'password-reset', { to: user.email, ...passwordResetMail(user.displayName, link) });
      });
    }
    res.status(202).json({ ok: true });
  });

  router.post('/password-reset/confirm', ...limits.resetConfirm, async (req, res) => {
    const body = parseOr400(resetConfirmBodySchema, req.body);
    const tokenHash = hashToken(body.token);
    const refused = () =>
      new HttpError(400, 'This reset link is invalid or has expired', [{ path: 'token', message: 'invalid or expired' }]);
    const liveReset = () =>
      db
        .select()
        .from(passwordResets)
        .where(and(eq(passwordResets.tokenHash, tokenHash), isNull(passwordResets.usedAt), gt(passwordResets.expiresAt, new Date())))
        .get();
    // The token first: a bogus one is refused without paying for a password hash.
    if (!liveReset()) throw refused();
    const passwordHash = await hashPassword(body.newPassword, config.bcryptRounds);
    const done = db.transaction(
      (tx) => {
        // Looked up again inside the write: another confirmation may have used it while we hashed.
        const reset = tx
          .select()
          .from(passwordResets)
          .where(and(eq(passwordResets.tokenHash, tokenHash), isNull(passwordResets.usedAt), gt(passwordResets.expiresAt, new Date())))
          .get();
        if (!reset) return false;
        const changed = tx.update(users).set({ passwordHash }).where(eq(users.id, reset.userId)).run().changes;
        if (changed !== 1) return false;
        // This token and every other outstanding one of the account are spent.
        revokeResetTokens(tx, reset.userId);
        endUserSessions(tx, reset.userId);
        return true;
      },
      { behavior: 'immediate' },
    );
    if (!done) throw refused();
    res.json({ ok: true });
  });

  return router;
}
