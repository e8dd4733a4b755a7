import { queryOptions, useQuery } from '@tanstack/react-query';
import { exportListingSchema } from '../../../../shared/contracts/exports.ts';
import { api } from '../../../lib/api-client.ts';

/** The tables a finished run exports (ECSV, VOTable), with their columns and units. */
export function getRunExports(id: string, signal?: AbortSignal) {
  return api.get(`/api/runs/${encodeURIComponent(id)}/export`, { schema: exportListingSchema, signal });
}

export const getRunExportsQueryOptions = (departmentId: string, id: string) =>
  queryOptions({ queryKey: ['runs', departmentId, 'exports', id], queryFn: ({ signal }) => getRunExports(id, signal), staleTime: Infinity });

export function useRunExports(departmentId: string, id: string) {
  return useQuery(getRunExportsQueryOptions(departmentId, id));
}
