import {
  alertKindLabels,
  alertListQuerySchema,
  alertPreferencesBodySchema,
  outboxListQuerySchema,
} from '@lotwise/shared';
import type { Response } from 'express';
import { z } from 'zod';
import { defineRoute } from '../../lib/route-table';
import { idParamsSchema } from '../../lib/validate';
import type { AlertsService } from './alerts.service';
import { escapeHtml, htmlDocument } from './messages';

const tokenQuerySchema = z.object({ token: z.string().max(400).optional() });

function page(res: Response, status: number, title: string, lines: string[]) {
  const body = [
    `<h1 style="font-size:20px;margin:0 0 12px 0;">${escapeHtml(title)}</h1>`,
    ...lines.map((line) => `<p style="margin:0 0 12px 0;">${line}</p>`),
  ].join('');
  res.status(status).type('html').send(htmlDocument(title, body));
}

export function alertRoutes(alerts: AlertsService) {
  async function unsubscribe(token: string | undefined, res: Response) {
    const done = token ? await alerts.unsubscribe(token) : null;
    if (!done) {
      page(res, 400, 'This unsubscribe link does not work', [
        'The link is incomplete or was changed. Open it again from the e-mail, or sign in to Lotwise and change your alert settings.',
        `<a href="${escapeHtml(alerts.preferencesUrl)}">Alert settings</a>`,
      ]);
      return;
    }
    const what =
      done.kind === 'all'
        ? 'You will get no more alert e-mails from Lotwise.'
        : `You will get no more e-mails about: ${escapeHtml(alertKindLabels[done.kind].toLowerCase())}.`;
    page(res, 200, 'Unsubscribed', [
      `${what} (${escapeHtml(done.email)})`,
      'Current alerts stay visible on the Alerts page in Lotwise. You can turn e-mails back on in your alert settings.',
      `<a href="${escapeHtml(alerts.preferencesUrl)}">Alert settings</a>`,
    ]);
  }

  return [
    defineRoute({
      method: 'get',
      path: '/api/alerts',
      access: 'alerts.read',
      query: alertListQuerySchema,
      handle: async ({ query, res }) => {
        res.json(await alerts.current(query));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/alerts/evaluate',
      access: 'outbox.manage',
      handle: async ({ res }) => {
        res.json(await alerts.evaluateNow());
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/alerts/preferences',
      access: 'signed-in',
      handle: async ({ res, actor }) => {
        res.json(await alerts.preferences(actor()));
      },
    }),
    defineRoute({
      method: 'put',
      path: '/api/alerts/preferences',
      access: 'signed-in',
      body: alertPreferencesBodySchema.strict(),
      handle: async ({ body, res, actor }) => {
        res.json(await alerts.savePreferences(actor(), body));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/alerts/unsubscribe',
      access: 'public',
      query: tokenQuerySchema,
      handle: async ({ query, res }) => {
        await unsubscribe(query.token, res);
      },
    }),
    /** One-click unsubscribe from a mail client (List-Unsubscribe-Post); same effect. */
    defineRoute({
      method: 'post',
      path: '/api/alerts/unsubscribe',
      access: 'public',
      query: tokenQuerySchema,
      handle: async ({ query, res }) => {
        await unsubscribe(query.token, res);
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/outbox',
      access: 'outbox.manage',
      query: outboxListQuerySchema,
      handle: async ({ query, res }) => {
        res.json(await alerts.listOutbox(query));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/outbox/:id',
      access: 'outbox.manage',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await alerts.getOutbox(params.id));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/outbox/:id/resend',
      access: 'outbox.manage',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await alerts.resend(params.id));
      },
    }),
  ];
}
