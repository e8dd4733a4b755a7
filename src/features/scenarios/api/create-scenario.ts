import { useMutation, useQueryClient } from '@tanstack/react-query';
import { idResponseSchema, type CreateScenarioBody } from '../../../../shared/contracts/scenarios-api.ts';
import { api } from '../../../lib/api-client.ts';
import { scenariosKey } from './get-scenarios.ts';

/** Stores a new scenario as its version 1; a bad document is answered with `document.<path>` as the field. */
export function createScenario(body: CreateScenarioBody) {
  return api.post('/api/scenarios', { body, schema: idResponseSchema });
}

export function useCreateScenario(departmentId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createScenario,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: scenariosKey(departmentId) }),
  });
}
