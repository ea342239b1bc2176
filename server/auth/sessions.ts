import type BetterSqlite3 from 'better-sqlite3';
import { and, eq, lt, ne } from 'drizzle-orm';
import type { CookieOptions, RequestHandler, Response } from 'express';
import type { Config } from '../config';
import type { Db, DbLike } from '../db/database';
import { sessions, type User } from '../db/schema';
import { HttpError } from '../http/errors';
import { hashToken, randomToken } from './tokens';

declare module 'express-serve-static-core' {
  interface Request {
    /** The signed-in user, when the session cookie is valid. */
    user?: User;
    /** SHA-256 of the session token (the CSRF tokens are tied to it). */
    sessionTokenHash?: string;
  }
}

export const SESSION_COOKIE = 'seamwright.sid';

function cookieOptions(config: Config): CookieOptions {
  return { httpOnly: true, sameSite: 'lax', secure: config.secureCookies, path: '/' };
}

/** Starts a session for `userId`, sets the cookie, and returns the token's hash. */
export function startSession(db: DbLike, config: Config, res: Response, userId: string): string {
  const token = randomToken();
  const tokenHash = hashToken(token);
  const now = Date.now();
  const expiresAt = new Date(now + config.sessionDays * 86_400_000);
  const write = (tx: DbLike) => {
    tx.insert(sessions).values({ tokenHash, userId, createdAt: new Date(now), expiresAt }).run();
    // Drop this user's expired sessions while we are here.
    tx.delete(sessions).where(and(eq(sessions.userId, userId), lt(sessions.expiresAt, new Date(now)))).run();
  };
  // One transaction (a savepoint when the caller is already inside one).
  (db as Db).transaction((tx) => write(tx));
  res.cookie(SESSION_COOKIE, token, { ...cookieOptions(config), expires: expiresAt });
  return tokenHash;
}

/** Ends one session and clears the cookie. */
export function endSession(db: Db, config: Config, res: Response, tokenHash: string | undefined): void {
  if (tokenHash) db.delete(sessions).where(eq(sessions.tokenHash, tokenHash)).run();
  res.clearCookie(SESSION_COOKIE, cookieOptions(config));
}

/** Ends every session of a user, except `keepTokenHash` when given. */
export function endUserSessions(db: DbLike, userId: string, keepTokenHash?: string): void {
  const where = keepTokenHash
    ? and(eq(sessions.userId, userId), ne(sessions.tokenHash, keepTokenHash))
    : eq(sessions.userId, userId);
  db.delete(sessions).where(where).run();
}

/** A live session: its user and the SHA-256 of its token (the CSRF tokens are tied to it). */
export interface LiveSession {
  user: User;
  tokenHash: string;
}

/**
 * The session a request's parsed cookies name, when it is live and its user enabled; shared by the
 * session middleware and the hot routes (server/http/hot-routes.ts), so both read it the same way.
 */
export function sessionReader(db: Db): (cookies: Record<string, unknown> | undefined) => LiveSession | undefined {
  // Runs on every request: one statement prepared once on the connection, the row mapped by hand
  // (a disabled user's session counts as none, so that row never leaves SQLite).
  const liveSession = (db as Db & { $client: BetterSqlite3.Database }).$client.prepare<[string, number], UserRow>(
    `SELECT u.id, u.email, u.display_name AS displayName, u.password_hash AS passwordHash, u.role, u.disabled, u.created_at AS createdAt
       FROM sessions s JOIN users u ON u.id = s.user_id
      WHERE s.token_hash = ? AND s.expires_at > ? AND u.disabled = 0`,
  );
  return (cookies) => {
    const token: unknown = cookies?.[SESSION_COOKIE];
    if (typeof token !== 'string' || token.length === 0 || token.length > 100) return undefined;
    const tokenHash = hashToken(token);
    const row = liveSession.get(tokenHash, Date.now());
    if (!row) return undefined;
    return { user: { ...row, disabled: row.disabled !== 0, createdAt: new Date(row.createdAt) }, tokenHash };
  };
}

/** Reads the session cookie and sets `req.user` when it names a live session of an enabled user. */
export function loadSession(db: Db): RequestHandler {
  const sessionOf = sessionReader(db);
  return (req, _res, next) => {
    const live = sessionOf(req.cookies as Record<string, unknown> | undefined);
    if (live) {
      req.user = live.user;
      req.sessionTokenHash = live.tokenHash;
    }
    next();
  };
}

/** A user row as SQLite gives it (integers for the flag and the time). */
type UserRow = Omit<User, 'disabled' | 'createdAt'> & { disabled: number; createdAt: number };

/** Answers 401 unless signed in. */
export const requireUser: RequestHandler = (req, _res, next) => {
  next(req.user ? undefined : new HttpError(401, 'Sign in first'));
};

/** The signed-in user; call only behind {@link requireUser}. */
export function currentUser(req: { user?: User }): User {
  if (!req.user) throw new HttpError(401, 'Sign in first');
  return req.user;
}

/** The user as the API shows it (never the hash). */
export function publicUser(u: User) {
  return {
    id: u.id,
    email: u.email,
    displayName: u.displayName,
    role: u.role,
    disabled: u.disabled,
    createdAt: u.createdAt.toISOString(),
  };
}
