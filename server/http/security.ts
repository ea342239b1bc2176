import helmet from 'helmet';
import type { Request, RequestHandler, Response } from 'express';

/**
 * Helmet with a Content-Security-Policy that allows only our own origin. Angular injects component
 * styles as <style> elements, so styles need 'unsafe-inline'; scripts never do. Images may be data:
 * and blob: URLs (previews, uploaded references); PDFs open from blob: URLs.
 */
export function securityHeaders(): RequestHandler {
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        'default-src': ["'self'"],
        'base-uri': ["'self'"],
        'script-src': ["'self'"],
        'style-src': ["'self'", "'unsafe-inline'"],
        'img-src': ["'self'", 'data:', 'blob:'],
        'font-src': ["'self'", 'data:'],
        'connect-src': ["'self'"],
        'worker-src': ["'self'", 'blob:'],
        'frame-src': ["'self'", 'blob:'],
        'object-src': ["'none'"],
        'form-action': ["'self'"],
        'frame-ancestors': ["'self'"],
      },
    },
    crossOriginEmbedderPolicy: false,
    strictTransportSecurity: false,
  });
}

/**
 * The headers {@link securityHeaders} sets, as `[name, value]` in its order: helmet's configuration
 * sets the same headers on every answer, so the hot routes (server/http/hot-routes.ts) send this list,
 * recorded once, instead of running helmet per request.
 */
export function securityHeaderList(): [string, string][] {
  const headers = new Map<string, [string, string]>();
  const recorder = {
    setHeader(name: string, value: unknown) {
      headers.set(name.toLowerCase(), [name, String(value)]);
      return recorder;
    },
    removeHeader(name: string) {
      headers.delete(name.toLowerCase());
    },
    getHeader(name: string) {
      return headers.get(name.toLowerCase())?.[1];
    },
  };
  let done = false;
  securityHeaders()({ headers: {}, method: 'GET' } as Request, recorder as unknown as Response, (err?: unknown) => {
    if (err) throw err instanceof Error ? err : new Error(String(err));
    done = true;
  });
  if (!done) throw new Error('helmet did not finish at once');
  return [...headers.values()];
}
