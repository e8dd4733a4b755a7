import type { UseQueryResult } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { ErrorState } from './error-state.tsx';
import { LoadingState } from './loading-state.tsx';

export interface QueryStateProps<T> {
  query: UseQueryResult<T>;
  loadingLabel?: string;
  /** Heading of the error box ("The member list could not be loaded"). */
  errorTitle?: string;
  children: (data: T) => ReactNode;
}

/** Loading, then the error (with a retry) or the data: the three states of every fetched panel. */
export function QueryState<T>({ query, loadingLabel, errorTitle, children }: QueryStateProps<T>) {
  if (query.isPending) return <LoadingState label={loadingLabel} />;
  if (query.isError) {
    return <ErrorState error={query.error} title={errorTitle} onRetry={() => void query.refetch()} retrying={query.isFetching} />;
  }
  return <>{children(query.data)}</>;
}
