import nodemailer from 'nodemailer';
import type { SmtpSettings } from '../../config';
import type { MailTransport } from './outbox-worker';

const timeouts = { connectionTimeout: 15_000, greetingTimeout: 15_000, socketTimeout: 60_000 };

/** A nodemailer SMTP transport for the settings, or null when no mail server is configured. */
export function createMailTransport(
  smtp: SmtpSettings,
): (MailTransport & { close(): void }) | null {
  switch (smtp.kind) {
    case 'url':
      return nodemailer.createTransport({ url: smtp.url, ...timeouts } as never);
    case 'host':
      return nodemailer.createTransport({
        host: smtp.host,
        port: smtp.port,
        secure: smtp.secure,
        ...(smtp.user ? { auth: { user: smtp.user, pass: smtp.pass ?? '' } } : {}),
        ...timeouts,
      });
    case 'dev':
      // The local fake mail server speaks plain SMTP on 127.0.0.1.
      return nodemailer.createTransport({
        host: smtp.host,
        port: smtp.port,
        secure: false,
        ignoreTLS: true,
        ...timeouts,
      });
    case 'none':
      return null;
  }
}
