import { rateLimit, type Options } from 'express-rate-limit';
import { AppError } from '../errors';
import { mark, rateLimitedMark } from './route-meta';

/** A limiter whose refusal goes through the one error middleware like every other error. */
export function limiter(options: Partial<Options> & { limit: number; windowMs: number }) {
  return mark(rateLimit({
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    ...options,
    handler: (_req, _res, next) => next(new AppError('rate-limited', 'Too many requests. Please wait a little and try again.')),
  }), { [rateLimitedMark]: true });
}
