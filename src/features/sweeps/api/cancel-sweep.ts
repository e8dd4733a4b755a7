import { useMutation, useQueryClient } from '@tanstack/react-query';
import { sweepSummarySchema } from '../../../../shared/contracts/sweeps.ts';
import { api } from '../../../lib/api-client.ts';
import { sweepsKey } from './get-sweeps.ts';

/** Cancels every point that has not finished; finished points keep their results. */
export function cancelSweep(id: string) {
  return api.post(`/api/sweeps/${encodeURIComponent(id)}/cancel`, { schema: sweepSummarySchema });
}

export function useCancelSweep(departmentId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: cancelSweep,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: sweepsKey(departmentId) }),
  });
}
