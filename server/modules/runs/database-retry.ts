/**
 * Retrying a write while the database is unreachable. A run that finishes while MariaDB is down
 * keeps its result in memory and saves it (and settles its credit) once the database is back.
 */

/** mysql2 error codes that mean "no usable connection", not "this statement is wrong". */
const CONNECTION_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EPIPE',
  'EHOSTUNREACH',
  'ENOTFOUND',
  'PROTOCOL_CONNECTION_LOST',
  'PROTOCOL_SEQUENCE_TIMEOUT',
  'ER_SERVER_SHUTDOWN',
  'ER_CON_COUNT_ERROR',
  'ER_CONNECTION_KILLED',
  'ER_LOCK_WAIT_TIMEOUT',
  'ER_LOCK_DEADLOCK',
]);

/** True when the error (or one of its causes, as drizzle wraps driver errors) is a lost or refused connection. */
export function isDatabaseUnavailable(error: unknown): boolean {
  for (let e: unknown = error, depth = 0; e && typeof e === 'object' && depth < 5; e = (e as { cause?: unknown }).cause, depth++) {
    const { code, fatal } = e as { code?: unknown; fatal?: unknown };
    if (fatal === true) return true;
    if (typeof code === 'string' && CONNECTION_CODES.has(code)) return true;
  }
  return false;
}

export interface BackoffOptions {
  /** First wait after a failure (doubled after each, up to maxDelayMs). */
  firstDelayMs: number;
  maxDelayMs: number;
  /** Stops the retrying (the scheduler is stopping): rejects with the signal's reason. */
  signal?: AbortSignal;
  onRetry?: (error: unknown, delayMs: number, attempt: number) => void;
}

function sleep(ms: number, signal?: AbortSignal): Promise<void> {
  return new Promise((resolve, reject) => {
    if (signal?.aborted) return reject(signal.reason);
    const timer = setTimeout(() => {
      signal?.removeEventListener('abort', onAbort);
      resolve();
    }, ms);
    const onAbort = () => {
      clearTimeout(timer);
      reject(signal?.reason);
    };
    signal?.addEventListener('abort', onAbort, { once: true });
  });
}

/**
 * Runs `work` until it succeeds, waiting with exponential back-off after each failure that is a
 * database outage; any other error is thrown at once. `work` must be idempotent (it may have
 * committed before the connection dropped).
 */
export async function retryWhileDatabaseDown<T>(work: () => Promise<T>, options: BackoffOptions): Promise<T> {
  let delay = options.firstDelayMs;
  for (let attempt = 1; ; attempt++) {
    try {
      return await work();
    } catch (error) {
      if (!isDatabaseUnavailable(error)) throw error;
      if (options.signal?.aborted) throw error;
      options.onRetry?.(error, delay, attempt);
      await sleep(delay, options.signal);
      delay = Math.min(options.maxDelayMs, delay * 2);
    }
  }
}
