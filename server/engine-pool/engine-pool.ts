import { availableParallelism } from 'node:os';
import { extname } from 'node:path';
import { fileURLToPath } from 'node:url';
import { Piscina } from 'piscina';

/**
 * The pool's task module. Run from source (this file is .ts under tsx or vitest), workers load
 * chunk-task-source.mjs, which imports chunk-task.ts through tsx's API; compiled, chunk-task.js.
 */
const TASK_FILE = new URL(extname(fileURLToPath(import.meta.url)) === '.ts' ? './chunk-task-source.mjs' : './chunk-task.js', import.meta.url).href;

/** Worker threads to use when the caller does not say: one per core. */
export function defaultWorkerCount(): number {
  return Math.max(1, availableParallelism());
}

/** A piscina pool of engine workers, one thread per worker, kept alive while idle for 30 s. */
export function createEnginePool(options: { workers?: number; filename?: string } = {}): Piscina {
  const threads = options.workers ?? defaultWorkerCount();
  const pool = new Piscina({
    filename: options.filename ?? TASK_FILE,
    minThreads: threads,
    maxThreads: threads,
    idleTimeout: 30_000,
    // The kernel's only garbage is short-lived (per-chunk tallies, boxed doubles): a small young
    // generation keeps each worker's resident memory flat as a run grows (measured: 1e6 → 3e7
    // systems adds ~6 MB with 4 MB, ~23 MB with V8's default) at no measurable cost in speed.
    resourceLimits: { maxYoungGenerationSizeMb: 4 },
  });
  // Aborting a task that a thread is already running (a cancelled run, the rest of a failed one) can
  // cross the thread's reply: piscina then emits 'error' for a reply to a task it no longer holds,
  // which with no listener is an uncaught exception. That reply is expected and carries nothing
  // anyone waits for; any other pool error still reaches the executors' listeners, or is thrown.
  pool.on('error', (error: unknown) => {
    if (error instanceof Error && error.message.startsWith('Unexpected message from Worker')) return;
    if (pool.listenerCount('error') === 1) throw error;
  });
  return pool;
}
