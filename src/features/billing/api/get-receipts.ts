import { queryOptions, useQuery } from '@tanstack/react-query';
import { receiptListResponseSchema } from '../../../../shared/contracts/billing.ts';
import { api } from '../../../lib/api-client.ts';

export function getReceipts(signal?: AbortSignal) {
  return api.get('/api/billing/receipts', { schema: receiptListResponseSchema, signal });
}

export const getReceiptsQueryOptions = (departmentId: string) =>
  queryOptions({ queryKey: ['billing', departmentId, 'receipts'], queryFn: ({ signal }) => getReceipts(signal) });

export function useReceipts(departmentId: string) {
  return useQuery(getReceiptsQueryOptions(departmentId));
}
