/**
 * Keys for development and tests only: the fake and a development Lotwise agree on them
 * without configuration. They open nothing real; production refuses to start without its own.
 */
export const devSecretKey = 'sk_test_lotwise_local_fake_only';
export const devWebhookSecret = 'whsec_lotwise_local_fake_only';
