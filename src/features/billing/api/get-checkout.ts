import { queryOptions, useQuery } from '@tanstack/react-query';
import { checkoutStatusResponseSchema } from '../../../../shared/contracts/billing.ts';
import { api } from '../../../lib/api-client.ts';

export function getCheckout(id: string, signal?: AbortSignal) {
  return api.get(`/api/billing/checkouts/${encodeURIComponent(id)}`, { schema: checkoutStatusResponseSchema, signal });
}

export const getCheckoutQueryOptions = (departmentId: string, id: string) =>
  queryOptions({ queryKey: ['billing', departmentId, 'checkout', id], queryFn: ({ signal }) => getCheckout(id, signal) });

/** Polls while the payment is open: the webhook that credits it may arrive a moment after the redirect. */
export function useCheckout(departmentId: string, id: string) {
  return useQuery({
    ...getCheckoutQueryOptions(departmentId, id),
    refetchInterval: (query) => (query.state.data && query.state.data.status !== 'open' ? false : 1500),
  });
}
