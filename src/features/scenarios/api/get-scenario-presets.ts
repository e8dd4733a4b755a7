import { queryOptions, useQuery } from '@tanstack/react-query';
import { presetListResponseSchema } from '../../../../shared/contracts/scenarios-api.ts';
import { api } from '../../../lib/api-client.ts';

/** The example scenarios shipped with Tidefield (the same for every department). */
export function getScenarioPresets(signal?: AbortSignal) {
  return api.get('/api/scenarios/presets', { schema: presetListResponseSchema, signal });
}

// They change only with a new release of the server.
export const getScenarioPresetsQueryOptions = () =>
  queryOptions({ queryKey: ['scenario-presets'], queryFn: ({ signal }) => getScenarioPresets(signal), staleTime: Infinity });

export function useScenarioPresets() {
  return useQuery(getScenarioPresetsQueryOptions());
}
