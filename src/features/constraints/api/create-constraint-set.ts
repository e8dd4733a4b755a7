import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ConstraintSetBody } from '../../../../shared/contracts/constraints.ts';
import { idResponseSchema } from '../../../../shared/contracts/scenarios-api.ts';
import { api } from '../../../lib/api-client.ts';
import { constraintsKey } from './get-constraint-sets.ts';

/** 201 with the new set's id; 400 names the constraint and field ("constraints.0.csv", with line/column details for CSV). */
export function createConstraintSet(body: ConstraintSetBody) {
  return api.post('/api/constraint-sets', { body, schema: idResponseSchema });
}

export function useCreateConstraintSet(departmentId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createConstraintSet,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: constraintsKey(departmentId) }),
  });
}
