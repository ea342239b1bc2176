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
 * and for sign-ups (every attempt: each costs a password hash) per address. Reset confirmations count
 * refused ones with the reset limits, per address and per account (the account a token belongs to,
 * from `resetAccountKey`; an unknown token counts as its own); wrong current passwords at
 * change-password count with the sign-in limits, per signed-in account and per address.
 */
export function createRateLimits(config: Config, resetAccountKey: (req: Request) => string) {
  const address = (req: Request) => ipKeyGenerator(req.ip ?? '0.0.0.0');
  const l = config.limits;
  return {
    resetConfirm: [
      limiter(config, l.resetPerAddress, (r) => `ip:${address(r)}`, true),
      limiter(config, l.resetPerAccount, (r) => `acct:${resetAccountKey(r)}`, true),
    ],
    changePassword: [
      limiter(config, l.signInPerAddress, (r) => `ip:${address(r)}`, true),
      limiter(config, l.signInPerAccount, (r) => `user:${r.user?.id ?? ''}`, true),
    ],
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
