import { describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { ApiError, createApiClient, type FetchLike } from './api-client.ts';

/** A fake fetch that answers once with the given status, body and headers, and records the call. */
function fakeFetch(status: number, body?: unknown, headers: Record<string, string> = {}) {
  const text = body === undefined ? '' : typeof body === 'string' ? body : JSON.stringify(body);
  return vi.fn<FetchLike>(async () => new Response(status === 204 ? null : text, { status, headers }));
}

async function failure(promise: Promise<unknown>): Promise<ApiError> {
  const error = await promise.then(
    () => null,
    (e: unknown) => e,
  );
  expect(error).toBeInstanceOf(ApiError);
  return error as ApiError;
}

describe('api client: requests', () => {
  it('sends JSON with same-origin cookies and parses the answer with the schema', async () => {
    const fetch = fakeFetch(200, { id: 'u1', extra: true });
    const api = createApiClient(fetch);
    const data = await api.post('/api/things', { body: { a: 1 }, schema: z.object({ id: z.string() }) });

    expect(data).toEqual({ id: 'u1' });
    const [url, init] = fetch.mock.calls[0];
    expect(url).toBe('/api/things');
    expect(init).toMatchObject({ method: 'POST', credentials: 'same-origin', body: '{"a":1}' });
    expect(init.headers).toEqual({ Accept: 'application/json', 'Content-Type': 'application/json' });
  });

  it('sends no body or Content-Type on a GET, and returns undefined for 204', async () => {
    const get = fakeFetch(200, { ok: true });
    await createApiClient(get).get('/api/me');
    expect(get.mock.calls[0][1]).toMatchObject({ method: 'GET', body: undefined, headers: { Accept: 'application/json' } });

    await expect(createApiClient(fakeFetch(204)).delete('/api/members/u2')).resolves.toBeUndefined();
  });
});

describe('api client: error parsing', () => {
  it('turns the contract error body into an ApiError with status, code, field and message', async () => {
    const api = createApiClient(
      fakeFetch(400, { error: { code: 'invalid_input', message: 'password must be at least 10 characters', field: 'password' } }),
    );
    const error = await failure(api.post('/api/auth/sign-up', { body: {} }));
    expect(error).toMatchObject({
      status: 400,
      code: 'invalid_input',
      field: 'password',
      message: 'password must be at least 10 characters',
    });
  });

  it('keeps the 409 message for the page to show', async () => {
    const api = createApiClient(fakeFetch(409, { error: { code: 'conflict', message: 'The department must keep at least one admin.' } }));
    const error = await failure(api.patch('/api/members/u1', { body: { role: 'observer' } }));
    expect(error.status).toBe(409);
    expect(error.field).toBeUndefined();
    expect(error.message).toBe('The department must keep at least one admin.');
  });

  it('reads Retry-After on a 429', async () => {
    const api = createApiClient(
      fakeFetch(429, { error: { code: 'rate_limited', message: 'Try again in 15 minutes.' } }, { 'Retry-After': '900' }),
    );
    const error = await failure(api.post('/api/auth/sign-in', { body: {} }));
    expect(error).toMatchObject({ status: 429, code: 'rate_limited', retryAfterSeconds: 900, message: 'Try again in 15 minutes.' });
  });

  it('carries the row-level details of an upload error', async () => {
    const details = [{ line: 3, column: 'fraction', message: 'fraction must be at most 1' }];
    const api = createApiClient(fakeFetch(400, { error: { code: 'invalid_upload', message: 'The file has 1 problem.', details } }));
    expect((await failure(api.post('/api/occurrence-tables', { body: {} }))).details).toEqual(details);
  });

  it('falls back to a message by status when the body is not the contract shape', async () => {
    const html = await failure(createApiClient(fakeFetch(502, '<html>Bad gateway</html>')).get('/api/me'));
    expect(html).toMatchObject({ status: 502, code: 'http_502' });
    expect(html.message).toMatch(/not answering/);

    const odd = await failure(createApiClient(fakeFetch(403, { message: 'nope' })).get('/api/members'));
    expect(odd).toMatchObject({ status: 403, code: 'http_403', message: 'Your role does not allow this.' });
    expect(odd.body).toEqual({ message: 'nope' });

    const empty = await failure(createApiClient(fakeFetch(418)).get('/api/x'));
    expect(empty.message).toBe('The request failed (HTTP 418).');
  });

  it('reports an unreachable server as status 0, network_error', async () => {
    const api = createApiClient(async () => {
      throw new TypeError('Failed to fetch');
    });
    expect(await failure(api.get('/api/me'))).toMatchObject({ status: 0, code: 'network_error' });
  });

  it('lets a cancelled request reject with its AbortError, not an ApiError', async () => {
    const controller = new AbortController();
    const api = createApiClient(async (_url, init) => {
      controller.abort();
      throw init.signal?.reason;
    });
    const rejection = await api.get('/api/me', { signal: controller.signal }).catch((e: unknown) => e);
    expect(rejection).not.toBeInstanceOf(ApiError);
    expect((rejection as DOMException).name).toBe('AbortError');
  });

  it('rejects a success body that is not JSON or does not match the schema', async () => {
    const notJson = await failure(createApiClient(fakeFetch(200, 'hello')).get('/api/me'));
    expect(notJson).toMatchObject({ status: 200, code: 'invalid_response' });

    const wrongShape = await failure(createApiClient(fakeFetch(200, { id: 7 })).get('/api/me', { schema: z.object({ id: z.string() }) }));
    expect(wrongShape.code).toBe('invalid_response');
  });
});
