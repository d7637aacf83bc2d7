export { startPaymentsFake, type PaymentsFake, type PaymentsFakeOptions } from './fake-server';
export { signatureHeader, type Delivery, type DeliveryStatus } from './webhooks';
export { formatMoney } from './checkout-page';
export { devSecretKey, devWebhookSecret } from './dev-keys';
