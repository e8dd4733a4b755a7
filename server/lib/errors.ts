/**
 * Typed application errors. Every module declares its own factories on top of these; the
 * error middleware turns them into `{ error: { code, message, field?, details?, issues? } }` with `status`.
 * `expose` is false for errors whose message must not reach the client (they become a
 * generic 500 and are logged); 4xx, 502 and 503 are exposed unless said otherwise.
 */
export class AppError extends Error {
  override readonly name = 'AppError';
  readonly code: string;
  readonly status: number;
  readonly field: string | undefined;
  readonly expose: boolean;
  readonly headers: Record<string, string> | undefined;
  /** Row-level problems (uploads): listed in the error body as `details`. */
  readonly details: { line: number; column?: string; message: string }[] | undefined;
  /** Every problem of a document at once, each naming its field (the first is also `field` and `message`). */
  readonly issues: { field: string; message: string }[] | undefined;

  constructor(options: {
    code: string;
    status: number;
    message: string;
    field?: string;
    expose?: boolean;
    cause?: unknown;
    headers?: Record<string, string>;
    details?: { line: number; column?: string; message: string }[];
    issues?: { field: string; message: string }[];
  }) {
    super(options.message, { cause: options.cause });
    this.code = options.code;
    this.status = options.status;
    this.field = options.field;
    // 502 and 503 carry messages written for users (a stand-in or the database is down); other 5xx stay generic.
    this.expose = options.expose ?? (options.status < 500 || options.status === 502 || options.status === 503);
    this.headers = options.headers;
    this.details = options.details;
    this.issues = options.issues;
  }
}

export const badRequest = (message: string, field?: string, code = 'invalid_input') =>
  new AppError({ code, status: 400, message, field });
export const unauthenticated = (message = 'Sign in to continue.') =>
  new AppError({ code: 'unauthenticated', status: 401, message });
export const forbidden = (message: string) => new AppError({ code: 'forbidden', status: 403, message });
export const notFound = (what: string) => new AppError({ code: 'not_found', status: 404, message: `${what} was not found.` });
export const conflict = (message: string, field?: string) => new AppError({ code: 'conflict', status: 409, message, field });
export const tooManyRequests = (message: string, retryAfterSeconds: number) =>
  new AppError({ code: 'rate_limited', status: 429, message, headers: { 'Retry-After': String(retryAfterSeconds) } });

/** MySQL/MariaDB duplicate-key error number (ER_DUP_ENTRY). */
export const ER_DUP_ENTRY = 1062;

export function isDuplicateKey(error: unknown): boolean {
  const e = error as { errno?: number; cause?: { errno?: number } } | null;
  return e?.errno === ER_DUP_ENTRY || e?.cause?.errno === ER_DUP_ENTRY;
}

/** Seconds a client is asked to wait (Retry-After) when the database cannot be reached. */
export const DATABASE_RETRY_AFTER_SECONDS = 5;

/** Error codes of the MariaDB driver (mysql2) and Node's sockets that mean "the database cannot be reached". */
const UNREACHABLE_CODES = new Set([
  'ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EHOSTUNREACH', 'ENOTFOUND', 'EPIPE',
  'PROTOCOL_CONNECTION_LOST', 'PROTOCOL_ENQUEUE_AFTER_FATAL_ERROR', 'PROTOCOL_SEQUENCE_TIMEOUT',
  'ER_SERVER_SHUTDOWN', 'ER_CON_COUNT_ERROR', 'ER_TOO_MANY_USER_CONNECTIONS', 'ER_LOCK_WAIT_TIMEOUT',
]);

/** Whether an error (or one of its causes) says the database is unreachable, not that a query was wrong. */
export function isDatabaseUnavailable(error: unknown): boolean {
  for (let e = error as { code?: unknown; cause?: unknown; fatal?: unknown } | null | undefined, depth = 0; e && depth < 6; e = e.cause as typeof e, depth++) {
    if (typeof e.code === 'string' && UNREACHABLE_CODES.has(e.code)) return true;
    if (e instanceof AggregateError && e.errors.some(isDatabaseUnavailable)) return true;
  }
  return false;
}

export const databaseUnavailable = (cause?: unknown) =>
  new AppError({
    code: 'database_unavailable',
    status: 503,
    message: `The database cannot be reached right now, so this request was not carried out. Try again in ${DATABASE_RETRY_AFTER_SECONDS} seconds.`,
    headers: { 'Retry-After': String(DATABASE_RETRY_AFTER_SECONDS) },
    cause,
  });
