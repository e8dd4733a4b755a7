import { useMutation, useQueryClient } from '@tanstack/react-query';
import { fitSummarySchema } from '../../../../shared/contracts/fits.ts';
import { api } from '../../../lib/api-client.ts';
import { fitsKey } from './get-fits.ts';

/** Cancels a queued or running fit; 409 once it has finished, 403 for someone else's fit unless a modeller. */
export function cancelFit(id: string) {
  return api.post(`/api/fits/${encodeURIComponent(id)}/cancel`, { schema: fitSummarySchema });
}

/** Every query under the department's fits key (list, detail, an implied-occurrence question) is asked again. */
export function useCancelFit(departmentId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: cancelFit,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: fitsKey(departmentId) }),
  });
}
