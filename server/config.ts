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
  /** The address users reach the app at (links in e-mails); https here makes session cookies Secure. */
  PUBLIC_URL: z.url().optional(),
  /** Express `trust proxy`: believe X-Forwarded-For/-Proto/-Host (set only behind a proxy that writes them). */
  TRUST_PROXY: bool(false),
  /** Host names the server answers to, comma-separated (`*`: any); default the PUBLIC_URL host plus 127.0.0.1 and localhost. */
  ALLOWED_HOSTS: z.string().optional(),
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
  /** Share links a member may create per hour, and reads of shared objects per client address per minute. */
  SHARE_LINKS_PER_HOUR: z.coerce.number().int().min(1).max(10_000).default(30),
  SHARED_READS_PER_MINUTE: z.coerce.number().int().min(1).max(100_000).default(120),
  /** Failed sign-ins per client address over all e-mails in each window (password spraying). */
  SIGN_IN_CLIENT_LIMIT: z.coerce.number().int().min(1).max(100_000).default(50),
  /** Sign-ups per client address per hour (each address may also sign up at most 3 times an hour). */
  SIGN_UP_LIMIT: z.coerce.number().int().min(1).max(100_000).default(20),
  /** Invitations a department may send per hour (each invited address gets at most 3 an hour). */
  INVITATION_LIMIT: z.coerce.number().int().min(1).max(100_000).default(50),
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

/** The documented secrets of the local payment stand-in: anyone can read them, so they never sign real money. */
export const LOCAL_STRIPE_SECRETS = { STRIPE_SECRET_KEY: 'sk_test_tidefield_local', STRIPE_WEBHOOK_SECRET: 'whsec_tidefield_local' } as const;

/**
 * Problems of a configuration that points at hosted services: with a payment host other than
 * this machine, the local default secrets (or none) would let anyone sign a completed
 * checkout and mint credit, so each one that is missing or default is named.
 */
export function hostedConfigProblems(config: Config, env: Record<string, string | undefined>): string[] {
  if (isLoopback(config.STRIPE_API_HOST)) return [];
  return (Object.keys(LOCAL_STRIPE_SECRETS) as (keyof typeof LOCAL_STRIPE_SECRETS)[])
    .filter((name) => !env[name] || config[name] === LOCAL_STRIPE_SECRETS[name])
    .map(
      (name) =>
        `${name}: the payment service at ${config.STRIPE_API_HOST} is not this machine, so the local default (or a missing value) cannot be used; set ${name} to that account's own secret`,
    );
}

/**
 * The local demo: the app, payments and e-mail all on this machine with the local stand-ins,
 * as `npm start` runs by default. Only then are demo accounts with the published password seeded.
 */
export function isLocalDemo(config: Pick<Config, 'HOST' | 'STRIPE_API_HOST' | 'STRIPE_API_PROTOCOL' | 'SMTP_HOST'>): boolean {
  return isLoopback(config.HOST) && isLoopback(config.STRIPE_API_HOST) && config.STRIPE_API_PROTOCOL === 'http' && isLoopback(config.SMTP_HOST);
}

export function loadConfig(env: Record<string, string | undefined> = process.env): Config {
  const parsed = configSchema.safeParse(env);
  const problems = parsed.success
    ? hostedConfigProblems(parsed.data, env)
    : parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
  if (!parsed.success || problems.length > 0) throw new Error(`Invalid configuration:\n${problems.map((p) => `  ${p}`).join('\n')}`);
  return parsed.data;
}

/** A configuration for tests: defaults plus overrides, never read from the environment. */
export function testConfig(overrides: Partial<Config> = {}): Config {
  return { ...configSchema.parse({ NODE_ENV: 'test', LOG_LEVEL: 'silent' }), ...overrides };
}

const LOOPBACK = new Set(['127.0.0.1', 'localhost', '::1', '[::1]']);
/** Whether a host name or address is this machine (where the local stand-ins run). */
export const isLoopback = (host: string) => LOOPBACK.has(host.toLowerCase()) || host.startsWith('127.');

/**
 * The development outbox's address, or null when it is off: it is on only while e-mail goes to
 * the local SMTP stand-in and DEV_OUTBOX_URL names that stand-in on this machine.
 */
export function devOutboxUrl(config: Pick<Config, 'SMTP_HOST' | 'DEV_OUTBOX_URL'>): string | null {
  if (!config.DEV_OUTBOX_URL || !isLoopback(config.SMTP_HOST)) return null;
  return isLoopback(new URL(config.DEV_OUTBOX_URL).hostname) ? config.DEV_OUTBOX_URL.replace(/\/+$/, '') : null;
}

/** The address links in e-mails and payment redirects point at: PUBLIC_URL, else this server's own. */
export function publicBaseUrl(config: Pick<Config, 'PUBLIC_URL' | 'HOST' | 'PORT'>): string {
  if (config.PUBLIC_URL) return config.PUBLIC_URL.replace(/\/+$/, '');
  const host = config.HOST === '0.0.0.0' || config.HOST === '::' ? '127.0.0.1' : config.HOST;
  return `http://${host.includes(':') ? `[${host}]` : host}:${config.PORT}`;
}
