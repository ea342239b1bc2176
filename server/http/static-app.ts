import fs from 'node:fs';
import path from 'node:path';
import express, { type Router } from 'express';

/**
 * Serves the built Angular app from `dir` with a fallback to index.html for client-side routes.
 * The folder may appear after start (a build running beside the server); each request checks.
 */
export function staticAppRouter(dir: string): Router {
  const router = express.Router();
  router.use(
    express.static(dir, {
      index: 'index.html',
      fallthrough: true,
      // Hashed bundle names never change content; index.html must always be fresh.
      setHeaders: (res, filePath) => {
        if (path.basename(filePath) === 'index.html') res.setHeader('Cache-Control', 'no-cache');
        else if (/-[A-Z0-9]{8,}\.(js|css|woff2?)$/.test(filePath)) res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
      },
    }),
  );
  router.get(/.*/, (req, res, next) => {
    if (req.path.startsWith('/api/') || req.path === '/api') return next();
    // Only page navigations fall back; a missing script or image stays a 404.
    if (path.extname(req.path) !== '' || !req.accepts('html')) return next();
    const index = path.join(dir, 'index.html');
    if (!fs.existsSync(index)) return next();
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index);
  });
  return router;
}
