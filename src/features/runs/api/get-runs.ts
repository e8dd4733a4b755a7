import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { runListResponseSchema, type RunListQuery, type RunSummary } from '../../../../shared/contracts/runs.ts';
import { api } from '../../../lib/api-client.ts';

/** What the runs table asks for; unset fields take the server's defaults. */
export type RunListParams = Partial<Pick<RunListQuery, 'page' | 'pageSize' | 'sort' | 'order' | 'status' | 'q' | 'owner'>>;

export function runListSearch(params: RunListParams): string {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) {
    if (value !== undefined && value !== '') search.set(key, String(value));
  }
  return search.toString();
}

export function getRuns(params: RunListParams, signal?: AbortSignal) {
  const search = runListSearch(params);
  return api.get(`/api/runs${search ? `?${search}` : ''}`, { schema: runListResponseSchema, signal });
}

const isLive = (run: RunSummary) => run.status === 'queued' || run.status === 'running';

/** Every run list of a department, whatever its filters: what a mutation invalidates. */
export const runListKey = (departmentId: string) => ['runs', departmentId, 'list'] as const;

export const getRunsQueryOptions = (departmentId: string, params: RunListParams) =>
  queryOptions({
    queryKey: [...runListKey(departmentId), params],
    queryFn: ({ signal }) => getRuns(params, signal),
    // Paging and filtering keep the old rows on screen until the new ones arrive.
    placeholderData: keepPreviousData,
    // Unfinished runs move on their own: refresh while the page shows any.
    refetchInterval: (query) => (query.state.data?.runs.some(isLive) ? 4_000 : false),
  });

export function useRuns(departmentId: string, params: RunListParams) {
  return useQuery(getRunsQueryOptions(departmentId, params));
}
