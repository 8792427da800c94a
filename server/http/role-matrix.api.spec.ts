import type { Express } from 'express';
import { Router } from 'express';
import { describe, expect, it } from 'vitest';
import type { Role } from '../../shared/roles';
import { testApp, userWithToken } from '../test/factories';
import { apiRoutes, type MountedRoute } from './route-registry';

/** Who may call a route, as designed: anyone, any signed-in account, or the roles listed. */
type Access = 'public' | 'signed-in' | readonly Role[];
const staff = ['staff', 'admin'] as const;
const admin = ['admin'] as const;

/**
 * Every API route and who may call it. A route the app mounts without a line here fails the test, so each new route
 * comes with a decision about who may call it.
 */
const matrix: Record<string, Access> = {
  'POST /api/payments/webhook': 'public',
  'POST /api/calculations/rear-spring': 'public',
  'POST /api/calculations/fork-spring': 'public',
  'POST /api/calculations/spring-geometry': 'public',
  'POST /api/calculations/sag-check': 'public',
  'POST /api/recommendations': 'public',
  'POST /api/recommendations/shown': 'public',
  'GET /api/recommendations/bikes/:fitmentId': 'public',
  'GET /api/health': 'public',
  'POST /api/auth/register': 'public',
  'POST /api/auth/login': 'public',
  'POST /api/auth/logout': 'public',
  'GET /api/auth/me': 'signed-in',
  'POST /api/auth/password-reset/request': 'public',
  'POST /api/auth/password-reset/confirm': 'public',
  'GET /api/admin/users': admin,
  'POST /api/admin/users': admin,
  'PATCH /api/admin/users/:id': admin,
  'GET /api/admin/shop-settings': admin,
  'PUT /api/admin/shop-settings': admin,
  'GET /api/shop': 'public',
  'GET /api/staff/dashboard': staff,
  'GET /api/fitments': 'public',
  'GET /api/fitments/makes': 'public',
  'GET /api/fitments/:id': 'public',
  'GET /api/staff/fitments': staff,
  'GET /api/staff/fitments/export.csv': staff,
  'POST /api/staff/fitments/import/preview': staff,
  'POST /api/staff/fitments/import': staff,
  'GET /api/staff/fitments/:id': staff,
  'POST /api/staff/fitments': staff,
  'PUT /api/staff/fitments/:id': staff,
  'DELETE /api/staff/fitments/:id': staff,
  'GET /api/staff/audit': staff,
  'GET /api/products': 'public',
  'GET /api/products/:id': 'public',
  'GET /api/staff/products': staff,
  'GET /api/staff/products/:id': staff,
  'POST /api/staff/products': staff,
  'PUT /api/staff/products/:id': staff,
  'DELETE /api/staff/products/:id': staff,
  'PATCH /api/staff/products/:id/stock': staff,
  'POST /api/staff/products/:id/images': staff,
  'PUT /api/staff/products/:id/images/order': staff,
  'DELETE /api/staff/products/:id/images/:imageId': staff,
  'GET /api/staff/orders': staff,
  'GET /api/staff/orders/:id': staff,
  'POST /api/staff/orders/:id/cancel': staff,
  'POST /api/staff/orders/:id/refunds': staff,
  'GET /api/staff/spring-options': staff,
  'POST /api/staff/spring-geometry': staff,
  'GET /api/staff/fitments/:fitmentId/compatibility': staff,
  'PUT /api/staff/fitments/:fitmentId/springs/:productId/override': staff,
  'DELETE /api/staff/fitments/:fitmentId/springs/:productId/override': staff,
  'PUT /api/staff/fitments/:fitmentId/springs/:productId/adapters': staff,
  // A guest's cart rides on its own cookie.
  'GET /api/cart': 'public',
  'POST /api/cart/lines': 'public',
  'PATCH /api/cart/lines/:id': 'public',
  'DELETE /api/cart/lines/:id': 'public',
  'POST /api/cart/spring-set': 'public',
  'POST /api/checkout': 'public',
  'GET /api/orders': 'signed-in',
  // A guest reaches an order by the token in its link; without one it is a 404 (nothing told about the order).
  'GET /api/orders/:id': 'public',
  'POST /api/orders/:id/cancel': 'public',
  'GET /api/dev/mail': admin,
  'DELETE /api/dev/mail': admin,
  // Each rider's own bikes; anyone signed in has a (possibly empty) garage, and another's bike is a 404.
  'GET /api/bikes': 'signed-in',
  'POST /api/bikes': 'signed-in',
  'GET /api/bikes/:id': 'signed-in',
  'PUT /api/bikes/:id': 'signed-in',
  'PATCH /api/bikes/:id': 'signed-in',
  'DELETE /api/bikes/:id': 'signed-in',
  'GET /api/bikes/:id/sag-checks': 'signed-in',
  'POST /api/bikes/:id/sag-checks': 'signed-in',
  'DELETE /api/bikes/:id/sag-checks/:checkId': 'signed-in',
  'GET /api/bikes/:id/orders': 'signed-in',
  'GET /api/products/:id/bikes': 'public',
  'GET /api/setup-sheet': 'public',
  'GET /api/setup-sheet/pdf': 'public',
  // An order's sheet: its owner, or the holder of the order's link (else a 404).
  'GET /api/setup-sheet/orders/:id': 'public',
  'GET /api/setup-sheet/orders/:id/pdf': 'public',
  'POST /api/staff/stock/deliveries': ['staff', 'warehouse', 'admin'],
  'GET /api/staff/stock/movements': ['staff', 'warehouse', 'admin'],
  'GET /api/staff/stock/low': ['staff', 'warehouse', 'admin'],
  'GET /api/staff/stock/products': ['staff', 'warehouse', 'admin'],
  'PUT /api/staff/stock/products/:id/threshold': staff,
  'GET /api/warehouse/orders': ['warehouse', 'admin'],
  'GET /api/warehouse/orders/:id': ['warehouse', 'admin'],
  'POST /api/warehouse/orders/:id/scan': ['warehouse', 'admin'],
  'PUT /api/warehouse/orders/:id/lines/:lineId/picked': ['warehouse', 'admin'],
  'POST /api/warehouse/orders/:id/pack': ['warehouse', 'admin'],
  'POST /api/warehouse/orders/:id/ship': ['warehouse', 'admin'],
  'POST /api/warehouse/orders/:id/deliver': ['warehouse', 'admin'],
  'GET /api/warehouse/exchanges': ['warehouse', 'admin'],
  'POST /api/warehouse/exchanges/:id/receive': ['warehouse', 'admin'],
  'POST /api/warehouse/exchanges/:id/ship': ['warehouse', 'admin'],
  'GET /api/staff/exchanges': staff,
  'GET /api/staff/exchanges/:id': staff,
  'POST /api/staff/exchanges/:id/decision': staff,
  'GET /api/exchanges/proposal': 'signed-in',
  'GET /api/exchanges': 'signed-in',
  'GET /api/exchanges/:id': 'signed-in',
  'POST /api/exchanges': 'signed-in',
  'GET /api/openapi.json': 'public',
  'GET /api/docs': 'public',
  'GET /files/product-images/:name': 'public',
};

const who = ['guest', 'rider', 'staff', 'warehouse', 'admin'] as const;
type Who = (typeof who)[number];

const keyOf = (r: Pick<MountedRoute, 'method' | 'path'>) => `${r.method} ${r.path}`;
/** The routes a person can reach: the single-page app's own pages are not API routes. */
const reachable = (app: Express) => apiRoutes(app).filter((r) => r.path.startsWith('/api/') || r.path.startsWith('/files/'));

function mayCall(access: Access, person: Who): boolean {
  if (access === 'public') return true;
  if (person === 'guest') return false;
  return access === 'signed-in' || (access as readonly string[]).includes(person);
}

// Ids that name nothing: an allowed caller gets a 4xx about the record or the body, never about who they are.
const fill = (path: string) => path.replace(/:name\b/, 'no-such-image.jpg').replace(/:[A-Za-z]+/g, '5d1f3c2a-0b6e-4c3d-9a7f-2e8b1c4d6f00');

describe('role matrix', () => {
  it('lists every route the app mounts, and nothing it does not', () => {
    const { app } = testApp();
    const mounted = reachable(app).map(keyOf);
    expect(mounted.filter((k) => !(k in matrix)), 'routes mounted without a line in the role matrix').toEqual([]);
    expect(Object.keys(matrix).filter((k) => !mounted.includes(k)), 'lines in the role matrix for routes no longer mounted').toEqual([]);
  });

  it('a route added to the app without a line in the matrix is caught', () => {
    const { app } = testApp();
    const extra = Router();
    extra.get('/unlisted', (_req, res) => void res.json({}));
    app.use('/api/extra', extra);
    expect(reachable(app).map(keyOf).filter((k) => !(k in matrix))).toEqual(['GET /api/extra/unlisted']);
  });

  it('the roles the router declares for each route are the matrix’s', () => {
    const { app } = testApp();
    for (const r of reachable(app)) {
      const access = matrix[keyOf(r)]!;
      expect(r.roles ? [...r.roles].sort() : undefined, keyOf(r)).toEqual(Array.isArray(access) ? [...access].sort() : undefined);
    }
  });

  it('every route answers every role as designed: allowed never 401/403, a guest otherwise 401, a signed-in role otherwise 403', async () => {
    const { http, config, app } = testApp({ calcRateLimitPerMinute: 10_000, loginLimitPerIp: 10_000 });
    const tokens: Partial<Record<Who, Record<string, string>>> = { guest: {} };
    for (const role of ['rider', 'staff', 'warehouse', 'admin'] as const) tokens[role] = (await userWithToken(config, role)).auth;
    const wrong: string[] = [];
    for (const r of reachable(app)) {
      const access = matrix[keyOf(r)]!;
      for (const person of who) {
        const path = fill(r.path);
        const m = r.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
        let req = http[m](path).set(tokens[person]!);
        if (m !== 'get' && m !== 'delete') req = req.send({});
        const status = (await req).status;
        const ok = mayCall(access, person) ? status !== 401 && status !== 403 : status === (person === 'guest' ? 401 : 403);
        if (!ok) wrong.push(`${keyOf(r)} as ${person}: ${status}`);
      }
    }
    expect(wrong).toEqual([]);
  }, 120_000);
});
