import { queryOptions, useQuery } from '@tanstack/react-query';
import { quoteResponseSchema } from '../../../../shared/contracts/billing.ts';
import { api } from '../../../lib/api-client.ts';

export function getQuote(systems: number, signal?: AbortSignal) {
  return api.get(`/api/billing/quote?systems=${systems}`, { schema: quoteResponseSchema, signal });
}

export const getQuoteQueryOptions = (departmentId: string, systems: number) =>
  queryOptions({ queryKey: ['billing', departmentId, 'quote', systems], queryFn: ({ signal }) => getQuote(systems, signal), staleTime: 10_000 });

/** What a run of `systems` would cost now; not asked while `systems` is not a valid run size. */
export function useQuote(departmentId: string, systems: number | null) {
  const valid = systems !== null && Number.isInteger(systems) && systems >= 1e3 && systems <= 1e10;
  return useQuery({ ...getQuoteQueryOptions(departmentId, valid ? systems : 0), enabled: valid });
}
