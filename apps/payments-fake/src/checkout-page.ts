import type Stripe from 'stripe';

const escapes: Record<string, string> = {
  '&': '&amp;',
  '<': '&lt;',
  '>': '&gt;',
  '"': '&quot;',
  "'": '&#39;',
};
const escape = (text: string) => text.replace(/[&<>"']/g, (c) => escapes[c] ?? c);

/** `amount` minor units of `currency` as money, e.g. 1234 eur -> €12.34. */
export function formatMoney(amount: number, currency: string): string {
  const format = new Intl.NumberFormat('en-GB', {
    style: 'currency',
    currency: currency.toUpperCase(),
  });
  const digits = format.resolvedOptions().maximumFractionDigits ?? 2;
  return format.format(amount / 10 ** digits);
}

export interface CheckoutPageInput {
  session: Stripe.Checkout.Session;
  items: string[];
  lastError: string | null;
}

/**
 * The hosted checkout page: what is being paid, and the two test cards. It says plainly that
 * it is the local stand-in, so nobody mistakes it for a real payment.
 */
export function checkoutPage({ session, items, lastError }: CheckoutPageInput): string {
  const amount = formatMoney(session.amount_total ?? 0, session.currency ?? 'eur');
  const list = items.map((item) => `<li>${escape(item)}</li>`).join('');
  let body: string;
  if (session.status === 'open') {
    body = `
      ${
        lastError
          ? `<div class="notice declined" role="alert"><strong>Payment declined.</strong> ${escape(lastError)} Nothing was charged. You can try again with the other test card.</div>`
          : ''
      }
      <form method="post" action="/pay/${escape(session.id)}/succeed">
        <button type="submit" class="primary">Test card succeeds</button>
      </form>
      <form method="post" action="/pay/${escape(session.id)}/decline">
        <button type="submit">Test card is declined</button>
      </form>
      ${session.cancel_url ? `<p><a href="${escape(session.cancel_url)}">Cancel and go back</a></p>` : ''}`;
  } else if (session.status === 'complete') {
    const back = (session.success_url ?? '').replaceAll('{CHECKOUT_SESSION_ID}', session.id);
    body = `<div class="notice paid" role="status"><strong>Paid.</strong> This checkout is complete.</div>
      ${back ? `<p><a href="${escape(back)}">Go back</a></p>` : ''}`;
  } else {
    body = `<div class="notice" role="status"><strong>Expired.</strong> This checkout can no longer be paid; start a new payment from where you came.</div>
      ${session.cancel_url ? `<p><a href="${escape(session.cancel_url)}">Go back</a></p>` : ''}`;
  }
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>Test checkout — ${escape(amount)}</title>
<style>
  body { font: 16px/1.5 system-ui, sans-serif; margin: 0; background: #f4f4f0; color: #1c1c1c; }
  main { max-width: 28rem; margin: 3rem auto; background: #fff; border: 1px solid #d8d8d0; border-radius: 8px; padding: 1.5rem 2rem; }
  .fake { font-size: 0.875rem; background: #fff6d6; border: 1px solid #e2c96b; border-radius: 6px; padding: 0.5rem 0.75rem; }
  .amount { font-size: 2rem; font-weight: 600; margin: 0.5rem 0 0; }
  ul { padding-left: 1.25rem; }
  form { margin: 0.75rem 0; }
  button { width: 100%; font: inherit; padding: 0.6rem; border-radius: 6px; border: 1px solid #555; background: #fff; cursor: pointer; }
  button.primary { background: #1f4e79; border-color: #1f4e79; color: #fff; }
  button:focus-visible, a:focus-visible { outline: 3px solid #e2a000; outline-offset: 2px; }
  .notice { border-radius: 6px; padding: 0.5rem 0.75rem; margin: 1rem 0; border: 1px solid #888; }
  .declined { background: #fde8e8; border-color: #b42318; }
  .paid { background: #e6f4ea; border-color: #1e7b34; }
</style>
</head>
<body>
<main>
  <p class="fake">Local payments stand-in for testing: no card is charged and no money moves.</p>
  <h1>Test checkout</h1>
  <p class="amount" data-testid="amount">${escape(amount)}</p>
  <ul>${list}</ul>
  ${body}
</main>
</body>
</html>`;
}
