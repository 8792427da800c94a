import type { Role } from '../../shared/roles';

/**
 * What a middleware or handler says about itself, for the route registry that walks the app's router stack (the
 * API description and the request fuzz test read it). Marks ride on the functions, so nothing runs per request.
 */
export const rolesMark = Symbol('loadline.roles');
export const rateLimitedMark = Symbol('loadline.rate-limited');
export const clientPageMark = Symbol('loadline.client-page');
export const crossSiteCheckMark = Symbol('loadline.cross-site-check');

type Marked = { [rolesMark]?: readonly Role[]; [rateLimitedMark]?: true; [clientPageMark]?: true; [crossSiteCheckMark]?: true };

export function mark<F extends Function>(fn: F, marks: Marked): F {
  return Object.assign(fn, marks);
}

export const rolesOf = (fn: unknown): readonly Role[] | undefined => (fn as Marked | undefined)?.[rolesMark];
export const isRateLimited = (fn: unknown): boolean => (fn as Marked | undefined)?.[rateLimitedMark] === true;
export const checksCrossSite = (fn: unknown): boolean => (fn as Marked | undefined)?.[crossSiteCheckMark] === true;
export const isClientPage = (fn: unknown): boolean => (fn as Marked | undefined)?.[clientPageMark] === true;
