import { useMutation, useQueryClient } from '@tanstack/react-query';
import { fitSummarySchema } from '../../../../shared/contracts/fits.ts';
import { api } from '../../../lib/api-client.ts';
import { fitsKey } from './get-fits.ts';

/** Continues a failed fit from the grid chunks it computed; 409 when it cannot be resumed. */
export function resumeFit(id: string) {
  return api.post(`/api/fits/${encodeURIComponent(id)}/resume`, { schema: fitSummarySchema });
}

export function useResumeFit(departmentId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: resumeFit,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: fitsKey(departmentId) }),
  });
}
