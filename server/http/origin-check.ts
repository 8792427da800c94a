import type { RequestHandler } from 'express';
import type { Config } from '../config';
import { AppError } from '../errors';
import { crossSiteCheckMark, mark } from './route-meta';

const safeMethods = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Refuses state-changing requests that a browser sent from another site.
 * SameSite=Lax already keeps the cookie off most of them; this closes the rest.
 */
export function originCheck(config: Config): RequestHandler {
  const allowed = new Set([config.publicOrigin, `http://127.0.0.1:${config.port}`, `http://localhost:${config.port}`, 'http://127.0.0.1:5173', 'http://localhost:5173']);
  return mark<RequestHandler>((req, _res, next) => {
    if (safeMethods.has(req.method)) return next();
    const origin = req.headers.origin ?? refererOrigin(req.headers.referer);
    const host = req.headers.host;
    if (origin && !allowed.has(origin) && origin !== `http://${host}` && origin !== `https://${host}`) {
      return next(new AppError('forbidden', 'Cross-site request refused.'));
    }
    next();
  }, { [crossSiteCheckMark]: true });
}

function refererOrigin(referer: string | undefined): string | undefined {
  if (!referer) return undefined;
  try {
    return new URL(referer).origin;
  } catch {
    return 'invalid';
  }
}
