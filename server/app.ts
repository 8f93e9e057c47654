/**
 * createApp() builds the Express app from an open database; server/start.ts calls listen.
 * Tests drive the app directly with supertest on a fresh database.
 */
import fs from 'node:fs';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import express, { type RequestHandler } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import type { DbHandle } from '../db/client';
import type { Config } from './env';
import type { Mailer } from './services/mailer';
import type { AppContext } from './context';
import { createStorages, type Storages } from './storage';
import { createPassport } from './auth/passport';
import { createSessionStore } from './auth/session-store';
import { endSessionsPastAbsoluteLifetime, extendSessionWhenDue, SESSION_IDLE_MS } from './auth/session-cadence';
import { createReadCaches } from './read-caches';
import { apiNotFound, errorHandler } from './middleware/errors';
import { forbidden } from './http-error';
import { noteInvalidUtf8, refuseMalformedJson, requireJsonBody } from './middleware/body-guards';
import { setPasswordHashCost } from './services/passwords';
import { healthRoutes } from './routes/health';
import { authRoutes } from './routes/auth';
import { userRoutes } from './routes/users';
import { outboxRoutes } from './routes/outbox';
import { auditRoutes } from './routes/audit';
import { calcRoutes } from './routes/calc';
import { createCalcPool } from './calc-pool';
import { filingRoutes, schemaRoutes } from './routes/filings';
import { labRoutes } from './routes/lab';
import { coTransmissionRoutes } from './routes/co-transmission';
import { evidenceRoutes } from './routes/evidence';
import { refuseChangesToArchivedFilings } from './middleware/archived-guard';
import { reviewRoutes } from './routes/review';
import { packageRoutes } from './routes/packages';
import { createInProcessQueue, type JobQueue } from './jobs/queue';
import { storedEvidence, type ExhibitSources } from './services/exhibit-sources';
import { buildOnSigning, registerPackageJobs, type PackageDeps } from './services/package-service';
import { version as productVersion } from '../package.json';

export const SESSION_COOKIE = 'fieldfile.sid';
export { SESSION_ABSOLUTE_MS } from './auth/session-cadence';
const JSON_LIMIT = '1mb';

/** The session secret: from the environment, or generated once and kept in the data folder. */
function sessionSecret(config: Config): string {
  if (config.sessionSecret) return config.sessionSecret;
  const file = path.join(config.dataDir, 'session-secret');
  if (!fs.existsSync(file)) {
    fs.mkdirSync(config.dataDir, { recursive: true });
    fs.writeFileSync(file, randomBytes(32).toString('hex'), { mode: 0o600 });
  }
  return fs.readFileSync(file, 'utf8').trim();
}

/**
 * Refuses state-changing API calls sent by another site's page (on top of SameSite=Lax). The
 * Expo dev server's origin (`npm run dev`) is let through, with CORS headers for it.
 */
function originGuard(devWebOrigin?: string): RequestHandler {
  return (req, res, next) => {
    const origin = req.get('origin');
    if (origin && origin === devWebOrigin) {
      res.set({
        'Access-Control-Allow-Origin': origin,
        'Access-Control-Allow-Credentials': 'true',
        'Access-Control-Allow-Headers': 'content-type',
        'Access-Control-Allow-Methods': 'GET,POST,PATCH,PUT,DELETE',
        Vary: 'Origin',
      });
      if (req.method === 'OPTIONS') return void res.status(204).end();
      return next();
    }
    if (!origin || ['GET', 'HEAD', 'OPTIONS'].includes(req.method)) return next();
    let host: string;
    try {
      host = new URL(origin).host;
    } catch {
      return next(forbidden('Cross-site request refused.'));
    }
    if (host !== req.get('host')) return next(forbidden('Cross-site request refused.'));
    next();
  };
}

export interface CreateAppOptions {
  handle: DbHandle;
  config: Config;
  mailer: Mailer;
  /** Serve the exported web app from config.distDir (off in API tests). */
  serveWeb?: boolean;
  /** Byte storage; defaults to local disk under config.dataDir. */
  storage?: Storages;
  /** Where the package takes the evidence files from (default: the uploads storage). */
  exhibitSources?: Partial<ExhibitSources>;
  queue?: JobQueue;
}

export function createApp({ handle, config, mailer, serveWeb = true, storage = createStorages(config), exhibitSources, queue }: CreateAppOptions) {
  // New hashes at the configured cost (tests choose a cheaper one; see server/env.ts).
  setPasswordHashCost(config.scryptLog2N);
  const calcPool = createCalcPool({ timeLimitMs: config.calcTimeLimitMs });
  const readCaches = createReadCaches(handle.sqlite);
  const ctx: AppContext = { db: handle.db, config, mailer, storage, calcPool, readCaches };
  const packages: PackageDeps = {
    db: handle.db,
    queue: queue ?? createInProcessQueue(handle.db),
    storage: storage.packages,
    sources: { ...storedEvidence(storage.uploads), ...exhibitSources },
    producer: `Fieldfile ${productVersion}`,
  };
  registerPackageJobs(packages);
  ctx.onVersionSigned = buildOnSigning(packages);
  packages.queue.recoverInterrupted();
  const app = express();
  app.disable('x-powered-by');
  // API answers are no-store, so nobody revalidates them: hashing every body for an ETag is waste.
  // (express.static sets its own ETags for the web app's files.)
  app.set('etag', false);
  app.set('trust proxy', config.trustProxy);
  app.use(
    helmet({
      // The exported web app: one script file from /_expo, an inline reset <style> plus the
      // styles react-native-web inserts at run time, fonts and images from /assets.
      contentSecurityPolicy: {
        useDefaults: false,
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'", 'data:'],
          connectSrc: ["'self'"],
          objectSrc: ["'none'"],
          baseUri: ["'self'"],
          formAction: ["'self'"],
          frameAncestors: ["'none'"],
        },
      },
      crossOriginEmbedderPolicy: false,
    }),
  );

  const store = createSessionStore(handle.sqlite);
  const passport = createPassport(handle.db, readCaches);
  const api = express.Router();
  api.use((_req, res, next) => {
    res.set('Cache-Control', 'no-store');
    next();
  });
  api.use(requireJsonBody);
  api.use(express.json({ limit: JSON_LIMIT, verify: noteInvalidUtf8 }));
  api.use(refuseMalformedJson);
  api.use(originGuard(config.devWebOrigin));
  const auth = authRoutes(ctx);
  // Before the session: a sign-in the guard refuses costs no session work (server/auth/sign-in-guard.ts).
  api.use('/auth', auth.gate);
  // Before the session: a health check reads no session (and costs no session lookup).
  api.use('/health', healthRoutes(ctx));
  api.use(
    session({
      name: SESSION_COOKIE,
      secret: sessionSecret(config),
      store,
      resave: false,
      saveUninitialized: false,
      // Not rolling: the expiry moves at most every few minutes (server/auth/session-cadence.ts).
      rolling: false,
      cookie: { httpOnly: true, sameSite: 'lax', secure: 'auto', maxAge: SESSION_IDLE_MS },
    }),
  );
  api.use(passport.session());
  api.use(endSessionsPastAbsoluteLifetime);
  api.use(extendSessionWhenDue);
  api.use('/auth', auth.routes);
  api.use('/users', userRoutes(ctx));
  api.use('/outbox', outboxRoutes(ctx));
  api.use('/audit', auditRoutes(ctx));
  api.use('/calc', calcRoutes(ctx));
  api.use('/filings/:id', refuseChangesToArchivedFilings(ctx.db));
  api.use('/filings/:id/evidence', evidenceRoutes(ctx));
  api.use('/filings', filingRoutes(ctx));
  api.use('/filings', labRoutes(ctx));
  api.use('/filings', coTransmissionRoutes(ctx));
  api.use('/filings', reviewRoutes(ctx));
  api.use('/schema', schemaRoutes());
  api.use(packageRoutes(packages));
  api.use(apiNotFound);
  api.use(errorHandler);
  app.use('/api', api);

  if (serveWeb) {
    const index = path.join(config.distDir, 'index.html');
    app.use(express.static(config.distDir, { extensions: ['html'], index: false, maxAge: '1h' }));
    // Every other path is a client route: the single-page app decides what to show.
    app.get('/{*splat}', (_req, res) => res.sendFile(index));
  }
  app.use(errorHandler);

  return {
    app,
    packages,
    close: () => {
      store.close();
      void calcPool.close();
    },
  };
}
