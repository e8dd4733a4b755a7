import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api, isApiError } from '../../../lib/api-client.ts';

/**
 * The department's fits as the Overview lists them (`GET /api/fits`): only the fields it shows.
 * The fits feature owns the full contract; this reads the list loosely so that new fields there
 * do not break the Overview.
 */
const recentFitSchema = z.object({
  id: z.string(),
  status: z.string(),
  createdAt: z.string(),
  scenarioName: z.string(),
  constraintSetName: z.string().nullable().optional(),
  parameters: z.array(z.string()).default([]),
  progress: z.number().nullable().optional(),
});
const recentFitsSchema = z.object({ fits: z.array(recentFitSchema) });
export type RecentFit = z.infer<typeof recentFitSchema>;

/** The fits, or null where the server offers no fits (an older server answers 404): the section is then left out. */
export async function getRecentFits(signal?: AbortSignal): Promise<RecentFit[] | null> {
  try {
    const data = await api.get('/api/fits', { schema: recentFitsSchema, signal });
    return data.fits;
  } catch (error) {
    if (isApiError(error) && error.status === 404) return null;
    throw error;
  }
}

const isLive = (fit: RecentFit) => fit.status === 'queued' || fit.status === 'running';

export const getRecentFitsQueryOptions = (departmentId: string) =>
  queryOptions({
    queryKey: ['fits', departmentId, 'recent'],
    queryFn: ({ signal }) => getRecentFits(signal),
    refetchInterval: (query) => (query.state.data?.some(isLive) ? 5_000 : false),
  });

export function useRecentFits(departmentId: string) {
  return useQuery(getRecentFitsQueryOptions(departmentId));
}
