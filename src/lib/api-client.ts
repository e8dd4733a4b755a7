import { z } from 'zod';
import { apiErrorBodySchema, type ApiErrorBody } from '../../shared/contracts/api-error.ts';

export type ApiErrorDetail = NonNullable<ApiErrorBody['error']['details']>[number];
export interface ApiErrorIssue {
  field: string;
  message: string;
}

// Read beside the contract's body: a server that lists every problem of an input sends them as `error.issues`.
const errorIssuesSchema = z.object({ error: z.object({ issues: z.array(z.object({ field: z.string(), message: z.string() })) }) });

/** What every failed call throws: the server's error body, or one made up for the failure. */
export class ApiError extends Error {
  override readonly name = 'ApiError';
  /** HTTP status; 0 when the server could not be reached at all. */
  readonly status: number;
  readonly code: string;
  /** The input path at fault ("password"), when the server named one. */
  readonly field?: string;
  /** Row-level problems of an upload (file line, column, message). */
  readonly details?: readonly ApiErrorDetail[];
  /** Every problem of a rejected input, each at its field (the first is also `field`/`message`). */
  readonly issues?: readonly ApiErrorIssue[];
  /** From a Retry-After header in seconds (429, 503). */
  readonly retryAfterSeconds?: number;
  /** The parsed body of a failed response that was not of the error shape (a 503 health report). */
  readonly body?: unknown;

  constructor(options: {
    status: number;
    code: string;
    message: string;
    field?: string;
    details?: readonly ApiErrorDetail[];
    issues?: readonly ApiErrorIssue[];
    retryAfterSeconds?: number;
    body?: unknown;
  }) {
    super(options.message);
    this.status = options.status;
    this.code = options.code;
    this.field = options.field;
    this.details = options.details;
    this.issues = options.issues;
    this.retryAfterSeconds = options.retryAfterSeconds;
    this.body = options.body;
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

// Messages for failures that carry no error body of the contract's shape.
const NETWORK_MESSAGE = 'Could not reach the Tidefield server. Check the connection and try again.';
const UNAVAILABLE_MESSAGE = 'The Tidefield server is not answering right now. Try again in a minute.';
const UNREADABLE_MESSAGE = 'The server sent an answer this page cannot read. Reload the page; if that does not help, tell your department admin.';

function fallbackMessage(status: number): string {
  if (status === 401) return 'Please sign in again.';
  if (status === 403) return 'Your role does not allow this.';
  if (status === 404) return 'Not found.';
  if (status === 429) return 'Too many requests. Wait a moment and try again.';
  if (status >= 500) return UNAVAILABLE_MESSAGE;
  return `The request failed (HTTP ${status}).`;
}

/** Turns a failed response into an ApiError, whatever its body holds. */
export async function errorFromResponse(response: Response): Promise<ApiError> {
  const text = await response.text().catch(() => '');
  let body: unknown = undefined;
  try {
    body = text ? JSON.parse(text) : undefined;
  } catch {
    // Not JSON (a proxy's HTML page, say): fall through to the status message.
  }
  const retryAfter = Number(response.headers.get('Retry-After'));
  const retryAfterSeconds = Number.isFinite(retryAfter) && retryAfter > 0 ? retryAfter : undefined;
  const parsed = apiErrorBodySchema.safeParse(body);
  if (parsed.success) {
    const listed = errorIssuesSchema.safeParse(body);
    return new ApiError({ status: response.status, ...parsed.data.error, ...(listed.success ? { issues: listed.data.error.issues } : {}), retryAfterSeconds });
  }
  const status = response.status;
  return new ApiError({ status, code: `http_${status}`, message: fallbackMessage(status), retryAfterSeconds, body });
}

type Method = 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';

export interface RequestOptions<T> {
  /** JSON body; sent with Content-Type: application/json. */
  body?: unknown;
  /** Validates the success body; a mismatch is an ApiError with code "invalid_response". */
  schema?: z.ZodType<T>;
  signal?: AbortSignal;
}

export type FetchLike = (input: string, init: RequestInit) => Promise<Response>;

/** The one fetch wrapper: same-origin cookies, JSON both ways, typed errors. */
export function createApiClient(fetchImpl: FetchLike = (input, init) => fetch(input, init)) {
  async function request<T = void>(method: Method, path: string, options: RequestOptions<T> = {}): Promise<T> {
    const headers: Record<string, string> = { Accept: 'application/json' };
    if (options.body !== undefined) headers['Content-Type'] = 'application/json';

    let response: Response;
    try {
      response = await fetchImpl(path, {
        method,
        headers,
        credentials: 'same-origin',
        body: options.body === undefined ? undefined : JSON.stringify(options.body),
        signal: options.signal,
      });
    } catch (error) {
      // Cancellation is not a failure: let TanStack Query see the AbortError as is.
      if (options.signal?.aborted) throw error;
      throw new ApiError({ status: 0, code: 'network_error', message: NETWORK_MESSAGE });
    }

    if (!response.ok) throw await errorFromResponse(response);
    if (response.status === 204) return undefined as T;

    let data: unknown;
    try {
      data = await response.json();
    } catch {
      throw new ApiError({ status: response.status, code: 'invalid_response', message: UNREADABLE_MESSAGE });
    }
    if (!options.schema) return data as T;
    const checked = options.schema.safeParse(data);
    if (!checked.success) {
      throw new ApiError({ status: response.status, code: 'invalid_response', message: UNREADABLE_MESSAGE });
    }
    return checked.data;
  }

  return {
    get: <T>(path: string, options?: Omit<RequestOptions<T>, 'body'>) => request<T>('GET', path, options),
    post: <T = void>(path: string, options?: RequestOptions<T>) => request<T>('POST', path, options),
    patch: <T = void>(path: string, options?: RequestOptions<T>) => request<T>('PATCH', path, options),
    put: <T = void>(path: string, options?: RequestOptions<T>) => request<T>('PUT', path, options),
    delete: <T = void>(path: string, options?: RequestOptions<T>) => request<T>('DELETE', path, options),
  };
}

export type ApiClient = ReturnType<typeof createApiClient>;

export const api = createApiClient();
