/**
 * The hot routes: the three busiest requests — read a pattern (`GET /api/patterns/:id`), list patterns
 * (`GET /api/patterns`), save a revision (`PUT /api/patterns/:id` with a small body) — answered in front
 * of Express, on the node:http request and response, without Express's per-request work (prototype
 * swaps, router walk, a dozen middleware calls). Everything else, and anything unusual about these
 * three (HEAD, another path spelling, a large or encoded body, another content type), goes to Express
 * unchanged.
 *
 * SQLite only (with PostgreSQL every request goes through Express). Nothing is decided twice: the
 * session is read by the same SQL as the session middleware (`sqliteSessionReader`), the CSRF check is
 * csrf-csrf's own, access by the same SQL as `loadPatternRead` (`sqlitePatternReader`) and by
 * `loadPatternAccess`, bodies by
 * `parseJsonBody` (the validation pool's reading of express.json's rules), answers by the same
 * services and error texts by `errorAnswer`. The security headers are helmet's, recorded once from
 * the app's own configuration. The steps run in Express's order (session, CSRF, access, body, route)
 * so every refusal is the one Express gives. server/hot-routes.spec.ts compares the two answer by
 * answer, headers included.
 */
import type { IncomingMessage, ServerResponse } from 'node:http';
import querystring from 'node:querystring';
import cookieParser from 'cookie-parser';
import type { Express, Request } from 'express';
import { patternListQuerySchema } from '@seamwright/api';
import type { AppContext } from '../app-context';
import type { Csrf } from '../auth/csrf';
import { sqliteSessionReader } from '../auth/sessions';
import { checkNeed, loadPatternAccess, sqlitePatternReader } from '../services/access';
import { readAnswerText, saveAnswerText } from '../services/pattern-answers';
import { listPatterns } from '../services/pattern-list';
import { parseJsonBody } from '../validation/document-body';
import { HttpError, errorAnswer } from './errors';
import { INLINE_DOCUMENT_BYTES, limitBytes } from './json-bodies';
import { securityHeaderList } from './security';
import { parseOr400 } from './validate';

const LIST_PATH = '/api/patterns';
const ONE_PREFIX = '/api/patterns/';
/** An id as the routes accept it (the shared id schema); anything else goes to Express, which answers 404. */
const ID = /^[A-Za-z0-9_-]{1,64}$/;
/** A JSON body express.json reads as UTF-8 with no conversion. */
const PLAIN_JSON = /^application\/json\s*(;\s*charset="?utf-8"?\s*)?$/i;


type Handler = (req: IncomingMessage, res: ServerResponse) => void;

/**
 * Which hot route answers a request, or undefined for Express. Decided from the method, the URL and
 * the headers alone, before anything is read.
 */
export function hotRouteOf(req: IncomingMessage, bodyLimit: number): 'read' | 'list' | 'save' | undefined {
  const url = req.url ?? '';
  if (!url.startsWith(LIST_PATH) || url.includes('#')) return undefined;
  const method = req.method;
  if (url.length === LIST_PATH.length || url.charCodeAt(LIST_PATH.length) === 0x3f /* ? */) return method === 'GET' ? 'list' : undefined;
  if (!url.startsWith(ONE_PREFIX)) return undefined;
  const q = url.indexOf('?');
  if (!ID.test(url.slice(ONE_PREFIX.length, q < 0 ? undefined : q))) return undefined;
  if (method === 'GET') return 'read';
  if (method !== 'PUT') return undefined;
  const h = req.headers;
  const length = h['content-length'];
  if (length === undefined || !/^\d+$/.test(length) || h['transfer-encoding'] !== undefined || h['content-encoding'] !== undefined) return undefined;
  const bytes = Number(length);
  if (bytes > INLINE_DOCUMENT_BYTES || bytes > bodyLimit || !PLAIN_JSON.test(h['content-type'] ?? '')) return undefined;
  return 'save';
}

/** Reads a request's body (its length already known and small). */
function bodyBytes(req: IncomingMessage): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    req.on('data', (c: Buffer) => chunks.push(c));
    req.once('end', () => resolve(chunks.length === 1 ? chunks[0] : Buffer.concat(chunks)));
    req.once('error', reject);
    // A client gone before the whole body arrived: nothing to answer.
    req.once('close', () => {
      if (!req.complete) reject(new Error('request aborted'));
    });
  });
}

/** The request handler for the hot routes; `next` gets every request they do not answer. */
export function hotRoutes(ctx: AppContext, csrf: Csrf, next: Handler): Handler {
  const sqlite = ctx.data.sqlite;
  if (!sqlite) throw new Error('the hot routes run on SQLite only');
  const sessionOf = sqliteSessionReader(sqlite);
  const readPattern = sqlitePatternReader(sqlite);
  const parseCookies = cookieParser();
  const bodyLimit = limitBytes(ctx.config.jsonBodyLimit);
  // Helmet's headers and the API's Cache-Control, in the order Express sets them.
  const fixed = [...securityHeaderList().flat(), 'Cache-Control', 'no-store', 'Content-Type', 'application/json; charset=utf-8'];

  const send = (res: ServerResponse, status: number, text: string) => {
    const headers = fixed.slice();
    headers.push('Content-Length', String(Buffer.byteLength(text)));
    res.writeHead(status, headers);
    res.end(text);
  };
  const fail = (res: ServerResponse, err: unknown) => {
    const answer = errorAnswer(err);
    if (answer.log) ctx.log('request failed', err);
    send(res, answer.status, JSON.stringify(answer.body));
  };
  /** The cookies as cookie-parser reads them (JSON cookies included), and the live session they name. */
  const sessionFor = (req: IncomingMessage) => {
    const parsed = { headers: req.headers } as unknown as Request;
    parseCookies(parsed, undefined as never, () => undefined);
    const cookies = parsed.cookies as Record<string, unknown>;
    return { cookies, live: sessionOf(cookies) };
  };

  const read = (req: IncomingMessage, res: ServerResponse, id: string) => {
    const { live } = sessionFor(req);
    send(res, 200, readAnswerText(readPattern(live?.user, id)));
  };
  const list = async (req: IncomingMessage, res: ServerResponse, query: string) => {
    const { live } = sessionFor(req);
    if (!live) throw new HttpError(401, 'Sign in first');
    const q = parseOr400(patternListQuerySchema, querystring.parse(query), 'Invalid query');
    send(res, 200, JSON.stringify(await listPatterns(ctx.data, live.user, q)));
  };
  const save = async (req: IncomingMessage, res: ServerResponse, id: string) => {
    const { cookies, live } = sessionFor(req);
    if (!csrf.valid({ headers: req.headers, cookies, sessionTokenHash: live?.tokenHash })) throw new HttpError(403, 'Missing or invalid CSRF token');
    const found = await loadPatternAccess(ctx.data, live?.user, id);
    const body = parseJsonBody(await bodyBytes(req));
    checkNeed(found.access, 'edit');
    send(res, 200, await saveAnswerText(ctx.data, found, live!.user, body));
  };

  return (req, res) => {
    const route = hotRouteOf(req, bodyLimit);
    if (!route) return next(req, res);
    const url = req.url!;
    const q = url.indexOf('?');
    try {
      if (route === 'list') {
        list(req, res, q < 0 ? '' : url.slice(q + 1)).catch((err: unknown) => {
          if (!res.headersSent) fail(res, err);
        });
        return;
      }
      const id = url.slice(ONE_PREFIX.length, q < 0 ? undefined : q);
      if (route === 'read') return read(req, res, id);
      save(req, res, id).catch((err: unknown) => {
        if (req.destroyed && !req.complete) return;
        if (!res.headersSent) fail(res, err);
      });
    } catch (err) {
      fail(res, err);
    }
  };
}

const expressHandles = new WeakMap<Express, Handler>();

/** The app without its hot routes: every request through Express (for comparing the two answers). */
export function expressOnly(app: Express): Handler {
  const handler = expressHandles.get(app);
  if (!handler) throw new Error('the hot routes are not installed on this app');
  return handler;
}

/**
 * Puts the hot routes in front of the app: every way the app is served (`app.listen`, a server made
 * with `http.createServer(app)`, supertest) calls `app.handle`, which now tries the hot routes first.
 */
export function installHotRoutes(app: Express, ctx: AppContext, csrf: Csrf): void {
  const withHandle = app as Express & { handle: (req: IncomingMessage, res: ServerResponse, callback?: unknown) => void };
  const expressHandle = withHandle.handle.bind(app);
  expressHandles.set(app, (req, res) => expressHandle(req, res));
  const hot = hotRoutes(ctx, csrf, (req, res) => expressHandle(req, res));
  withHandle.handle = (req, res, callback) => {
    // Mounted inside another app (a callback from its router): Express all the way.
    if (callback !== undefined) return expressHandle(req, res, callback);
    hot(req, res);
  };
}
