/**
 * `npm run worker`: a chunk worker for any machine. It needs only REDIS_URL (and this checkout's
 * engine); no database. It runs its own piscina pool (WORKER_THREADS, default one per core),
 * takes chunk jobs from the app's BullMQ queue, and on SIGTERM/SIGINT finishes the jobs in hand
 * and exits. A worker killed with SIGKILL loses only its unfinished jobs: BullMQ's stalled-job
 * check hands them to another worker.
 *
 *   REDIS_URL=redis://127.0.0.1:6479 npm run worker
 *
 * Optional: TIDEFIELD_QUEUE (default tidefield-chunks, must match the app's REDIS_QUEUE),
 * WORKER_LOCK_MS and WORKER_STALLED_INTERVAL_MS (BullMQ's lock and stalled-check intervals;
 * BullMQ's defaults 30 s each), WORKER_HEARTBEAT_MS (default 5000), LOG_LEVEL.
 */
import { z } from 'zod';
import { pino } from 'pino';
import { createEnginePool, defaultWorkerCount } from '../engine-pool/engine-pool.ts';
import { createChunkWorker } from './chunk-worker.ts';
import { DEFAULT_QUEUE } from './queue-names.ts';

const ms = z.coerce.number().int().min(100).max(3_600_000).optional();
const envSchema = z.object({
  REDIS_URL: z.string().regex(/^rediss?:\/\//, { error: 'REDIS_URL must start with redis:// or rediss:// (TLS)' }),
  TIDEFIELD_QUEUE: z.string().regex(/^[A-Za-z0-9_.-]+$/).default(DEFAULT_QUEUE),
  WORKER_THREADS: z.coerce.number().int().min(1).max(256).optional(),
  WORKER_LOCK_MS: ms,
  WORKER_STALLED_INTERVAL_MS: ms,
  WORKER_HEARTBEAT_MS: ms,
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
});

const parsed = envSchema.safeParse(process.env);
if (!parsed.success) {
  for (const issue of parsed.error.issues) console.error(`${issue.path.join('.')}: ${issue.message}`);
  process.exit(2);
}
const env = parsed.data;
const logger = pino({ level: env.LOG_LEVEL });
const pool = createEnginePool({ workers: env.WORKER_THREADS ?? defaultWorkerCount() });
const worker = createChunkWorker({
  url: env.REDIS_URL,
  queue: env.TIDEFIELD_QUEUE,
  pool,
  logger,
  heartbeatMs: env.WORKER_HEARTBEAT_MS,
  lockDurationMs: env.WORKER_LOCK_MS,
  stalledIntervalMs: env.WORKER_STALLED_INTERVAL_MS,
});

let stopping = false;
async function shutdown(signal: string) {
  if (stopping) return;
  stopping = true;
  logger.info({ signal }, 'finishing the jobs in hand, then exiting');
  await worker.close();
  await pool.destroy();
  process.exit(0);
}
process.on('SIGTERM', () => void shutdown('SIGTERM'));
process.on('SIGINT', () => void shutdown('SIGINT'));

await worker.start();
