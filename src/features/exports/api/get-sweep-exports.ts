import { queryOptions, useQuery } from '@tanstack/react-query';
import { exportListingSchema } from '../../../../shared/contracts/exports.ts';
import { api } from '../../../lib/api-client.ts';

/** The tables a sweep exports (its curve), with columns and units; they grow as points finish. */
export function getSweepExports(id: string, signal?: AbortSignal) {
  return api.get(`/api/sweeps/${encodeURIComponent(id)}/export`, { schema: exportListingSchema, signal });
}

export const getSweepExportsQueryOptions = (departmentId: string, id: string) =>
  queryOptions({ queryKey: ['sweeps', departmentId, 'exports', id], queryFn: ({ signal }) => getSweepExports(id, signal) });

export function useSweepExports(departmentId: string, id: string) {
  return useQuery(getSweepExportsQueryOptions(departmentId, id));
}
