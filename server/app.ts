import { existsSync } from 'node:fs';
import path from 'node:path';
import compression from 'compression';
import express, { type Express } from 'express';
import expressStaticGzip from 'express-static-gzip';
import session from 'express-session';
import helmet from 'helmet';
import pg from 'pg';
import type { Sequelize } from 'sequelize';
import './http/express-augment';
import { configurePassport } from './auth/passport';
import { readSession as leanReadSession } from './auth/read-session';
import { SessionCache } from './auth/session-cache';
import { createSessionStore } from './auth/session-store';
import type { AppConfig } from './config';
import { database } from './db/sequelize';
import { authenticate, sessionLifetime } from './middleware/authenticate';
import { trackInFlight } from './http/in-flight';
import { staticHeaders } from './http/static-headers';
import type { Security } from './http/security';
import { createSignInThrottle } from './services/sign-in-throttle';
import { csrfProtection } from './middleware/csrf';
import { apiNotFound, errorHandler } from './middleware/error-handler';
import { API_PREFIX, buildOpenApiDocument } from './openapi';
import { accountRouter } from './routes/account';
import { auditRouter } from './routes/audit';
import { calcRouter } from './routes/calc';
import { stepListRouter } from './routes/step-list';
import { equipmentRouter } from './routes/equipment';
import { chromatogramsRouter } from './routes/chromatograms';
import { compoundsRouter } from './routes/compounds';
import { evaluateRouter, ROUTE_JSON_BODY_LIMIT } from './routes/evaluate';
import { solventAlternativesRouter } from './routes/solvent-alternatives';
import { healthRouter } from './routes/health';
import { invitationsRouter } from './routes/invitations';
import { jobsRouter } from './routes/jobs';
import { optimiseRouter } from './routes/optimise';
import { membersRouter } from './routes/members';
import { outboxRouter } from './routes/outbox';
import { passwordResetsRouter } from './routes/password-resets';
import { revisionsRouter } from './routes/revisions';
import { routesRouter } from './routes/routes';
import { SESSION_COOKIE, sessionRouter } from './routes/session';
import { solventsRouter } from './routes/solvents';
import { tokensRouter } from './routes/tokens';
import { createStorage, type FileStorage } from './storage';

export const JSON_BODY_LIMIT = '1mb';
/** The longest a cached session read is used, change notifications aside (server/auth/session-cache.ts). */
export const SESSION_CACHE_TTL_MS = 30_000;

export interface AppOptions {
  /** The database the health check probes; defaults to the process connection. */
  sequelize?: Sequelize;
  log?: (error: unknown) => void;
  /** Where uploaded files go; defaults to the configured storage. */
  storage?: FileStorage;
}

export interface PhasewrightApp {
  app: Express;
  /**
   * Waits up to `drainMs` (default: the shutdown grace period) for handlers still at work,
   * then releases what the app holds itself (the session store's pool). Call it after the
   * HTTP server has closed, and before the data pool is closed.
   */
  close(options?: { drainMs?: number }): Promise<void>;
  /** Requests whose handlers are still running. */
  inFlight(): number;
}

/**
 * Builds the Express app: security headers, the /api/v1 routers, the built
 * client with its SPA fallback, and JSON errors. Does not listen; expects
 * connectDatabase() to have run.
 */
export function createApp(config: AppConfig, options: AppOptions = {}): PhasewrightApp {
  const sequelize = options.sequelize ?? database();
  const log = options.log ?? ((error: unknown) => console.error('[api]', error));
  const storage = options.storage ?? createStorage(config.storage);
  const app = express();
  app.disable('x-powered-by');
  // First, so shutdown knows which handlers still run (server/http/in-flight.ts).
  const inFlight = trackInFlight();
  app.use(inFlight.middleware);
  // Outside production every reply is checked against its declared schema (server/http/route.ts).
  app.locals.checkReplies = config.env !== 'production';
  app.set('trust proxy', config.trustProxy);

  // The security headers are the same on every response: worked out once, set per response.
  app.use(
    staticHeaders(
      helmet({
        contentSecurityPolicy: {
          useDefaults: true,
          directives: {
            defaultSrc: ["'self'"],
            scriptSrc: ["'self'"],
            // React Flow positions nodes with style attributes.
            styleSrc: ["'self'", "'unsafe-inline'"],
            fontSrc: ["'self'", 'data:'],
            imgSrc: ["'self'", 'data:', 'blob:'],
            workerSrc: ["'self'", 'blob:'],
            connectSrc: ["'self'"],
            objectSrc: ["'none'"],
            frameAncestors: ["'none'"],
            // The app is often reached over plain http://127.0.0.1; upgrading would break it.
            upgradeInsecureRequests: null,
          },
        },
      }),
    ),
  );

  // API replies and the HTML page are compressed per request (above 1 kB); built assets are
  // sent from the brotli or gzip copy the build wrote, which this middleware leaves alone.
  // A client that accepts no encoding (scripts, load generators) skips the middleware's
  // wrapping of every reply.
  const compress = compression({ threshold: 1024 });
  app.use((req, res, next) => (req.headers['accept-encoding'] ? compress(req, res, next) : next()));

  // Sessions and rate limits share one small pool. An idle client's error (the database
  // restarting) must be handled, or Node ends the process; the pool then reconnects by itself.
  const sessionPool = new pg.Pool({
    connectionString: config.databaseUrl,
    max: config.databasePool.sessionMax,
    connectionTimeoutMillis: 5_000,
    idleTimeoutMillis: 30_000,
  });
  sessionPool.on('error', (error) => log(error));
  // Reads (GET, HEAD) take the session, its user and roles from a short-lived cache that the
  // database's change notifications keep true across servers; writes always read them afresh.
  const sessionCache = new SessionCache({
    connectionString: config.databaseUrl,
    ttlMs: SESSION_CACHE_TTL_MS,
    maxEntries: 10_000,
    log,
  });
  sessionCache.start();
  const store = createSessionStore({
    pool: sessionPool,
    pruneSessionIntervalSeconds: 15 * 60,
    errorLog: (...args: unknown[]) => log(args),
    cache: { cache: sessionCache, serveFromCache: false },
  });
  const readStore = createSessionStore({
    pool: sessionPool,
    // One store prunes expired sessions.
    pruneSessionIntervalSeconds: false,
    errorLog: (...args: unknown[]) => log(args),
    cache: { cache: sessionCache, serveFromCache: true },
  });
  const passport = configurePassport();
  const security: Security = {
    pool: sessionPool,
    throttle: createSignInThrottle(sessionPool, config.signInThrottle),
  };

  const api = express.Router();
  // Route documents (up to a few hundred steps) get a larger limit than other bodies.
  api.use(
    ['/evaluate', '/optimise', '/solvent-alternatives', '/workspaces/:workspaceId/routes'],
    express.json({ limit: ROUTE_JSON_BODY_LIMIT }),
  );
  api.use(express.json({ limit: JSON_BODY_LIMIT }));
  const sessionOptions = (sessionStore: typeof store) =>
    session({
      name: SESSION_COOKIE,
      secret: config.sessionSecret,
      store: sessionStore,
      resave: false,
      saveUninitialized: false,
      // Every request pushes expiry forward: the session ends after SESSION_IDLE_MINUTES of
      // inactivity. The store writes the pushed expiry at most once a minute.
      rolling: true,
      cookie: {
        httpOnly: true,
        sameSite: 'lax',
        secure: 'auto',
        maxAge: config.sessionIdleMinutes * 60_000,
      },
    });
  const writeSession = sessionOptions(store);
  const readSession = sessionOptions(readStore);
  // A signed-in read takes the lean path (server/auth/read-session.ts): one HMAC, one cache
  // look-up, the expiry and cookie moved at most once a minute. Writes, Bearer tokens and
  // anything unusual go through express-session, passport and authenticate().
  api.use(
    leanReadSession({
      name: SESSION_COOKIE,
      secret: config.sessionSecret,
      idleMs: config.sessionIdleMinutes * 60_000,
      store: readStore,
      fallback: [
        (req, res, next) =>
          (req.method === 'GET' || req.method === 'HEAD' ? readSession : writeSession)(
            req,
            res,
            next,
          ),
        passport.initialize(),
        passport.session(),
        authenticate,
      ],
    }),
  );
  api.use(sessionLifetime(config.sessionMaxHours));
  api.use(csrfProtection((method, requestPath) => method === 'POST' && requestPath === '/session'));

  api.use(healthRouter(sequelize));
  api.use(sessionRouter(config, security));
  api.use(accountRouter(security));
  api.use(membersRouter(config));
  api.use(invitationsRouter(config, security));
  api.use(passwordResetsRouter(config, security));
  api.use(tokensRouter());
  api.use(outboxRouter(config));
  api.use(solventsRouter());
  api.use(calcRouter(config));
  api.use(compoundsRouter());
  api.use(equipmentRouter());
  api.use(evaluateRouter(config));
  api.use(solventAlternativesRouter(config));
  api.use(optimiseRouter(config));
  api.use(jobsRouter());
  api.use(routesRouter(config));
  api.use(auditRouter());
  api.use(revisionsRouter(config, security));
  api.use(chromatogramsRouter(config, storage, log));
  api.use(stepListRouter(config));
  api.get('/openapi.json', (_req, res) => {
    res.json(buildOpenApiDocument());
  });
  api.use(apiNotFound);
  app.use(API_PREFIX, api);
  app.use('/api', apiNotFound);

  const staticDir = path.resolve(config.staticDir);
  const indexHtml = path.join(staticDir, 'index.html');
  // Hashed asset names change with their content, so they may be cached for long. The build
  // wrote .br and .gz copies beside each text asset: the one the browser accepts is sent.
  app.use(
    '/assets',
    expressStaticGzip(path.join(staticDir, 'assets'), {
      enableBrotli: true,
      orderPreference: ['br', 'gz'],
      index: false,
      serveStatic: { immutable: true, maxAge: '365d' },
    }),
  );
  // A missing asset must not fall back to index.html (the browser would parse HTML as a script).
  app.use('/assets', (_req, res) => {
    res.status(404).type('text/plain').send('Not found');
  });
  app.use(express.static(staticDir, { index: false }));
  app.get('/{*splat}', (_req, res) => {
    if (!existsSync(indexHtml)) {
      res
        .status(503)
        .type('text/plain')
        .send('The client is not built yet: run `npm run build` (npm start does it).');
      return;
    }
    res.set('Cache-Control', 'no-cache').sendFile(indexHtml);
  });

  app.use(errorHandler(log, { checkReplies: config.env !== 'production' }));

  return {
    app,
    inFlight: inFlight.count,
    close: async (options = {}) => {
      const drainMs = options.drainMs ?? config.shutdownGraceSeconds * 1000;
      if (!(await inFlight.drained(drainMs)))
        log(
          new Error(
            `${inFlight.count()} request(s) still running after ${Math.round(drainMs / 1000)} s; closing the database connections under them.`,
          ),
        );
      store.close();
      readStore.close();
      await sessionCache.close();
      await sessionPool.end().catch(() => undefined);
    },
  };
}
