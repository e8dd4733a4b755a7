import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { ledgerResponseSchema } from '../../../../shared/contracts/billing.ts';
import { api } from '../../../lib/api-client.ts';

export function getLedger(page: number, pageSize: number, signal?: AbortSignal) {
  return api.get(`/api/billing/ledger?${new URLSearchParams({ page: String(page), pageSize: String(pageSize) })}`, { schema: ledgerResponseSchema, signal });
}

export const getLedgerQueryOptions = (departmentId: string, page: number, pageSize = 20) =>
  queryOptions({ queryKey: ['billing', departmentId, 'ledger', page, pageSize], queryFn: ({ signal }) => getLedger(page, pageSize, signal) });

export function useLedger(departmentId: string, page: number) {
  return useQuery({ ...getLedgerQueryOptions(departmentId, page), placeholderData: keepPreviousData });
}
