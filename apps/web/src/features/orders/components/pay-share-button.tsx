import { checkoutAnswerSchema, formatMoney } from '@lotwise/shared';
import { CreditCard } from 'lucide-react';
import { useMutation } from '@tanstack/react-query';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { apiRequest } from '../../../lib/api-client';

interface PayShareButtonProps {
  orderId: number;
  shareId: number;
  /** The share's fixed amount, shown on the button; the server charges its own copy of it. */
  amountMinor: number;
  currency: string;
  /** Where the browser goes with the payment page's address (the whole page leaves Lotwise). */
  onRedirect?: (url: string) => void;
}

/**
 * Starts paying one share by card: asks the server for the payment service's page and sends
 * the browser there. Stays busy until the page has left, so a second click cannot start a
 * second payment (the server would answer the same page anyway).
 */
export function PayShareButton({
  orderId,
  shareId,
  amountMinor,
  currency,
  onRedirect = (url) => window.location.assign(url),
}: PayShareButtonProps) {
  const pay = useMutation({
    mutationFn: () =>
      apiRequest(`/api/orders/${orderId}/shares/${shareId}/checkout`, {
        method: 'POST',
        schema: checkoutAnswerSchema,
      }),
    onSuccess: ({ url }) => onRedirect(url),
  });
  return (
    <div className="flex flex-col items-start gap-2">
      <Button
        variant="primary"
        icon={<CreditCard aria-hidden="true" className="size-4" />}
        busy={pay.isPending || pay.isSuccess}
        onClick={() => pay.mutate()}
      >
        Pay {formatMoney(amountMinor, currency)} by card
      </Button>
      {pay.error ? (
        <Notice tone="danger" title="The payment did not start">
          {pay.error.message}
        </Notice>
      ) : null}
    </div>
  );
}
