import 'reflect-metadata';
import cookieParser from 'cookie-parser';
import express, { type Express } from 'express';
import { existsSync, readFileSync } from 'node:fs';
import { extname, join } from 'node:path';
import expressStaticGzip from 'express-static-gzip';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import { adminUserRoutes, authRoutes } from './accounts/accounts.routes';
import { auditRoutes } from './audit/audit.routes';
import { bikeRoutes } from './bikes/bikes.routes';
import { productImageFiles, publicProductRoutes, staffCatalogueRoutes, staffProductRoutes } from './catalogue/catalogue.routes';
import { getConfig, type Config } from './config';
import { cartRoutes } from './cart/cart.routes';
import { checkoutRoutes } from './checkout/checkout.routes';
import { orderRoutes, staffOrderRoutes } from './orders/orders.routes';
import { stockRoutes } from './stock/stock.routes';
import { warehouseRoutes } from './warehouse/warehouse.routes';
import { exchangeRoutes, staffExchangeRoutes, warehouseExchangeRoutes } from './exchanges/exchanges.routes';
import { paymentWebhookRoutes } from './payments/payments.routes';
import { paymentProviderFor } from './payments/stripe-provider';
import { calculationRoutes } from './calculations/calculations.routes';
import { healthRoutes } from './health/health.routes';
import { devMailRoutes } from './mail/dev-mail.routes';
import { apiDescriptionRoutes } from './openapi/openapi.routes';
import { adminShopSettingsRoutes, shopIdentityRoutes } from './shop/shop-settings.routes';
import { staffDashboardRoutes } from './dashboard/dashboard.routes';
import { recommendationRoutes } from './recommendations/recommendations.routes';
import { setupSheetRoutes } from './setup-sheet/setup-sheet.routes';
import { authenticate } from './http/auth';
import { publicFitmentRoutes, staffFitmentRoutes } from './fitment/fitment.routes';
import { errorMiddleware, notFoundApi } from './http/error-middleware';
import { pageWithNonce, styleNonce } from './http/content-security';
import { originCheck } from './http/origin-check';
import { clientPageMark, mark } from './http/route-meta';

/** Builds the whole app; index.ts listens, tests listen on port 0. */
export function createApp(config: Config = getConfig()): Express {
  const app = express();
  app.disable('x-powered-by');
  // API answers are computed per request and never revalidated, so hashing each one for an ETag is wasted work
  // (up to a tenth of a recommendation's cost); static files keep their own validators.
  app.set('etag', false);
  // Per-address limits read req.ip, which is the client's only when the proxies in front are trusted and no others.
  app.set('trust proxy', config.trustProxy);

  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: false,
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          // The component library injects its theme as <style> elements at run time; they carry the page's nonce.
          styleSrc: ["'self'", styleNonce],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'", 'data:'],
          connectSrc: ["'self'"],
          objectSrc: ["'none'"],
          baseUri: ["'self'"],
          formAction: ["'self'"],
          frameAncestors: ["'none'"],
        },
      },
      // Served over plain HTTP on loopback for the demo; a TLS proxy in front sets HSTS in production.
      strictTransportSecurity: config.secureCookies,
    }),
  );
  // With logging off there is nothing to log per request, so no per-request logger is made (every req.log use is optional).
  if (config.logLevel !== 'silent') {
    app.use(
      pinoHttp({
        level: config.logLevel,
        autoLogging: { ignore: (req) => req.url === '/api/health' },
        // Headers carry session cookies and tokens; log only what is needed to follow a request.
        serializers: {
          req: (req: { method: string; url: string }) => ({ method: req.method, url: req.url.split('?')[0] }),
          res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
        },
      }),
    );
  }
  // Stateless public routes need no session: mounted before the cookie, origin and sign-in checks, so a
  // signed-in rider's live calculations never wait on a user lookup.
  const json = express.json({ limit: config.bodyLimitBytes });
  // The provider's events carry their own signature and come from its servers: no cookie, origin or JSON parsing first.
  const payments = paymentProviderFor(config);
  app.use('/api/payments/webhook', paymentWebhookRoutes(config, payments));
  app.use('/api/calculations', json, calculationRoutes(config));
  app.use('/api/recommendations', json, recommendationRoutes(config));

  app.use(cookieParser());

  const api = express.Router();
  api.use(json);
  api.use(originCheck(config));
  api.use(authenticate(config));
  api.use('/health', healthRoutes());
  api.use('/auth', authRoutes(config));
  api.use('/admin/users', adminUserRoutes());
  api.use('/admin/shop-settings', adminShopSettingsRoutes());
  api.use('/shop', shopIdentityRoutes());
  api.use('/staff/dashboard', staffDashboardRoutes());
  api.use('/fitments', publicFitmentRoutes());
  api.use('/staff/fitments', staffFitmentRoutes(config.csvImportMaxBytes));
  api.use('/staff/audit', auditRoutes());
  api.use('/products', publicProductRoutes());
  api.use('/staff/products', staffProductRoutes(config));
  api.use('/staff/orders', staffOrderRoutes(config, payments));
  api.use('/staff/stock', stockRoutes());
  api.use('/warehouse/exchanges', warehouseExchangeRoutes(config, payments));
  api.use('/warehouse', warehouseRoutes(config));
  api.use('/staff/exchanges', staffExchangeRoutes(config, payments));
  api.use('/staff', staffCatalogueRoutes());
  api.use('/cart', cartRoutes(config));
  api.use('/checkout', checkoutRoutes(config, payments));
  api.use('/orders', orderRoutes(config, payments));
  api.use('/bikes', bikeRoutes(config));
  api.use('/setup-sheet', setupSheetRoutes(config));
  api.use('/exchanges', exchangeRoutes(config));
  // Reads the local mail stand-in; a production server has no such thing and no such route.
  if (config.nodeEnv !== 'production') api.use('/dev/mail', devMailRoutes(config));
  api.use(apiDescriptionRoutes());
  api.use(notFoundApi);
  app.use('/api', api);
  // Before the SPA fallback, so a missing image is a 404 and not the app's index page.
  app.use('/files/product-images', productImageFiles(config));

  serveClient(app, config);
  app.use(errorMiddleware);
  return app;
}

function serveClient(app: Express, config: Config): void {
  const index = join(config.clientDist, 'index.html');
  if (!existsSync(index)) return;
  const page = readFileSync(index, 'utf8');
  // Each response carries its own nonce, so the page is never stored or revalidated against an older copy.
  const sendPage: express.RequestHandler = mark((_req, res) => {
    res.setHeader('Cache-Control', 'no-store');
    res.type('html').send(pageWithNonce(page, res));
  }, { [clientPageMark]: true });
  // Built assets are served precompressed (.br or .gz made by the build) when the browser accepts it.
  app.use(
    '/assets',
    expressStaticGzip(join(config.clientDist, 'assets'), {
      enableBrotli: true,
      orderPreference: ['br', 'gz'],
      serveStatic: { immutable: true, maxAge: '1y', fallthrough: false },
    }),
  );
  app.get('/index.html', sendPage);
  app.use(express.static(config.clientDist, { index: false, maxAge: '1h' }));
  // Client-side routes get the SPA; a path with an extension is a missing file and stays 404.
  app.get('/{*splat}', mark((req, res, next) => {
    if (extname(req.path)) return next();
    sendPage(req, res, next);
  }, { [clientPageMark]: true }));
}
