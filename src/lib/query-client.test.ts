import { describe, expect, it, vi } from 'vitest';
import { ApiError } from './api-client.ts';
import { createQueryClient, shouldRetry } from './query-client.ts';

const apiError = (status: number) => new ApiError({ status, code: `http_${status}`, message: 'x' });

describe('query client', () => {
  it('retries network failures and 5xx at most twice, never a 4xx', () => {
    expect(shouldRetry(0, apiError(0))).toBe(true);
    expect(shouldRetry(1, apiError(503))).toBe(true);
    expect(shouldRetry(2, apiError(503))).toBe(false);
    expect(shouldRetry(0, apiError(400))).toBe(false);
    expect(shouldRetry(0, apiError(409))).toBe(false);
    expect(shouldRetry(0, new Error('boom'))).toBe(true);
  });

  it('calls onUnauthorized when a query fails with 401', async () => {
    const onUnauthorized = vi.fn();
    const client = createQueryClient({ onUnauthorized });
    await client
      .fetchQuery({ queryKey: ['x'], queryFn: () => Promise.reject(apiError(401)), retry: false })
      .catch(() => undefined);
    await client
      .fetchQuery({ queryKey: ['y'], queryFn: () => Promise.reject(apiError(404)), retry: false })
      .catch(() => undefined);
    expect(onUnauthorized).toHaveBeenCalledTimes(1);
  });
});
