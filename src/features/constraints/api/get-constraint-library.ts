import { queryOptions, useQuery } from '@tanstack/react-query';
import { constraintLibraryResponseSchema } from '../../../../shared/contracts/constraints.ts';
import { api } from '../../../lib/api-client.ts';
import { constraintsKey } from './get-constraint-sets.ts';

/** The read-only library of published constraints, each with its citation. */
export function getConstraintLibrary(signal?: AbortSignal) {
  return api.get('/api/constraint-library', { schema: constraintLibraryResponseSchema, signal });
}

export const getConstraintLibraryQueryOptions = (departmentId: string) =>
  queryOptions({ queryKey: [...constraintsKey(departmentId), 'library'], queryFn: ({ signal }) => getConstraintLibrary(signal), staleTime: Infinity });

export function useConstraintLibrary(departmentId: string) {
  return useQuery(getConstraintLibraryQueryOptions(departmentId));
}
