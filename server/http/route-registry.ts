import type { Application as Express } from 'express';
import type { Role } from '../../shared/roles';
import { specOf, type EndpointSpec } from './endpoint';
import { checksCrossSite, isClientPage, isRateLimited, rolesOf } from './route-meta';

/** One method and path the app answers, with what its spec and the middleware before it say. */
export interface MountedRoute {
  method: string;
  /** Express's form, e.g. /api/staff/products/:id. */
  path: string;
  spec: EndpointSpec | undefined;
  /** Roles the router lets through; undefined when anyone may call (or any signed-in account, see spec.signedIn). */
  roles: readonly Role[] | undefined;
  rateLimited: boolean;
  /** Behind the origin check: a state-changing request from another site is refused (403). */
  crossSiteChecked: boolean;
  /** The single-page app's own pages, not part of the API. */
  clientPage: boolean;
}

interface Layer {
  handle: Function & { stack?: Layer[] };
  rawPath?: unknown;
  method?: string;
  route?: { path: string; stack: Layer[] };
}

/** A middleware's effect on the routes after it, within its mount path. */
interface Scoped {
  under: string;
  roles?: readonly Role[];
  rateLimited?: boolean;
  crossSiteChecked?: boolean;
}

const joinPath = (a: string, b: string): string => (`${a.replace(/\/$/, '')}/${b.replace(/^\//, '')}`.replace(/\/$/, '') || '/');
const within = (path: string, under: string) => under === '/' || path === under || path.startsWith(`${under}/`);

/**
 * Every route the app mounts, found by walking Express's router stack: new routes are listed the moment they are
 * mounted, with the roles and rate limits of the middleware in front of them.
 */
export function mountedRoutes(app: Express): MountedRoute[] {
  const out: MountedRoute[] = [];
  const walk = (stack: Layer[], prefix: string, inherited: Scoped[]): void => {
    const scoped = [...inherited];
    for (const layer of stack) {
      const at = typeof layer.rawPath === 'string' ? joinPath(prefix, layer.rawPath) : prefix;
      if (layer.route) {
        const path = joinPath(prefix, layer.route.path);
        const here = [...scoped];
        let spec: EndpointSpec | undefined;
        let clientPage = false;
        for (const l of layer.route.stack) {
          spec ??= specOf(l.handle);
          clientPage ||= isClientPage(l.handle);
          const roles = rolesOf(l.handle);
          if (roles || isRateLimited(l.handle)) here.push({ under: path, roles, rateLimited: isRateLimited(l.handle) });
        }
        const applying = here.filter((s) => within(path, s.under));
        const roles = applying.reduce<readonly Role[] | undefined>((r, s) => s.roles ?? r, undefined);
        const rateLimited = applying.some((s) => s.rateLimited);
        const crossSiteChecked = applying.some((s) => s.crossSiteChecked);
        for (const method of new Set(layer.route.stack.map((l) => l.method).filter((m): m is string => !!m))) {
          out.push({ method: method.toUpperCase(), path, spec, roles, rateLimited, crossSiteChecked, clientPage });
        }
      } else if (layer.handle.stack) {
        walk(layer.handle.stack, at, scoped);
      } else {
        const roles = rolesOf(layer.handle);
        if (roles || isRateLimited(layer.handle) || checksCrossSite(layer.handle)) {
          scoped.push({ under: at, roles, rateLimited: isRateLimited(layer.handle), crossSiteChecked: checksCrossSite(layer.handle) });
        }
      }
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, '', []);
  return out;
}

/** The API's routes: everything mounted but the single-page app's pages. */
export const apiRoutes = (app: Express): MountedRoute[] => mountedRoutes(app).filter((r) => !r.clientPage);
