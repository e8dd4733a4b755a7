import { z } from 'zod';
import { DEFAULT_FREE_SYSTEMS_PER_MONTH } from '../shared/contracts/pricing.ts';

/**
 * The server's configuration, parsed from the environment once at start-up. Nothing else in
 * the server reads process.env. A bad value stops the start with a list of every problem.
 */
const port = (fallback: number) => z.coerce.number().int().min(1).max(65535).default(fallback);
const bool = (fallback: boolean) =>
  z
    .enum(['1', '0', 'true', 'false', 'yes', 'no'])
    .default(fallback ? 'true' : 'false')
    .transform((v) => v === '1' || v === 'true' || v === 'yes');

export const configSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  /** Where the app listens. */
  HOST: z.string().default('127.0.0.1'),
  PORT: port(3000),
  /** The address users reach the app at; https here makes session cookies Secure. */
  PUBLIC_URL: z.url().optional(),
  /** Express `trust proxy` (set when running behind a TLS-terminating proxy). */
  TRUST_PROXY: bool(false),
  DB_HOST: z.string().default('127.0.0.1'),
  DB_PORT: port(3407),
  DB_USER: z.string().default('tidefield'),
  DB_PASSWORD: z.string().default(''),
  DB_NAME: z.string().regex(/^[A-Za-z0-9_]+$/).default('tidefield'),
  /** Sessions last this long and are renewed when used in their second half (lucia). */
  SESSION_DAYS: z.coerce.number().min(0.0001).max(365).default(30),
  /** Sign-in attempts allowed per client address and e-mail in each window. */
  SIGN_IN_LIMIT: z.coerce.number().int().min(1).max(10_000).default(10),
  SIGN_IN_WINDOW_MINUTES: z.coerce.number().min(0.01).max(24 * 60).default(15),
  /** Largest JSON body accepted by the API. */
  JSON_BODY_LIMIT: z.string().regex(/^\d+(b|kb|mb)$/i).default('256kb'),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  /** Folder with the built client (served in production). */
  CLIENT_DIST: z.string().default('dist/client'),
  DEMO_PASSWORD: z.string().min(10).default('tidefield-demo'),
  /** Worker threads of the engine pool (default: one per core). */
  WORKER_THREADS: z.coerce.number().int().min(1).max(256).optional(),
  /** Runs executing at once over all departments, and per department. */
  RUNS_MAX_CONCURRENT: z.coerce.number().int().min(1).max(64).default(2),
  RUNS_PER_DEPARTMENT: z.coerce.number().int().min(1).max(64).default(2),
  /** Shortest time between two checkpoints of a run's running totals. */
  CHECKPOINT_INTERVAL_MS: z.coerce.number().int().min(10).max(600_000).default(1000),
  /**
   * Scale-out: with a Redis URL, runs' chunks become BullMQ jobs for `npm run worker` processes
   * (redis://[:password@]host:port, or rediss:// for TLS); absent, the app's own worker threads compute.
   */
  REDIS_URL: z.string().regex(/^rediss?:\/\/.+/, { error: 'REDIS_URL must start with redis:// or rediss:// (TLS)' }).optional(),
  /** The BullMQ queue (workers' TIDEFIELD_QUEUE must match); several deployments may share one Redis. */
  REDIS_QUEUE: z.string().regex(/^[A-Za-z0-9_.-]+$/).default('tidefield-chunks'),
  /** Chunks (of 65,536 systems) per BullMQ job. */
  REDIS_BATCH_CHUNKS: z.coerce.number().int().min(1).max(1024).default(8),
  /** Jobs of one run queued or running in Redis at once. */
  REDIS_JOBS_PER_RUN: z.coerce.number().int().min(1).max(10_000).default(64),

  // Payments through the stripe SDK. The defaults point at the local stand-in (server/fakes),
  // which `npm start` runs beside the app; the hosted service is host api.stripe.com, port 443,
  // protocol https, with that account's secret key and webhook signing secret.
  STRIPE_SECRET_KEY: z.string().min(1).default('sk_test_tidefield_local'),
  STRIPE_WEBHOOK_SECRET: z.string().min(1).default('whsec_tidefield_local'),
  STRIPE_API_HOST: z.string().min(1).default('127.0.0.1'),
  STRIPE_API_PORT: port(3101),
  STRIPE_API_PROTOCOL: z.enum(['http', 'https']).default('http'),
  // E-mail through nodemailer over SMTP; the default is the local stand-in (server/fakes).
  SMTP_HOST: z.string().min(1).default('127.0.0.1'),
  SMTP_PORT: port(2525),
  /** Implicit TLS (port 465); otherwise STARTTLS is used whenever the server offers it. */
  SMTP_SECURE: bool(false),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().min(3).default('Tidefield <no-reply@tidefield.localhost>'),
  /** The local SMTP stand-in's message list, shown to admins as the development outbox; empty turns it off. */
  DEV_OUTBOX_URL: z.union([z.url(), z.literal('')]).default('http://127.0.0.1:2526'),
  /** Systems each department may run free each month before credit is used (shared/contracts/pricing.ts). */
  FREE_SYSTEMS_PER_MONTH: z.coerce.number().int().min(0).max(1e13).default(DEFAULT_FREE_SYSTEMS_PER_MONTH),
});

export type Config = z.output<typeof configSchema>;

export function loadConfig(env: Record<string, string | undefined> = process.env): Config {
  const parsed = configSchema.safeParse(env);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`).join('\n');
    throw new Error(`Invalid configuration:\n${problems}`);
  }
  return parsed.data;
}

/** A configuration for tests: defaults plus overrides, never read from the environment. */
export function testConfig(overrides: Partial<Config> = {}): Config {
  return { ...configSchema.parse({ NODE_ENV: 'test', LOG_LEVEL: 'silent' }), ...overrides };
}

/** The address links in e-mails and payment redirects point at: PUBLIC_URL, else this server's own. */
export function publicBaseUrl(config: Pick<Config, 'PUBLIC_URL' | 'HOST' | 'PORT'>): string {
  if (config.PUBLIC_URL) return config.PUBLIC_URL.replace(/\/+$/, '');
  const host = config.HOST === '0.0.0.0' || config.HOST === '::' ? '127.0.0.1' : config.HOST;
  return `http://${host.includes(':') ? `[${host}]` : host}:${config.PORT}`;
}
