import type { z } from 'zod';
import { ApiError, errorFromResponse } from '../../../lib/api-client.ts';

/**
 * A multipart POST of a CSV file with text fields. The shared API client speaks JSON only; this
 * keeps its conventions (same-origin cookie, typed ApiError from the error body, checked answer).
 */
export async function postCsvForm<T>(path: string, file: File, fields: Record<string, string>, schema: z.ZodType<T>): Promise<T> {
  const form = new FormData();
  for (const [key, value] of Object.entries(fields)) form.append(key, value);
  form.append('file', file, file.name);
  let response: Response;
  try {
    response = await fetch(path, { method: 'POST', body: form, credentials: 'same-origin', headers: { Accept: 'application/json' } });
  } catch {
    throw new ApiError({ status: 0, code: 'network_error', message: 'Could not reach the Tidefield server. Check the connection and try again.' });
  }
  if (!response.ok) throw await errorFromResponse(response);
  const checked = schema.safeParse(await response.json().catch(() => undefined));
  if (!checked.success) throw new ApiError({ status: response.status, code: 'invalid_response', message: 'The server sent an answer this page cannot read. Reload the page and try again.' });
  return checked.data;
}
