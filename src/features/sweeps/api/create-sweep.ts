import { useMutation, useQueryClient } from '@tanstack/react-query';
import { idResponseSchema } from '../../../../shared/contracts/scenarios-api.ts';
import type { CreateSweepBody } from '../../../../shared/contracts/sweeps.ts';
import { api } from '../../../lib/api-client.ts';
import { sweepsKey } from './get-sweeps.ts';

/**
 * Queues one run per grid point, all with the same seed. 400 names the field at fault
 * ("axes[0].values[2]"), 402 when the credit does not cover every point, 403 for observers.
 */
export function createSweep(body: CreateSweepBody) {
  return api.post('/api/sweeps', { body, schema: idResponseSchema });
}

export function useCreateSweep(departmentId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createSweep,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: sweepsKey(departmentId) }),
  });
}
