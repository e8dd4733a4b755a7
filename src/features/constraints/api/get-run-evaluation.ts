import { queryOptions, useQueries, useQuery } from '@tanstack/react-query';
import { evaluationResponseSchema } from '../../../../shared/contracts/constraints.ts';
export type { ConstraintEvaluation, Evaluation } from '../../../../shared/contracts/constraints.ts';
import { api } from '../../../lib/api-client.ts';
import { constraintsKey } from './get-constraint-sets.ts';

export function getRunEvaluation(runId: string, setId: string, signal?: AbortSignal) {
  const search = new URLSearchParams({ constraintSet: setId });
  return api.get(`/api/runs/${encodeURIComponent(runId)}/evaluation?${search}`, { schema: evaluationResponseSchema, signal });
}

export const getRunEvaluationQueryOptions = (departmentId: string, runId: string, setId: string) =>
  queryOptions({ queryKey: [...constraintsKey(departmentId), 'evaluation', runId, setId], queryFn: ({ signal }) => getRunEvaluation(runId, setId, signal) });

/** One run against one set; nothing is asked until a set is chosen. */
export function useRunEvaluation(departmentId: string, runId: string, setId: string | null) {
  return useQuery({ ...getRunEvaluationQueryOptions(departmentId, runId, setId ?? ''), enabled: Boolean(setId) });
}

/** Several runs against one set (the Compare page). */
export function useRunEvaluations(departmentId: string, runIds: readonly string[], setId: string) {
  return useQueries({ queries: runIds.map((id) => getRunEvaluationQueryOptions(departmentId, id, setId)) });
}
