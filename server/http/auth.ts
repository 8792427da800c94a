import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { Role } from '../../shared/roles';
import { findUserById } from '../accounts/accounts.service';
import { verifyToken } from '../accounts/tokens';
import type { User } from '../accounts/User.entity';
import type { Config } from '../config';
import { AppError } from '../errors';
import { mark, rolesMark } from './route-meta';

export const sessionCookie = 'loadline_session';

declare module 'express-serve-static-core' {
  interface Request {
    user?: User;
    authVia?: 'cookie' | 'bearer';
  }
}

function tokenOf(req: Request): { token: string; via: 'cookie' | 'bearer' } | undefined {
  const header = req.headers.authorization;
  if (header?.startsWith('Bearer ')) return { token: header.slice(7).trim(), via: 'bearer' };
  const cookie = (req.cookies as Record<string, string> | undefined)?.[sessionCookie];
  return cookie ? { token: cookie, via: 'cookie' } : undefined;
}

/** Attaches the signed-in user when a valid token comes with the request; never refuses by itself. */
export function authenticate(config: Config): RequestHandler {
  return async (req, _res, next) => {
    const found = tokenOf(req);
    if (!found) return next();
    const claims = verifyToken(config, found.token);
    if (!claims) {
      // A bad Bearer token is an error; a stale cookie just means signed out.
      if (found.via === 'bearer') return next(new AppError('unauthorised', 'Your sign-in is not valid. Please sign in again.'));
      return next();
    }
    const user = await findUserById(claims.sub);
    if (!user || user.disabled || user.tokenVersion !== claims.tv) {
      if (found.via === 'bearer') return next(new AppError('unauthorised', 'Your sign-in has ended. Please sign in again.'));
      return next();
    }
    req.user = user;
    req.authVia = found.via;
    next();
  };
}

export function requireUser(req: Request): User {
  if (!req.user) throw new AppError('unauthorised', 'Please sign in.');
  return req.user;
}

/** Lets the request through only for the given roles: 401 when signed out, 403 for another role. */
export function requireRole(...allowed: Role[]): RequestHandler {
  const check = (req: Request, _res: Response, next: NextFunction) => {
    const user = requireUser(req);
    if (!allowed.includes(user.role)) throw new AppError('forbidden', 'Your account may not do this.');
    next();
  };
  return mark(check, { [rolesMark]: allowed });
}

export function setSessionCookie(res: Response, config: Config, token: string): void {
  res.cookie(sessionCookie, token, {
    httpOnly: true,
    sameSite: 'lax',
    secure: config.secureCookies,
    maxAge: config.jwtTtlSeconds * 1000,
    path: '/',
  });
}

export function clearSessionCookie(res: Response, config: Config): void {
  res.clearCookie(sessionCookie, { httpOnly: true, sameSite: 'lax', secure: config.secureCookies, path: '/' });
}
