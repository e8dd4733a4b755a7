import { queryOptions, useQuery } from '@tanstack/react-query';
import { ApiError, errorFromResponse } from '../../../lib/api-client.ts';

/**
 * The methods paragraph is plain text (text/plain), which the JSON API client does not read;
 * this fetch keeps its conventions: same-origin cookies and the server's error body as an ApiError.
 */
export async function getRunMethods(id: string, signal?: AbortSignal): Promise<string> {
  let response: Response;
  try {
    response = await fetch(`/api/runs/${encodeURIComponent(id)}/methods.txt`, { credentials: 'same-origin', headers: { Accept: 'text/plain' }, signal });
  } catch (error) {
    if (signal?.aborted) throw error;
    throw new ApiError({ status: 0, code: 'network_error', message: 'Could not reach the Tidefield server. Check the connection and try again.' });
  }
  if (!response.ok) throw await errorFromResponse(response);
  return response.text();
}

export const getRunMethodsQueryOptions = (departmentId: string, id: string) =>
  queryOptions({
    queryKey: ['runs', departmentId, 'methods', id],
    queryFn: ({ signal }) => getRunMethods(id, signal),
    staleTime: Infinity,
  });

export function useRunMethods(departmentId: string, id: string, enabled: boolean) {
  return useQuery({ ...getRunMethodsQueryOptions(departmentId, id), enabled });
}
