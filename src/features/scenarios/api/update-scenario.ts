import { useMutation, useQueryClient } from '@tanstack/react-query';
import { scenarioDetailSchema, type UpdateScenarioBody } from '../../../../shared/contracts/scenarios-api.ts';
import { api } from '../../../lib/api-client.ts';
import { getScenarioQueryOptions } from './get-scenario.ts';
import { scenariosKey } from './get-scenarios.ts';

export interface UpdateScenarioInput {
  id: string;
  body: UpdateScenarioBody;
}

/** Renames a scenario and/or saves its document as a new version (an unchanged document makes none). */
export function updateScenario({ id, body }: UpdateScenarioInput) {
  return api.patch(`/api/scenarios/${encodeURIComponent(id)}`, { body, schema: scenarioDetailSchema });
}

export function useUpdateScenario(departmentId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateScenario,
    onSuccess: (scenario) => {
      queryClient.setQueryData(getScenarioQueryOptions(departmentId, scenario.id).queryKey, scenario);
      return queryClient.invalidateQueries({ queryKey: scenariosKey(departmentId) });
    },
  });
}
