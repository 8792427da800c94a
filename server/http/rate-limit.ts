import { rateLimit, type Options } from 'express-rate-limit';
import { AppError } from '../errors';
import { PostgresRateLimitStore } from './postgres-rate-limit-store';
import { mark, rateLimitedMark } from './route-meta';

export interface LimiterOptions extends Partial<Omit<Options, 'store' | 'passOnStoreError'>> {
  /** Names the counters in PostgreSQL; every app server must use the same name for the same limit. */
  name: string;
  limit: number;
  windowMs: number;
  /** Let requests through (logged) while the counters cannot be reached, for routes that need no database. */
  failOpen?: boolean;
}

/**
 * A limiter counted in PostgreSQL, so several app servers on one database enforce one limit; its refusal
 * goes through the one error middleware like every other error.
 */
export function limiter({ name, failOpen = false, ...options }: LimiterOptions) {
  return mark(rateLimit({
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    ...options,
    store: new PostgresRateLimitStore(name),
    passOnStoreError: failOpen,
    handler: (_req, _res, next) => next(new AppError('rate-limited', 'Too many requests. Please wait a little and try again.')),
  }), { [rateLimitedMark]: true });
}
