import type { RequestHandler, Response } from 'express';
import type { DbLike } from '../db/database';
import { HttpError } from './errors';
import { checkNeed, loadPatternAccess, type Need, type PatternAccess } from '../services/access';

/** What the middleware leaves for the routes below `/patterns/:id`. */
interface PatternLocals {
  patternAccess?: PatternAccess;
}

/**
 * Mounted once on `/patterns/:id`: validates the id (the shared id schema) and loads the pattern and
 * the caller's access into `res.locals`. Anonymous callers, strangers, malformed ids and (for all but
 * the owner) trashed patterns get the one 404 before any route below runs.
 */
export function patternAccess(db: DbLike): RequestHandler {
  return (req, res, next) => {
    (res.locals as PatternLocals).patternAccess = loadPatternAccess(db, req.user, req.params['id']);
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
