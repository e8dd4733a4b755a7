import { queryOptions, useQuery } from '@tanstack/react-query';
import { impliedOccurrenceAnswerSchema } from '../../../../shared/contracts/implied-occurrence.ts';
import { api } from '../../../lib/api-client.ts';
import { IMPLIED_POLL_MS } from './get-implied-run.ts';

export function getImpliedAnswer(fitId: string, signal?: AbortSignal) {
  return api.get(`/api/implied-occurrence/${encodeURIComponent(fitId)}`, { schema: impliedOccurrenceAnswerSchema, signal });
}

/** The question's fit: asked again while it computes, and until both answers are in. */
export const getImpliedAnswerQueryOptions = (departmentId: string, fitId: string) =>
  queryOptions({
    queryKey: ['fits', departmentId, 'implied-occurrence', fitId],
    queryFn: ({ signal }) => getImpliedAnswer(fitId, signal),
    refetchInterval: (query) => {
      const data = query.state.data;
      if (!data) return IMPLIED_POLL_MS;
      return data.status === 'queued' || data.status === 'running' ? IMPLIED_POLL_MS : false;
    },
  });

export function useImpliedAnswer(departmentId: string, fitId: string) {
  return useQuery(getImpliedAnswerQueryOptions(departmentId, fitId));
}
