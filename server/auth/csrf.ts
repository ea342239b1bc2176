import fs from 'node:fs';
import path from 'node:path';
import crypto from 'node:crypto';
import { doubleCsrf } from 'csrf-csrf';
import type { Request, RequestHandler, Response } from 'express';
import type { Config } from '../config';

export const CSRF_COOKIE = 'seamwright.csrf';
export const CSRF_HEADER = 'x-csrf-token';

/** The CSRF secret: from the environment, else kept in the data folder so tokens survive restarts. */
function csrfSecret(config: Config): string {
  if (config.secret) return config.secret;
  const file = path.join(config.dataDir, 'csrf-secret');
  try {
    const existing = fs.readFileSync(file, 'utf8').trim();
    if (existing.length >= 32) return existing;
  } catch {
    // not there yet
  }
  const secret = crypto.randomBytes(32).toString('base64url');
  fs.mkdirSync(config.dataDir, { recursive: true });
  fs.writeFileSync(file, secret, { mode: 0o600 });
  return secret;
}

export interface Csrf {
  /** Rejects state-changing requests without a valid token (403). */
  protect: RequestHandler;
  /** Issues a token for the request's current session (call after changing the session). */
  issue(req: Request, res: Response): string;
  /**
   * Whether a state-changing request carries a valid token: the check `protect` makes, for a request
   * outside Express (server/http/hot-routes.ts) with its parsed cookies and session already read.
   */
  valid(req: CsrfRequest): boolean;
}

/** What the token check reads of a request. */
export interface CsrfRequest {
  headers: Request['headers'];
  cookies: Record<string, unknown>;
  sessionTokenHash?: string;
}

/**
 * Double-submit CSRF tokens (csrf-csrf): an HMAC tied to the session, in an httpOnly cookie and
 * echoed by the client in the `X-CSRF-Token` header. Anonymous requests share the empty session id.
 */
export function createCsrf(config: Config): Csrf {
  const secret = csrfSecret(config);
  const { doubleCsrfProtection, generateCsrfToken, validateRequest } = doubleCsrf({
    getSecret: () => secret,
    getSessionIdentifier: (req) => req.sessionTokenHash ?? '',
    cookieName: CSRF_COOKIE,
    cookieOptions: { httpOnly: true, sameSite: 'lax', secure: config.secureCookies, path: '/' },
    getCsrfTokenFromRequest: (req) => {
      const v = req.headers[CSRF_HEADER];
      return typeof v === 'string' ? v : undefined;
    },
    errorConfig: { statusCode: 403, message: 'Missing or invalid CSRF token', code: 'EBADCSRFTOKEN' },
  });
  return {
    protect: doubleCsrfProtection,
    // Reuse the cookie's token while it fits the session, so parallel requests never invalidate each other.
    issue: (req, res) => generateCsrfToken(req, res, { overwrite: false, validateOnReuse: false }),
    // validateRequest reads only the headers, the cookies and the session identifier given above.
    valid: (req) => validateRequest(req as unknown as Request),
  };
}
