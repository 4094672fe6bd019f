import { existsSync } from 'node:fs';
import path from 'node:path';
import { sql } from 'drizzle-orm';
import express, { type Express } from 'express';
import type { AppDeps } from './context';
import { errorHandler, notFoundApi } from './middleware/errors';
import { originCheck } from './middleware/origin';
import { sessionMiddleware } from './middleware/auth';
import { authRouter } from './routes/auth';
import { companyRouter } from './routes/company';
import { membersRouter } from './routes/members';
import { vesselsRouter } from './routes/vessels';
import { logsRouter } from './routes/logs';
import { curvesRouter } from './routes/curves';
import { recommendationsRouter } from './routes/recommendations';
import { plansRouter } from './routes/plans';
import { overhaulRouter } from './routes/overhaul';
import { savingsRouter } from './routes/savings';
import { fleetRouter } from './routes/fleet';
import { reportsRouter } from './routes/reports';
import { subscriptionsRouter } from './routes/subscriptions';
import { fuelPricesRouter } from './routes/fuel-prices';

/**
 * Builds the Express app: middleware -> routers -> errors. It never listens; server/index.ts does, and tests drive
 * it in-process against a real, migrated PostgreSQL.
 */
export function createApp(deps: AppDeps): Express {
  const app = express();
  app.disable('x-powered-by');
  if (deps.config.trustProxy) app.set('trust proxy', deps.config.trustProxy);

  app.use((_req, res, next) => {
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.setHeader('Referrer-Policy', 'same-origin');
    res.setHeader('X-Frame-Options', 'DENY');
    next();
  });

  app.get('/api/health', async (_req, res) => {
    let db: 'up' | 'down' = 'up';
    try {
      await deps.db.execute(sql`select 1`);
    } catch {
      db = 'down';
    }
    res.status(db === 'up' ? 200 : 503).json({ ok: db === 'up', db });
  });

  const api = express.Router();
  api.use(express.json({ limit: '1mb' }));
  api.use(originCheck(deps));
  api.use(sessionMiddleware(deps));
  api.use('/auth', authRouter(deps));
  api.use('/vessels', vesselsRouter(deps));
  api.use('/vessels', logsRouter(deps));
  api.use(membersRouter(deps));
  api.use(companyRouter(deps));
  api.use(curvesRouter(deps));
  api.use(recommendationsRouter(deps));
  api.use(plansRouter(deps));
  api.use(overhaulRouter(deps));
  api.use(savingsRouter(deps), fleetRouter(deps), reportsRouter(deps), subscriptionsRouter(deps), fuelPricesRouter(deps));
  api.use(notFoundApi);
  app.use('/api', api);

  const clientDir = deps.config.clientDir;
  if (clientDir && existsSync(path.join(clientDir, 'index.html'))) {
    app.use(express.static(clientDir, { index: false, maxAge: '1h' }));
    // Client-side routes: every other GET gets the app shell.
    app.get(/^(?!\/api\/).*/, (_req, res) => {
      res.sendFile(path.join(clientDir, 'index.html'));
    });
  }

  app.use(errorHandler);
  return app;
}
