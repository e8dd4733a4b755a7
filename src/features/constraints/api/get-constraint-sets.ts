import { queryOptions, useQuery } from '@tanstack/react-query';
import { constraintSetListResponseSchema } from '../../../../shared/contracts/constraints.ts';
import { api } from '../../../lib/api-client.ts';

/** The department's constraint sets, the library first (id "library"). */
export function getConstraintSets(signal?: AbortSignal) {
  return api.get('/api/constraint-sets', { schema: constraintSetListResponseSchema, signal });
}

/** Every query of this feature sits under this key, so one invalidation refreshes lists and evaluations. */
export const constraintsKey = (departmentId: string) => ['constraints', departmentId] as const;

export const getConstraintSetsQueryOptions = (departmentId: string) =>
  queryOptions({ queryKey: [...constraintsKey(departmentId), 'sets'], queryFn: ({ signal }) => getConstraintSets(signal) });

export function useConstraintSets(departmentId: string) {
  return useQuery(getConstraintSetsQueryOptions(departmentId));
}
