import { existsSync } from 'node:fs';
import path from 'node:path';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { DocumentBuilder, SwaggerModule } from '@nestjs/swagger';
import compression from 'compression';
import type { Express, NextFunction, Request, Response } from 'express';
import session from 'express-session';
import expressStaticGzip from 'express-static-gzip';
import passport from 'passport';
import { sessionUser } from './auth/session-user.js';
import { createLogger, PinoNestLogger, requestLog } from './common/logging/request-log.js';
import { inTurn } from './common/middleware/in-turn.js';
import { requestBodies } from './common/middleware/request-body.js';
import { securityHeaders, strictCsp } from './common/middleware/security-headers.js';
import { createValidationPipe } from './common/pipes/validation.pipe.js';
import { acceptsGzip } from './common/responses/json-once.js';
import type { AppConfig } from './config/app.config.js';
import { API_VERSION } from './health/health.controller.js';
import { mountDevOutboxPage } from './mail/dev-outbox.page.js';
import { MetricsService } from './metrics/metrics.service.js';
import { SessionStoreService } from './sessions/session-store.service.js';
import { HttpExceptionFilter } from './common/filters/http-exception.filter.js';

const HEALTH_PATH = '/api/health';
/** The notebook list (MissesController.findAll), which encodes its own answers. */
const NOTEBOOK_PATH = '/api/misses';

/** `/api`, and anything under it, as `app.use('/api', …)` matches it. */
const API_PATH = /^\/api(?:[/?]|$)/;

/** Everything the HTTP app needs around its modules: security headers, sessions, docs, the web app. */
export function configureApp(app: NestExpressApplication, config: AppConfig): void {
  // Pretty lines only for a person at a terminal running the development server.
  const logger = createLogger(
    config.logLevel,
    config.env === 'development' && process.stdout.isTTY === true,
  );
  app.useLogger(new PinoNestLogger(logger));
  const metrics = app.get(MetricsService);
  app.setGlobalPrefix('api');
  if (config.trustProxy) app.set('trust proxy', 1);
  app.disable('x-powered-by');

  const log = requestLog(logger, (req, status) => {
    if (API_PATH.test(req.originalUrl)) metrics.countResponse(status);
  });

  // JSON and pages compressed on the fly; the web app's files come precompressed (serveWebApp).
  // Images, PDFs and zips are not compressible types, so downloads stream as they are. Health's
  // few dozen bytes are under compression's threshold, and the notebook list answers gzip or
  // plain JSON itself (sendJsonOnce): those skip the wrapping altogether, about 5% of a
  // notebook request's CPU (`npm run bench -w packages/api -- profile`). A client that takes
  // only another encoding (br) still gets it from compression.
  const compress = compression();
  const selfEncoded = (req: Request) =>
    req.path === HEALTH_PATH ||
    (req.path === NOTEBOOK_PATH &&
      req.method === 'GET' &&
      (!req.headers['accept-encoding'] || acceptsGzip(req)));
  const compressUnlessSelfEncoded = (req: Request, res: Response, next: NextFunction) =>
    selfEncoded(req) ? next() : compress(req, res, next);

  // Swagger UI ships inline styles; only its own pages get them.
  const headers = {
    app: securityHeaders(config, strictCsp),
    docs: securityHeaders(config, { ...strictCsp, styleSrc: ["'self'", "'unsafe-inline'"] }),
  };
  const httpsSite = config.publicUrl?.startsWith('https:') ?? false;
  const securityHeadersFor = (req: Request, res: Response, next: NextFunction) => {
    const page = req.path.startsWith('/api/docs') ? headers.docs : headers.app;
    // req.secure reads X-Forwarded-Proto only with TRUST_PROXY.
    return (req.secure || httpsSite ? page.https : page.http)(req, res, next);
  };
  const noStoreForApi = (req: Request, res: Response, next: NextFunction) => {
    if (API_PATH.test(req.path)) res.setHeader('Cache-Control', 'no-store');
    next();
  };

  // Sessions (a store read, passport) only where a route may use them: not for /api/health,
  // the API docs, or the web app's files and pages.
  const sessions = inTurn(
    session({
      name: config.session.cookieName,
      secret: config.session.secret,
      store: app.get(SessionStoreService).store,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      unset: 'destroy',
      cookie: {
        httpOnly: true,
        sameSite: 'lax',
        secure: config.session.secure,
        maxAge: config.session.idleMs,
      },
    }),
    absoluteLifetime(config.session.maxAgeMs),
    // passport.session()'s work; req.logIn, req.isAuthenticated and the rest are set once on
    // Express's request prototype (passport's initialize() is only for strategies before 0.5).
    sessionUser(passport, (app.getHttpAdapter().getInstance() as Express).request),
  );
  // The store or the member lookup failing (a busy or unreachable database) answers as a
  // route's error would: through the exception filter, never Express's default 500 page.
  const errors = new HttpExceptionFilter(metrics);
  const sessionsWhereNeeded = (req: Request, res: Response, next: NextFunction) =>
    needsSession(req.path)
      ? sessions(req, res, (err?: unknown) =>
          err && err !== 'route' ? errors.respond(err, req, res) : next(err),
        )
      : next();

  // What every request meets, as one layer of Express's router (see inTurn).
  app.use(
    inTurn(
      log,
      requestBodies(config.limits.bodyTimeoutMs),
      compressUnlessSelfEncoded,
      securityHeadersFor,
      noStoreForApi,
      sessionsWhereNeeded,
    ),
  );

  app.useGlobalPipes(createValidationPipe());

  const document = SwaggerModule.createDocument(
    app,
    new DocumentBuilder()
      .setTitle('Workback API')
      .setDescription(
        'Error-analysis notebook for home-teaching families. Send the token from GET /api/auth/csrf as x-csrf-token on every write.',
      )
      .setVersion(API_VERSION)
      .addCookieAuth(config.session.cookieName)
      .build(),
  );
  SwaggerModule.setup('api/docs', app, document, { useGlobalPrefix: false });

  mountDevOutboxPage(app);
  serveWebApp(app, config.webDist);
}

/** Public routes that never read or write the session, and everything outside /api. */
const SESSIONLESS = [HEALTH_PATH, '/api/docs'];

export function needsSession(path: string): boolean {
  return (
    path.startsWith('/api/') &&
    !SESSIONLESS.some((p) => path === p || path.startsWith(`${p}/`) || path.startsWith(`${p}-`))
  );
}

/** A signed-in session ends 12 h after sign-in however active it is (the idle limit is the cookie's). */
function absoluteLifetime(maxAgeMs: number) {
  return (req: Request, _res: Response, next: NextFunction) => {
    const started = req.session?.signedInAt;
    if (started !== undefined && Date.now() - started > maxAgeMs) {
      req.session.regenerate((err) => next(err));
      return;
    }
    next();
  };
}

/** The built web app on the same origin, with client-side routes falling back to index.html. */
function serveWebApp(app: NestExpressApplication, webDist: string): void {
  const index = path.join(webDist, 'index.html');
  if (!existsSync(index)) return;
  const hashed = path.join(webDist, 'assets') + path.sep;
  // Vite names every file under assets/ by its content's hash: cache those for a year; anything
  // else (index.html, a service worker) is checked with the server on each use.
  const assets = expressStaticGzip(webDist, {
    index: false,
    enableBrotli: true,
    orderPreference: ['br', 'gzip'],
    serveStatic: {
      cacheControl: false,
      setHeaders: (res, file) => {
        res.setHeader(
          'Cache-Control',
          file.startsWith(hashed) ? 'public, max-age=31536000, immutable' : 'no-cache',
        );
      },
    },
  });
  // API paths never name a file of the web app: skip the disk lookup on every API request.
  app.use((req: Request, res: Response, next: NextFunction) =>
    req.path.startsWith('/api') ? next() : assets(req, res, next),
  );
  app.use((req: Request, res: Response, next: NextFunction) => {
    if (req.method !== 'GET' || req.path.startsWith('/api') || !req.accepts('html')) return next();
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index);
  });
}
