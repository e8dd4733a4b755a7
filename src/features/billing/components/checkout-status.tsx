import { useQueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import { Alert, type AlertTone } from '../../../components/ui/alert.tsx';
import { errorMessage } from '../../../components/ui/error-state.tsx';
import { useCheckout } from '../api/get-checkout.ts';
import { formatCredits } from './amounts.ts';

/** After the payment page sends the browser back: what became of the purchase (polled until settled). */
export function CheckoutStatus({ departmentId, checkoutId, cancelled }: { departmentId: string; checkoutId: string; cancelled: boolean }) {
  const checkout = useCheckout(departmentId, checkoutId);
  const queryClient = useQueryClient();
  const status = checkout.data?.status;

  useEffect(() => {
    // Once settled, the balance, ledger and receipts have changed.
    if (status && status !== 'open') void queryClient.invalidateQueries({ queryKey: ['billing', departmentId] });
  }, [status, departmentId, queryClient]);

  let tone: AlertTone = 'info';
  let text: string;
  if (checkout.isError) {
    tone = 'danger';
    text = errorMessage(checkout.error);
  } else if (!checkout.data) {
    text = 'Checking the payment…';
  } else if (checkout.data.status === 'paid') {
    tone = 'success';
    text = `Payment received: ${formatCredits(checkout.data.credits)} added. Receipt ${checkout.data.receiptNumber} is on its way by e-mail.`;
  } else if (checkout.data.status === 'open') {
    text = checkout.data.paymentReceived
      ? 'The payment went through; the credit appears as soon as the payment service confirms it…'
      : cancelled
        ? 'The payment was not completed, so nothing was charged. You can buy a pack again below.'
        : 'Waiting for the payment service to confirm the payment…';
  } else {
    tone = 'danger';
    text = `${checkout.data.failureMessage ?? 'The payment did not go through.'} No credit was added and nothing was charged.`;
  }
  return <Alert tone={tone} message={text} className="mb-6" />;
}
