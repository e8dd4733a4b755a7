import { useMutation } from '@tanstack/react-query';
import { checkoutResponseSchema, type CheckoutBody } from '../../../../shared/contracts/billing.ts';
import { api } from '../../../lib/api-client.ts';

/** 201 with the payment page's url; 403 for non-admins; 502 when the payment service is unreachable. */
export function startCheckout(body: CheckoutBody) {
  return api.post('/api/billing/checkout', { body, schema: checkoutResponseSchema });
}

/** Starts a checkout and sends the browser to the payment page. */
export function useStartCheckout() {
  return useMutation({
    mutationFn: startCheckout,
    onSuccess: ({ url }) => window.location.assign(url),
  });
}
