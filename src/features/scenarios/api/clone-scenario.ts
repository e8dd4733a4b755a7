import { useMutation, useQueryClient } from '@tanstack/react-query';
import { idResponseSchema } from '../../../../shared/contracts/scenarios-api.ts';
import { api } from '../../../lib/api-client.ts';
import { scenariosKey } from './get-scenarios.ts';

export interface CloneScenarioInput {
  id: string;
  /** The copy's name; the server says "Copy of …" without one. */
  name?: string;
}

/** Copies a scenario's current document into a new scenario (version 1, noting where it came from). */
export function cloneScenario({ id, name }: CloneScenarioInput) {
  return api.post(`/api/scenarios/${encodeURIComponent(id)}/clone`, { body: name ? { name } : {}, schema: idResponseSchema });
}

export function useCloneScenario(departmentId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: cloneScenario,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: scenariosKey(departmentId) }),
  });
}
