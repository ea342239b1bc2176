import helmet from 'helmet';
import type { RequestHandler } from 'express';

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
