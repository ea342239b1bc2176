import type { Request, RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { Config } from '../config';

function accountKey(req: Request): string {
  const email: unknown = (req.body as { email?: unknown } | undefined)?.email;
  return typeof email === 'string' ? email.trim().toLowerCase().slice(0, 254) : '';
}

function limiter(config: Config, limit: number, key: (req: Request) => string, onlyFailures: boolean): RequestHandler {
  const windowMs = config.limits.windowMinutes * 60_000;
  return rateLimit({
    windowMs,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    skipSuccessfulRequests: onlyFailures,
    keyGenerator: key,
    handler: (_req, res, _next, options) => {
      const retryAfterSeconds = Math.ceil(options.windowMs / 1000);
      res.setHeader('Retry-After', String(retryAfterSeconds));
      res.status(429).json({ error: 'Too many attempts, try again later', details: { retryAfterSeconds } });
    },
  });
}

/**
 * Rate limits for sign-in (failed attempts) and password-reset requests, per account and per address,
 * and for sign-ups (every attempt: each costs a password hash) per address.
 */
export function createRateLimits(config: Config) {
  const address = (req: Request) => ipKeyGenerator(req.ip ?? '0.0.0.0');
  const l = config.limits;
  return {
    signIn: [
      limiter(config, l.signInPerAddress, (r) => `ip:${address(r)}`, true),
      limiter(config, l.signInPerAccount, (r) => `acct:${accountKey(r)}`, true),
    ],
    reset: [
      limiter(config, l.resetPerAddress, (r) => `ip:${address(r)}`, false),
      limiter(config, l.resetPerAccount, (r) => `acct:${accountKey(r)}`, false),
    ],
    signUp: [limiter(config, l.signUpPerAddress, (r) => `ip:${address(r)}`, false)],
  };
}
