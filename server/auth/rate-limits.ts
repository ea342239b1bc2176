import type { Request, RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { Config } from '../config';
import { DatabaseRateLimitStore, type RateLimitSql } from './rate-limit-store';

function accountKey(req: Request): string {
  const email: unknown = (req.body as { email?: unknown } | undefined)?.email;
  return typeof email === 'string' ? email.trim().toLowerCase().slice(0, 254) : '';
}

function limiter(
  config: Config,
  sql: RateLimitSql,
  name: string,
  limit: number,
  key: (req: Request) => string | Promise<string>,
  onlyFailures: boolean,
): RequestHandler {
  const windowMs = config.limits.windowMinutes * 60_000;
  return rateLimit({
    windowMs,
    store: new DatabaseRateLimitStore(sql, { prefix: `${name}/` }),
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
 * The counts live in the database (`rate_limit_hits`, through `sql`), so every instance on one
 * database counts together; each limiter keeps its own counts under its own key prefix.
 */
export function createRateLimits(config: Config, sql: RateLimitSql, resetAccountKey: (req: Request) => string | Promise<string>) {
  const address = (req: Request) => ipKeyGenerator(req.ip ?? '0.0.0.0');
  const l = config.limits;
  return {
    resetConfirm: [
      limiter(config, sql, 'resetConfirm/ip', l.resetPerAddress, (r) => `ip:${address(r)}`, true),
      limiter(config, sql, 'resetConfirm/account', l.resetPerAccount, async (r) => `acct:${await resetAccountKey(r)}`, true),
    ],
    changePassword: [
      limiter(config, sql, 'changePassword/ip', l.signInPerAddress, (r) => `ip:${address(r)}`, true),
      limiter(config, sql, 'changePassword/account', l.signInPerAccount, (r) => `user:${r.user?.id ?? ''}`, true),
    ],
    signIn: [
      limiter(config, sql, 'signIn/ip', l.signInPerAddress, (r) => `ip:${address(r)}`, true),
      limiter(config, sql, 'signIn/account', l.signInPerAccount, (r) => `acct:${accountKey(r)}`, true),
    ],
    reset: [
      limiter(config, sql, 'reset/ip', l.resetPerAddress, (r) => `ip:${address(r)}`, false),
      limiter(config, sql, 'reset/account', l.resetPerAccount, (r) => `acct:${accountKey(r)}`, false),
    ],
    signUp: [limiter(config, sql, 'signUp/ip', l.signUpPerAddress, (r) => `ip:${address(r)}`, false)],
  };
}
