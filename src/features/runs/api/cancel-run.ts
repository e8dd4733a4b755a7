import { useMutation, useQueryClient } from '@tanstack/react-query';
import { runSummarySchema } from '../../../../shared/contracts/runs.ts';
import { api } from '../../../lib/api-client.ts';
import { getRunQueryOptions } from './get-run.ts';
import { runListKey } from './get-runs.ts';

/** 409 when the run has already finished; 403 for someone else's run unless a modeller. */
export function cancelRun(id: string) {
  return api.post(`/api/runs/${encodeURIComponent(id)}/cancel`, { schema: runSummarySchema });
}

export function useCancelRun(departmentId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: cancelRun,
    onSuccess: (run) => {
      queryClient.setQueryData(getRunQueryOptions(departmentId, run.id).queryKey, run);
      return queryClient.invalidateQueries({ queryKey: runListKey(departmentId) });
    },
  });
}
