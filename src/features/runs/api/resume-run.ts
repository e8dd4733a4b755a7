import { useMutation, useQueryClient } from '@tanstack/react-query';
import { idResponseSchema } from '../../../../shared/contracts/scenarios-api.ts';
import { api } from '../../../lib/api-client.ts';
import { runListKey } from './get-runs.ts';

/** Continues a failed run from the chunks it computed, as a new run; 409 when it kept none. */
export function resumeRun(id: string) {
  return api.post(`/api/runs/${encodeURIComponent(id)}/resume`, { schema: idResponseSchema });
}

export function useResumeRun(departmentId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: resumeRun,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: runListKey(departmentId) }),
  });
}
