import { z } from 'zod';

/** One compute worker: the app's own pool (embedded mode) or an `npm run worker` process (Redis mode). */
export const workerStatusSchema = z.object({
  id: z.string(),
  host: z.string(),
  pid: z.number().int(),
  threads: z.number().int(),
  /** Jobs (batches of chunks) finished since the worker started. */
  jobsDone: z.number().int(),
  activeJobs: z.number().int(),
  startedAt: z.string(),
  lastSeenAt: z.string(),
});
export type WorkerStatus = z.infer<typeof workerStatusSchema>;

export const workersResponseSchema = z.object({
  /** embedded: the app's own worker threads; redis: BullMQ workers over REDIS_URL. */
  mode: z.enum(['embedded', 'redis']),
  workers: z.array(workerStatusSchema),
});
export type WorkersResponse = z.infer<typeof workersResponseSchema>;
