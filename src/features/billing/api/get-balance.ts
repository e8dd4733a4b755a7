import { queryOptions, useQuery } from '@tanstack/react-query';
import { balanceResponseSchema } from '../../../../shared/contracts/billing.ts';
import { api } from '../../../lib/api-client.ts';

/** The active department's credit balance and this month's free systems. */
export function getBalance(signal?: AbortSignal) {
  return api.get('/api/billing/balance', { schema: balanceResponseSchema, signal });
}

export const getBalanceQueryOptions = (departmentId: string) =>
  queryOptions({ queryKey: ['billing', departmentId, 'balance'], queryFn: ({ signal }) => getBalance(signal) });

export function useBalance(departmentId: string, options: { refetchInterval?: number | false } = {}) {
  return useQuery({ ...getBalanceQueryOptions(departmentId), refetchInterval: options.refetchInterval });
}
