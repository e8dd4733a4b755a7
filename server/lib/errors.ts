/**
 * Typed application errors. Every module declares its own factories on top of these; the
 * error middleware turns them into `{ error: { code, message, field? } }` with `status`.
 * `expose` is false for errors whose message must not reach the client (they become a
 * generic 500 and are logged).
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

  constructor(options: {
    code: string;
    status: number;
    message: string;
    field?: string;
    expose?: boolean;
    cause?: unknown;
    headers?: Record<string, string>;
    details?: { line: number; column?: string; message: string }[];
  }) {
    super(options.message, { cause: options.cause });
    this.code = options.code;
    this.status = options.status;
    this.field = options.field;
    this.expose = options.expose ?? options.status < 500;
    this.headers = options.headers;
    this.details = options.details;
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
