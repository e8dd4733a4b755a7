import { queryOptions, useQuery } from '@tanstack/react-query';
import { healthResponseSchema, type HealthResponse } from '../../../../shared/contracts/auth.ts';
import { api, isApiError } from '../../../lib/api-client.ts';

/**
 * The server's health report. A degraded server may answer it with a 5xx status; that report
 * is still the answer, so it is returned rather than thrown.
 */
export async function getHealth(signal?: AbortSignal): Promise<HealthResponse> {
  try {
    return await api.get('/api/health', { schema: healthResponseSchema, signal });
  } catch (error) {
    const report = isApiError(error) ? healthResponseSchema.safeParse(error.body) : null;
    if (report?.success) return report.data;
    throw error;
  }
}

export const getHealthQueryOptions = () =>
  queryOptions({
    queryKey: ['health'],
    queryFn: ({ signal }) => getHealth(signal),
    staleTime: 15_000,
    refetchInterval: 60_000,
  });

export function useHealth() {
  return useQuery(getHealthQueryOptions());
}
