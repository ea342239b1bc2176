import express, { type Router } from 'express';
import { VERSION } from '../version';

/** `GET /api/health` → `{ ok: true, version }`. */
export function healthRouter(): Router {
  const router = express.Router();
  router.get('/health', (_req, res) => {
    res.json({ ok: true, version: VERSION });
  });
  return router;
}
