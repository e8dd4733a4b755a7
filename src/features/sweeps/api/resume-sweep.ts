import { useMutation, useQueryClient } from '@tanstack/react-query';
import { sweepSummarySchema } from '../../../../shared/contracts/sweeps.ts';
import { api } from '../../../lib/api-client.ts';
import { sweepsKey } from './get-sweeps.ts';

/** Continues a failed sweep from the chunks its job computed; 409 when it cannot be resumed. */
export function resumeSweep(id: string) {
  return api.post(`/api/sweeps/${encodeURIComponent(id)}/resume`, { schema: sweepSummarySchema });
}

export function useResumeSweep(departmentId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: resumeSweep,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: sweepsKey(departmentId) }),
  });
}
