import {
  alertListQuerySchema,
  alertPreferencesBodySchema,
  outboxListQuerySchema,
} from '@lotwise/shared';
import type { Response } from 'express';
import { z } from 'zod';
import { defineRoute } from '../../lib/route-table';
import { idParamsSchema } from '../../lib/validate';
import type { AlertsService } from './alerts.service';
import {
  brokenLinkPage,
  confirmPage,
  unsubscribedPage,
  type UnsubscribePage,
} from './unsubscribe-pages';

const tokenQuerySchema = z.object({ token: z.string().max(400).optional() });

function send(res: Response, page: UnsubscribePage) {
  res.status(page.status).type('html').send(page.html);
}

export function alertRoutes(alerts: AlertsService) {
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
        const found = query.token ? await alerts.readUnsubscribe(query.token) : null;
        if (!found) return send(res, brokenLinkPage(alerts.preferencesUrl));
        send(
          res,
          confirmPage({
            ...found,
            actionPath: `/api/alerts/unsubscribe?token=${encodeURIComponent(query.token!)}`,
            preferencesUrl: alerts.preferencesUrl,
          }),
        );
      },
    }),
    /**
     * Unsubscribes: the confirmation page's button, and a mail client's one-click
     * unsubscribe (RFC 8058 List-Unsubscribe-Post, body `List-Unsubscribe=One-Click`).
     */
    defineRoute({
      method: 'post',
      path: '/api/alerts/unsubscribe',
      access: 'public',
      query: tokenQuerySchema,
      handle: async ({ query, res }) => {
        const done = query.token ? await alerts.unsubscribe(query.token) : null;
        if (!done) return send(res, brokenLinkPage(alerts.preferencesUrl));
        send(res, unsubscribedPage({ ...done, preferencesUrl: alerts.preferencesUrl }));
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
