import { existsSync } from 'node:fs';
import path from 'node:path';
import express, { type Express } from 'express';
import helmet from 'helmet';
import type { Logger } from 'pino';
import { pinoHttp } from 'pino-http';
import type { Piscina } from 'piscina';
import type { Config } from './config.ts';
import type { Database } from './db/client.ts';
import { createEnginePool } from './engine-pool/engine-pool.ts';
import type { ChunkExecutor } from './engine-pool/chunk-executor.ts';
import { createPoolExecutor } from './engine-pool/pool-executor.ts';
import { createRedisExecutor } from './scale-out/redis-executor.ts';
import { workersRoutes } from './modules/workers/workers.routes.ts';
import { RouteRegistry } from './lib/http.ts';
import { serializeError } from './logger.ts';
import { apiNotFound, errorHandler } from './middleware/error-handler.ts';
import { allowedHosts, hostCheck } from './middleware/host-check.ts';
import { originCheck } from './middleware/origin-check.ts';
import { authenticate } from './modules/auth/auth.middleware.ts';
import { authRoutes } from './modules/auth/auth.routes.ts';
import { createAuthService } from './modules/auth/auth.service.ts';
import { createSessionStore } from './modules/auth/session.ts';
import { membersRoutes } from './modules/departments/members.routes.ts';
import { createMembersService } from './modules/departments/members.service.ts';
import { healthRoutes } from './modules/health/health.routes.ts';
import { occurrenceTablesRoutes } from './modules/occurrence-tables/occurrence-tables.routes.ts';
import { createOccurrenceTablesService } from './modules/occurrence-tables/occurrence-tables.service.ts';
import { openApiRoutes } from './modules/openapi/openapi.routes.ts';
import { RunEvents } from './modules/runs/run-events.ts';
import { createRunScheduler, DEFAULT_SCHEDULER_TIMING, type RunSettledHook, type SchedulerOptions } from './modules/runs/run-scheduler.ts';
import { runsRoutes } from './modules/runs/runs.routes.ts';
import { createRunsService, type RunBilling } from './modules/runs/runs.service.ts';
import { samplesRoutes } from './modules/samples/samples.routes.ts';
import { createSamplesService } from './modules/samples/samples.service.ts';
import { scenariosRoutes } from './modules/scenarios/scenarios.routes.ts';
import { createScenariosService } from './modules/scenarios/scenarios.service.ts';
import { sweepsRoutes } from './modules/sweeps/sweeps.routes.ts';
import { createSweepsService } from './modules/sweeps/sweeps.service.ts';
import { fitsRoutes } from './modules/fits/fits.routes.ts';
import { impliedRoutes } from './modules/implied/implied.routes.ts';
import { createImpliedService } from './modules/implied/implied.service.ts';
import { createFitsService } from './modules/fits/fits.service.ts';
import { tokensRoutes } from './modules/tokens/tokens.routes.ts';
import { createTokensService } from './modules/tokens/tokens.service.ts';
import { createGridResolver } from './modules/runs/engulfment-grid-cache.ts';
import { accountRoutes } from './modules/account/account.routes.ts';
import { settingsRoutes } from './modules/account/settings.routes.ts';
import { createSettingsService } from './modules/account/settings.service.ts';
import { createAccountService } from './modules/account/account.service.ts';
import { signUpRoutes } from './modules/sign-up/sign-up.routes.ts';
import { createSignUpService } from './modules/sign-up/sign-up.service.ts';
import { billingRoutes, WEBHOOK_PATH } from './modules/billing/billing.routes.ts';
import { createBillingService, type BillingService } from './modules/billing/billing.service.ts';
import { createPaymentGateway } from './modules/billing/payment-gateway.ts';
import { invitationsRoutes } from './modules/invitations/invitations.routes.ts';
import { createInvitationsService } from './modules/invitations/invitations.service.ts';
import { createMailer } from './modules/mail/mailer.ts';
import { constraintsRoutes } from './modules/constraints/constraints.routes.ts';
import { createConstraintSetsService } from './modules/constraints/constraint-sets.service.ts';
import { outboxRoutes } from './modules/mail/outbox.routes.ts';
import { exportsRoutes } from './modules/exports/exports.routes.ts';
import { createExportsService } from './modules/exports/exports.service.ts';
import { sharesRoutes } from './modules/shares/shares.routes.ts';
import { createSharesService } from './modules/shares/shares.service.ts';
import { createRunNotices } from './modules/runs/run-notices.ts';

export interface AppDeps {
  config: Config;
  database: Database;
  logger: Logger;
  /** The engine's worker pool (default: a new one of config.WORKER_THREADS threads). */
  pool?: Piscina;
  /** Where runs' chunks are computed (default: the pool, or BullMQ workers when REDIS_URL is set). Tests inject faults here. */
  executor?: ChunkExecutor;
  /** Scheduler timing (poll interval, leases, save back-off); tests shorten it. */
  schedulerTiming?: Partial<Pick<SchedulerOptions, 'pollIntervalMs' | 'leaseMs' | 'saveRetry'>>;
  /** How runs are charged (default: the credit ledger of server/modules/billing). */
  billing?: RunBilling;
  /** Called after billing and e-mail notices when a run reaches a final state. */
  onRunSettled?: RunSettledHook;
}

export interface TidefieldApp {
  app: Express;
  registry: RouteRegistry;
  scheduler: ReturnType<typeof createRunScheduler>;
  /** The credit ledger (operators' adjustments and tests use it directly). */
  billing: BillingService;
  /** Stops the scheduler (runs checkpoint and resume on the next start) and the pool made here. */
  close(): Promise<void>;
}

/** Wires every module into one Express app. The only place where things are put together. */
export function createApp(deps: AppDeps): TidefieldApp {
  const { config, database, logger } = deps;
  const { db } = database;
  const registry = new RouteRegistry();
  // Where chunks are computed: an injected executor, BullMQ workers (REDIS_URL), or the app's own pool.
  const scaleOut = !deps.executor && config.REDIS_URL !== undefined;
  const ownPool = !deps.pool && !deps.executor && !scaleOut;
  const pool = deps.pool ?? (ownPool ? createEnginePool({ workers: config.WORKER_THREADS }) : undefined);
  const executor: ChunkExecutor =
    deps.executor ??
    (scaleOut
      ? createRedisExecutor({ url: config.REDIS_URL!, queue: config.REDIS_QUEUE, batchChunks: config.REDIS_BATCH_CHUNKS, jobsPerRun: config.REDIS_JOBS_PER_RUN, logger })
      : createPoolExecutor({ pool: pool!, resolveGrid: createGridResolver(db, pool) }));

  const events = new RunEvents();
  const scheduler = createRunScheduler({
    db,
    executor,
    events,
    logger,
    onSettled: async (run, outcome) => {
      // Settle or refund the reservation (idempotent), then tell the owner.
      const settled = await billing.settleRun(run, outcome);
      await runNotices(run, outcome, settled?.refundedCredits ?? 0);
      await deps.onRunSettled?.(run, outcome);
    },
    options: {
      maxConcurrentRuns: config.RUNS_MAX_CONCURRENT,
      maxRunsPerDepartment: config.RUNS_PER_DEPARTMENT,
      checkpointIntervalMs: config.CHECKPOINT_INTERVAL_MS,
      ...DEFAULT_SCHEDULER_TIMING,
      ...deps.schedulerTiming,
    },
  });
  const sessions = createSessionStore(db, config.SESSION_DAYS, config.PUBLIC_URL);
  const auth = createAuthService(db, sessions);
  const members = createMembersService(db);
  const tokens = createTokensService(db);
  const tables = createOccurrenceTablesService(db);
  const scenarios = createScenariosService(db, (departmentId, tableId) => tables.exists(departmentId, tableId));
  const samples = createSamplesService(db);
  const mailer = createMailer(config, logger);
  const billing = createBillingService({ db, config, payments: createPaymentGateway(config), mailer, logger });
  const runNotices = createRunNotices({ db, config, mailer });
  const account = createAccountService({ db, config, mailer, sessions, logger });
  const signUp = createSignUpService({ db, config, mailer, auth, logger });
  const settings = createSettingsService({ db, config, mailer, sessions });
  const invitations = createInvitationsService({ db, config, mailer, sessions, logger });
  const runs = createRunsService({ db, scheduler, scenarios, tables, samples, billing: deps.billing ?? billing.runBilling });
  const sweeps = createSweepsService({ db, runs, scenarios, samples, scheduler });
  const constraintSets = createConstraintSetsService(db);
  const fitsService = createFitsService({ db, runs, scenarios, constraintSets, scheduler, logger });
  const implied = createImpliedService({ runs, fits: fitsService, samples, scenarios });
  const exports = createExportsService({ db, config, runs, sweeps });
  const shares = createSharesService({ db, config, runs, sweeps, exports });

  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.TRUST_PROXY);
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          'script-src': ["'self'"],
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'connect-src': ["'self'"],
          'upgrade-insecure-requests': config.PUBLIC_URL?.startsWith('https:') ? [] : null,
        },
      },
      strictTransportSecurity: config.PUBLIC_URL?.startsWith('https:') ?? false,
    }),
  );
  app.use(pinoHttp({ logger, serializers: { err: serializeError }, autoLogging: { ignore: (req) => req.url === '/api/health' } }));
  app.use(hostCheck(allowedHosts(config)));

  // The payment webhook is verified on its exact bytes: it gets the raw body, before the JSON parser.
  app.use(WEBHOOK_PATH, express.raw({ type: 'application/json', limit: '1mb' }));
  app.use('/api', express.json({ limit: config.JSON_BODY_LIMIT }));
  app.use('/api', originCheck([WEBHOOK_PATH.slice('/api'.length)]));
  // Health answers every caller alike, also when the database (and so every session) is unreachable.
  app.use('/api', healthRoutes(registry, db));
  app.use('/api', authenticate(db, sessions, tokens.resolver()));

  app.use('/api', authRoutes(registry, config, auth, sessions));
  app.use('/api', signUpRoutes(registry, config, signUp, sessions));
  app.use('/api/members', membersRoutes(registry, members));
  app.use('/api/tokens', tokensRoutes(registry, tokens));
  app.use('/api/scenarios', scenariosRoutes(registry, scenarios));
  app.use('/api/occurrence-tables', occurrenceTablesRoutes(registry, tables));
  app.use('/api/samples', samplesRoutes(registry, samples));
  app.use('/api', runsRoutes(registry, runs, events));
  app.use('/api/sweeps', sweepsRoutes(registry, sweeps));
  app.use('/api/fits', fitsRoutes(registry, fitsService));
  app.use('/api', impliedRoutes(registry, implied));
  app.use('/api', constraintsRoutes(registry, constraintSets, runs));
  app.use('/api', exportsRoutes(registry, exports));
  app.use('/api', sharesRoutes(registry, config, shares));
  app.use('/api', accountRoutes(registry, config, account));
  app.use('/api', settingsRoutes(registry, settings, sessions));
  app.use('/api/invitations', invitationsRoutes(registry, config, invitations, sessions));
  app.use('/api/billing', billingRoutes(registry, billing));
  app.use('/api', outboxRoutes(registry, config, logger));
  app.use('/api', workersRoutes(registry, executor));
  app.use('/api', openApiRoutes(registry));
  app.use('/api', apiNotFound);

  const clientDir = path.resolve(config.CLIENT_DIST);
  if (existsSync(path.join(clientDir, 'index.html'))) {
    app.use(express.static(clientDir, { index: false, maxAge: '1h' }));
    // Every non-API path is a client route: answer with the app shell.
    app.get('/{*splat}', (_req, res) => res.sendFile(path.join(clientDir, 'index.html')));
  }

  app.use(errorHandler(logger));
  return {
    app,
    registry,
    scheduler,
    billing,
    async close() {
      await scheduler.stop();
      if (!deps.executor) await executor.close();
      if (ownPool && pool) await pool.destroy();
      mailer.close();
    },
  };
}
