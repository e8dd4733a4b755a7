import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateRunBody } from '../../../../shared/contracts/runs.ts';
import { idResponseSchema } from '../../../../shared/contracts/scenarios-api.ts';
import { api } from '../../../lib/api-client.ts';
import { runListKey } from './get-runs.ts';

/** 400 names the field at fault (`systems`, `seed`, `document.…`); 402 when credit is short; 403 above an observer's limit. */
export function createRun(body: CreateRunBody) {
  return api.post('/api/runs', { body, schema: idResponseSchema });
}

export function useCreateRun(departmentId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createRun,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: runListKey(departmentId) }),
  });
}
