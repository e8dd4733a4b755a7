import { queryOptions, useQuery } from '@tanstack/react-query';
import { sampleListResponseSchema } from '../../../shared/contracts/samples.ts';
import { scenarioDetailSchema, scenarioListResponseSchema } from '../../../shared/contracts/scenarios-api.ts';
import { api } from '../api-client.ts';

/*
 * The department's scenarios and samples as choices for the pages that start work from them
 * (runs, sweeps, implied occurrence). One query key each, so the pages share one cached answer;
 * the keys sit under ['scenarios', department] and ['samples', department], so a feature that
 * changes scenarios or samples refreshes these too when it invalidates its own prefix.
 */

export const scenarioChoicesQueryOptions = (departmentId: string) =>
  queryOptions({
    queryKey: ['scenarios', departmentId, 'choices'],
    queryFn: ({ signal }) => api.get('/api/scenarios', { schema: scenarioListResponseSchema, signal }),
  });

export function useScenarioChoices(departmentId: string) {
  return useQuery(scenarioChoicesQueryOptions(departmentId));
}

/** One scenario with its resolved document (defaults filled in): systems, seed, rows, sweepable values. */
export const scenarioChoiceQueryOptions = (departmentId: string, id: string) =>
  queryOptions({
    queryKey: ['scenarios', departmentId, 'choice', id],
    queryFn: ({ signal }) => api.get(`/api/scenarios/${encodeURIComponent(id)}`, { schema: scenarioDetailSchema, signal }),
  });

/** Not asked until a scenario is chosen. */
export function useScenarioChoice(departmentId: string, id: string | null) {
  return useQuery({ ...scenarioChoiceQueryOptions(departmentId, id ?? ''), enabled: Boolean(id) });
}

/** The department's observed samples and the library of published constraints. */
export const sampleChoicesQueryOptions = (departmentId: string) =>
  queryOptions({
    queryKey: ['samples', departmentId, 'choices'],
    queryFn: ({ signal }) => api.get('/api/samples', { schema: sampleListResponseSchema, signal }),
  });

export function useSampleChoices(departmentId: string) {
  return useQuery(sampleChoicesQueryOptions(departmentId));
}
