import type BetterSqlite3 from 'better-sqlite3';
import { and, eq, lt, ne, sql } from 'drizzle-orm';
import { SQLiteSyncDialect } from 'drizzle-orm/sqlite-core';
import type { CookieOptions, RequestHandler, Response } from 'express';
import type { Config } from '../config';
import type { Data } from '../db/data';
import type { User } from '../db/schema';
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

/**
 * Starts a session: stores the SHA-256 of a new random token and sets the httpOnly cookie. Returns
 * the token's hash (the CSRF token is bound to it).
 */
export async function startSession(d: Data, config: Config, res: Response, userId: string): Promise<string> {
  const token = randomToken();
  const tokenHash = hashToken(token);
  const now = Date.now();
  const expiresAt = new Date(now + config.sessionDays * 86_400_000);
  const { sessions } = d.t;
  // One transaction (a savepoint when the caller is already inside one).
  await d.transaction(async (tx) => {
    await tx.db.insert(sessions).values({ tokenHash, userId, createdAt: new Date(now), expiresAt });
    // Drop this user's expired sessions while we are here.
    await tx.db.delete(sessions).where(and(eq(sessions.userId, userId), lt(sessions.expiresAt, new Date(now))));
  });
  res.cookie(SESSION_COOKIE, token, { ...cookieOptions(config), expires: expiresAt });
  return tokenHash;
}

/** Ends the session (if any) and clears the cookie. */
export async function endSession(d: Data, config: Config, res: Response, tokenHash: string | undefined): Promise<void> {
  if (tokenHash) await d.db.delete(d.t.sessions).where(eq(d.t.sessions.tokenHash, tokenHash));
  res.clearCookie(SESSION_COOKIE, cookieOptions(config));
}

/** Ends every session of a user, except `keepTokenHash` when given. */
export async function endUserSessions(d: Data, userId: string, keepTokenHash?: string): Promise<void> {
  const { sessions } = d.t;
  const where = keepTokenHash
    ? and(eq(sessions.userId, userId), ne(sessions.tokenHash, keepTokenHash))
    : eq(sessions.userId, userId);
  await d.db.delete(sessions).where(where);
}

/** A signed-in request's user and the hash of its session token. */
export interface LiveSession {
  user: User;
  tokenHash: string;
}

/** The session's user, joined in one statement; a disabled user's session counts as none. Quoted aliases: PostgreSQL keeps their case. */
const liveSessionQuery = (tokenHash: unknown, now: unknown) => sql`SELECT u.id AS "id", u.email AS "email", u.display_name AS "displayName", u.password_hash AS "passwordHash",
       u.role AS "role", u.disabled AS "disabled", u.created_at AS "createdAt"
  FROM sessions s JOIN users u ON u.id = s.user_id
 WHERE s.token_hash = ${tokenHash} AND s.expires_at > ${now} AND u.disabled = false`;

/** The token hash a session cookie names, or undefined when there is no usable cookie. */
function tokenHashOf(cookies: Record<string, unknown> | undefined): string | undefined {
  const token: unknown = cookies?.[SESSION_COOKIE];
  if (typeof token !== 'string' || token.length === 0 || token.length > 100) return undefined;
  return hashToken(token);
}

/** A user row as the raw query gives it: SQLite has 0/1 and epoch ms, PostgreSQL booleans and Dates. */
type UserRow = Omit<User, 'disabled' | 'createdAt'> & { disabled: number | boolean; createdAt: number | Date };

const userOf = (row: UserRow): User => ({ ...row, disabled: row.disabled === true || row.disabled === 1, createdAt: new Date(row.createdAt) });

/** The live session a request's cookies name, if any. */
export async function sessionOf(d: Data, cookies: Record<string, unknown> | undefined): Promise<LiveSession | undefined> {
  const tokenHash = tokenHashOf(cookies);
  if (!tokenHash) return undefined;
  const now = d.dialect === 'sqlite' ? Date.now() : new Date();
  const row = (await d.rows<UserRow & Record<string, unknown>>(liveSessionQuery(tokenHash, now)))[0];
  return row ? { user: userOf(row), tokenHash } : undefined;
}

/**
 * {@link sessionOf} for the hot routes on SQLite (server/http/hot-routes.ts), which run on every
 * request: the same SQL prepared once on the connection and run synchronously.
 */
export function sqliteSessionReader(sqlite: BetterSqlite3.Database): (cookies: Record<string, unknown> | undefined) => LiveSession | undefined {
  const text = new SQLiteSyncDialect().sqlToQuery(liveSessionQuery(sql.placeholder('tokenHash'), sql.placeholder('now'))).sql;
  const liveSession = sqlite.prepare<[string, number], UserRow>(text);
  return (cookies) => {
    const tokenHash = tokenHashOf(cookies);
    if (!tokenHash) return undefined;
    const row = liveSession.get(tokenHash, Date.now());
    return row ? { user: userOf(row), tokenHash } : undefined;
  };
}

/** Sets `req.user` and `req.sessionTokenHash` from the session cookie, if it names a live session. */
export function loadSession(d: Data): RequestHandler {
  // On SQLite the prepared synchronous reader (no promise per request); the same SQL either way.
  const sync = d.sqlite ? sqliteSessionReader(d.sqlite) : undefined;
  return async (req, _res, next) => {
    const cookies = req.cookies as Record<string, unknown> | undefined;
    const live = sync ? sync(cookies) : await sessionOf(d, cookies);
    if (live) {
      req.user = live.user;
      req.sessionTokenHash = live.tokenHash;
    }
    next();
  };
}

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
