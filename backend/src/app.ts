// Builds the Express app: security headers, sessions in PostgreSQL, CSRF, the API routes and the built client.
import type { MikroORM } from '@mikro-orm/postgresql';
import { requestTransaction } from './http/request-transaction';
import cookieParser from 'cookie-parser';
import express, { type Express } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import { existsSync } from 'node:fs';
import path from 'node:path';
import pg from 'pg';
import { alertPreferencesRoutes } from './alerts/alert-preferences.routes';
import { authRoutes } from './auth/auth.routes';
import { createPassport } from './auth/passport';
import { pgSessionStore } from './auth/session-store';
import { buildsRoutes } from './builds/builds.routes';
import type { AppConfig } from './config';
import { crewRoutes, inviteLinkRoutes } from './crew/crew.routes';
import { csrfProtection } from './http/csrf';
import { partsRoutes } from './parts/parts.routes';
import { systemsRoutes } from './systems/systems.routes';
import { errorMiddleware, NotFound } from './http/errors';
import type { JobQueue } from './jobs/queue';
import type { Mailer } from './mail/mailer';
import { receiptsRoutes } from './receipts/receipts.routes';
import { suggestionsRoutes } from './suggestions/suggestions.routes';
import { exportsRoutes } from './exports/exports.routes';
import { ledgerRoutes } from './ledger/ledger.routes';
import { priceHistoryRoutes } from './prices/price-history.routes';
import { reviewRoutes } from './review/review.routes';
import { inboundMailRoutes } from './inbox/inbound-mail.routes';
import { inboxRoutes } from './inbox/inbox.routes';
import type { ObjectStore } from './storage/object-store';

export interface AppDeps {
  orm: MikroORM;
  config: AppConfig;
  mailer: Mailer;
  store: ObjectStore;
  queue: JobQueue;
}

export interface RunningApp {
  app: Express;
  /** Closes what the app opened itself (the session store's pool). */
  close(): Promise<void>;
}

export function createApp({ orm, config, mailer, store, queue }: AppDeps): RunningApp {
  const app = express();
  app.set('trust proxy', 'loopback');
  app.disable('x-powered-by');

  app.use(
    helmet({
      strictTransportSecurity: config.secureCookies,
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          'style-src': ["'self'", "'unsafe-inline'"],
          'font-src': ["'self'", 'data:'],
          'img-src': ["'self'", 'data:', 'blob:'],
          'upgrade-insecure-requests': config.secureCookies ? [] : null,
        },
      },
    }),
  );
  app.use(express.json({ limit: '1mb' }));
  app.use(cookieParser());
  // Every request gets its own identity map (never the global EntityManager); a writing request, one transaction.
  app.use(requestTransaction(orm));

  const sessionPool = new pg.Pool({ ...config.db, database: config.db.dbName, max: 4 });
  let closing = false;
  // A prune that was under way when the app closed fails on the ended pool: that is no news.
  const sessionStore = pgSessionStore(sessionPool, (...args: unknown[]) => {
    if (!closing) console.error(...args);
  });
  app.use(
    session({
      name: 'tallyhood.sid',
      store: sessionStore,
      secret: config.sessionSecret,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: { httpOnly: true, sameSite: 'lax', secure: config.secureCookies, maxAge: 30 * 24 * 60 * 60 * 1000 },
    }),
  );
  const passport = createPassport();
  app.use(passport.initialize());
  app.use(passport.session());

  const api = express.Router();
  api.use(csrfProtection(config.secureCookies));
  api.get('/health', async (_req, res) => {
    try {
      await orm.em.getConnection().execute('select 1');
      res.json({ status: 'ok', database: 'up' });
    } catch {
      res.status(503).json({ status: 'degraded', database: 'down' });
    }
  });
  api.use('/auth', authRoutes(passport, mailer, config));
  api.use('/invites', inviteLinkRoutes());
  api.use('/builds', buildsRoutes());
  api.use('/builds/:buildId', crewRoutes(mailer, config));
  api.use('/builds/:buildId', alertPreferencesRoutes());
  api.use('/builds/:buildId', systemsRoutes());
  api.use('/builds/:buildId', partsRoutes());
  api.use('/builds/:buildId', receiptsRoutes({ store, queue }));
  api.use('/builds/:buildId', suggestionsRoutes());
  api.use('/builds/:buildId', exportsRoutes({ store }));
  api.use('/builds/:buildId', ledgerRoutes());
  api.use('/builds/:buildId', priceHistoryRoutes());
  api.use('/builds/:buildId', reviewRoutes({ mailer, config }));
  api.use('/builds/:buildId', inboxRoutes(config));
  api.use(() => {
    throw new NotFound('That API route');
  });
  // Outside the CSRF check: the caller is a mail service holding the shared secret, not a browser.
  app.use('/api', inboundMailRoutes({ orm, store, queue, mailer, config }));
  app.use('/api', api);

  const index = path.join(config.clientDist, 'index.html');
  if (existsSync(index)) {
    app.use(express.static(config.clientDist, { index: false, maxAge: '1h' }));
    // `root` keeps the client's own folder out of send's dotfile check, so a checkout under a dot folder
    // (~/.local/src/...) still serves its pages.
    app.get('/{*splat}', (_req, res) => res.sendFile('index.html', { root: config.clientDist }));
  }
  app.use(errorMiddleware);

  return {
    app,
    async close() {
      closing = true;
      await sessionStore.close();
      await sessionPool.end();
    },
  };
}
