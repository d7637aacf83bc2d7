import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { mockFetch } from '../../../test/fetch-mock';
import { PayShareButton } from './pay-share-button';

function renderButton(onRedirect: (url: string) => void) {
  const client = new QueryClient({ defaultOptions: { mutations: { retry: false } } });
  return render(
    <QueryClientProvider client={client}>
      <PayShareButton
        orderId={7}
        shareId={21}
        amountMinor={1250}
        currency="EUR"
        onRedirect={onRedirect}
      />
    </QueryClientProvider>,
  );
}

describe('PayShareButton', () => {
  it('when pressed, then it asks the server for the payment page, sends no amount, and goes there', async () => {
    const { requests } = mockFetch({
      'POST /api/orders/7/shares/21/checkout': {
        body: { url: 'http://127.0.0.1:4242/pay/cs_test_1' },
      },
    });
    const onRedirect = vi.fn();
    renderButton(onRedirect);
    const button = screen.getByRole('button', { name: /Pay .*12\.50 by card/ });
    await userEvent.click(button);
    expect(onRedirect).toHaveBeenCalledWith('http://127.0.0.1:4242/pay/cs_test_1');
    expect(requests).toHaveLength(1);
    expect(requests[0]!.body).toBeUndefined();
    expect(button).toBeDisabled();
  });

  it('when the payment service is down, then the reason shows and the button can be pressed again', async () => {
    mockFetch({
      'POST /api/orders/7/shares/21/checkout': {
        status: 503,
        body: {
          error: {
            code: 'payment_provider_unavailable',
            message: 'The payment service could not be reached, so nothing was charged.',
          },
        },
      },
    });
    const onRedirect = vi.fn();
    renderButton(onRedirect);
    await userEvent.click(screen.getByRole('button', { name: /by card/ }));
    expect(await screen.findByRole('alert')).toHaveTextContent('nothing was charged');
    expect(onRedirect).not.toHaveBeenCalled();
    expect(screen.getByRole('button', { name: /by card/ })).toBeEnabled();
  });
});
