import { randomUUID } from 'node:crypto';
import { existsSync } from 'node:fs';
import path from 'node:path';
import cookieParser from 'cookie-parser';
import express, { Router } from 'express';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import type { AppContext } from './lib/context';
import { authenticate } from './lib/auth/session';
import { originCheck } from './lib/auth/origin-check';
import { mount, type RouteDef } from './lib/auth/routes';
import { errorHandler, notFoundHandler } from './lib/errors/error-handler';
import { authRoutes } from './modules/auth/auth.routes';
import { facilityRoutes } from './modules/facility/facility.routes';
import { healthRoutes } from './modules/health/health.routes';
import { organisationsRoutes } from './modules/organisations/organisations.routes';
import { usersRoutes } from './modules/users/users.routes';
import { accountsRoutes } from './modules/accounts/accounts.routes';
import { bookingsRoutes } from './modules/bookings/bookings.routes';
import { calendarFeedRoutes } from './modules/calendar-feed/calendar-feed.routes';
import { maintenanceRoutes } from './modules/maintenance/maintenance.routes';
import { opticsRoutes } from './modules/optics/optics.routes';
import { plannerRoutes } from './modules/planner/planner.routes';
import { eyewearRoutes } from './modules/safety/eyewear.routes';
import { attachmentsRoutes } from './modules/attachments/attachments.routes';
import { reportsRoutes } from './modules/reports/reports.routes';
import { usageRoutes } from './modules/usage/usage.routes';
import { billingRoutes } from './modules/billing/billing.routes';
import { rateCardsRoutes } from './modules/rate-cards/rate-cards.routes';
import { invoicesRoutes } from './modules/invoices/invoices.routes';
import { estimatesRoutes } from './modules/estimates/estimates.routes';
import { beamTimeRoutes } from './modules/beam-time/beam-time.routes';
import { stripeWebhookHandler } from './modules/webhooks/stripe-webhook';
import { instrumentAdminRoutes } from './modules/instruments/instrument-admin.routes';
import { trainingRoutes } from './modules/training/training.routes';
import { stationsRoutes } from './modules/stations/stations.routes';

/** The router table: every API route with its access rule, mounted under /api. */
export function routeTable(ctx: AppContext): RouteDef[] {
  return [
    ...healthRoutes(ctx),
    ...authRoutes(ctx),
    ...usersRoutes(ctx),
    ...organisationsRoutes(ctx),
    ...facilityRoutes(ctx),
    ...accountsRoutes(ctx),
    ...opticsRoutes(ctx),
    ...bookingsRoutes(ctx),
    ...maintenanceRoutes(ctx),
    ...plannerRoutes(ctx),
    ...calendarFeedRoutes(ctx),
    ...eyewearRoutes(ctx),
    ...usageRoutes(ctx),
    ...attachmentsRoutes(ctx),
    ...reportsRoutes(ctx),
    ...rateCardsRoutes(ctx),
    ...billingRoutes(ctx),
    ...invoicesRoutes(ctx),
    ...instrumentAdminRoutes(ctx),
    ...estimatesRoutes(ctx),
    ...beamTimeRoutes(ctx),
    ...trainingRoutes(ctx),
    ...stationsRoutes(ctx),
  ];
}

export function createApp(ctx: AppContext) {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          // The calendar library injects its stylesheet at run time.
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'", 'data:'],
          connectSrc: ["'self'"],
          frameAncestors: ["'none'"],
          formAction: ["'self'"],
          upgradeInsecureRequests: null,
        },
      },
      strictTransportSecurity: ctx.env.APP_URL.startsWith('https:'),
    }),
  );
  app.use(
    pinoHttp({
      logger: ctx.logger,
      quietReqLogger: true,
      genReqId: (req, res) => {
        const incoming = req.headers['x-request-id'];
        const id = typeof incoming === 'string' && /^[\w-]{8,64}$/.test(incoming) ? incoming : randomUUID();
        res.setHeader('X-Request-Id', id);
        return id;
      },
      autoLogging: { ignore: (req) => req.url === '/api/health' },
      serializers: {
        req: (req) => ({ id: req.id, method: req.method, url: String(req.url).replace(/([?&]token=)[^&]+/g, '$1[redacted]').replace(/\/calendar\/[^/?]+\.ics/, '/calendar/[redacted].ics').replace(/\/invitations\/[^/?]+/, '/invitations/[redacted]'), remoteAddress: req.remoteAddress }),
      },
    }),
  );

  const api = Router();
  api.use(express.json({ limit: '4mb' }));
  api.use(cookieParser());
  api.use(originCheck(ctx.env.APP_URL));
  api.use(authenticate(ctx));
  mount(api, routeTable(ctx));
  api.use(notFoundHandler);
  // Stripe signs the raw bytes: this route gets them before the API router's JSON parser (public; origin-exempt).
  app.post('/api/webhooks/stripe', express.raw({ type: '*/*', limit: '1mb' }), stripeWebhookHandler(ctx));
  app.use('/api', api);

  const dist = ctx.env.WEB_DIST;
  if (dist && existsSync(path.join(dist, 'index.html'))) {
    app.use(express.static(dist, { index: false, maxAge: '1h' }));
    app.get(/^\/(?!api\/).*/, (_req, res) => res.sendFile(path.join(dist, 'index.html')));
  }
  app.use(errorHandler);
  return app;
}
