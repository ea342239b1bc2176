import type { RequestHandler, Response } from 'express';
import type { Data } from '../db/data';
import { HttpError } from './errors';
import { checkNeed, loadPatternAccess, loadPatternRead, type Need, type PatternAccess, type PatternRead } from '../services/access';

/** What the middleware leaves for the routes below `/patterns/:id`. */
interface PatternLocals {
  patternAccess?: PatternAccess;
  /** For `GET /patterns/:id` alone: the same checks and the latest revision, in one query. */
  patternRead?: PatternRead;
}

/**
 * Mounted once on `/patterns/:id`: validates the id (the shared id schema) and loads the pattern and
 * the caller's access into `res.locals`. Anonymous callers, strangers, malformed ids and (for all but
 * the owner) trashed patterns get the one 404 before any route below runs.
 */
export function patternAccess(d: Data): RequestHandler {
  return async (req, res, next) => {
    const locals = res.locals as PatternLocals;
    if ((req.method === 'GET' || req.method === 'HEAD') && req.path === '/') locals.patternAccess = locals.patternRead = await loadPatternRead(d, req.user, req.params['id']);
    else locals.patternAccess = await loadPatternAccess(d, req.user, req.params['id']);
    next();
  };
}

/**
 * The pattern and access the middleware loaded, checked against what the route needs: a member
 * whose access is too low gets 403 (see `checkNeed`).
 */
export function patternOf(res: Response, need: Need = 'read'): PatternAccess {
  const found = (res.locals as PatternLocals).patternAccess;
  if (!found) throw new HttpError(500, 'Pattern access was not loaded for this route');
  checkNeed(found.access, need);
  return found;
}

/** What the middleware loaded for reading a pattern (`GET /patterns/:id`): access and latest revision. */
export function patternReadOf(res: Response): PatternRead {
  const found = (res.locals as PatternLocals).patternRead;
  if (!found) throw new HttpError(500, 'Pattern read was not loaded for this route');
  return found;
}
