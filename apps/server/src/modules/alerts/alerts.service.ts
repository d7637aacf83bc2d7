import { addDays } from '@lotwise/chem';
import {
  alertKinds,
  formatDate,
  formatDateTime,
  formatQuantity,
  todayIso,
  type Alert,
  type AlertDelivery,
  type AlertEvaluation,
  type AlertKind,
  type AlertList,
  type AlertListQuery,
  type AlertPreferences,
  type AlertPreferencesBody,
  type GhsCode,
  type OutboxListQuery,
  type OutboxMessage,
  type OutboxMessageDetail,
  type Page,
  type Role,
  type User,
} from '@lotwise/shared';
import type { Config, TextConfig } from '../../config';
import type { Repositories, Store } from '../../db/store';
import { AppError } from '../../lib/app-error';
import type { AlertRecipientRow, OutboxListRow } from './alerts.repository';
import { textToHtml, topicMessage } from './messages';
import {
  datedConditions,
  lowStockConditions,
  mailTopics,
  reservationConditions,
  sortConditions,
  type Condition,
  type ReservationSource,
} from './rules';
import { readUnsubscribeToken, unsubscribeToken, type UnsubscribeClaim } from './unsubscribe-token';

/** Who a general message goes to, when not to named people. */
export type NotifyAudience = 'managers' | 'members' | 'everyone';

/**
 * A message from another feature (shared orders: opened, deadline near, funded, cancelled or
 * refunded, portion ready). Call `notify` with the repositories of the transaction that
 * records the event, so the message commits or rolls back with it.
 */
export interface NotifyInput {
  kind: AlertKind;
  /** User ids; or give `audience`. */
  recipients?: number[];
  audience?: NotifyAudience;
  subject: string;
  text: string;
  /** An HTML fragment with inline styles only; made from `text` when not given. */
  html?: string;
  /** The same key does not mail the same person twice within the dedup window. */
  dedupKey?: string;
  /** A path in the web app (`/orders/3`) or a full address. */
  link?: string;
}

/** Chemicals people claimed in shared orders (the orders module will provide this). */
export interface ClaimSource {
  claimedChemicals(userIds: number[]): Promise<Map<number, Set<number>>>;
}

export interface AlertsServiceOptions {
  /** Called after messages were queued (the outbox worker uses it to send promptly). */
  onQueued?: () => void;
  /** Where lapsing reservations come from; by default the plans' reservations table. */
  reservations?: ReservationSource;
  claims?: ClaimSource;
  /**
   * Messages of other capabilities' rules, sent by every evaluation (e.g. waste near its
   * limits); each with a `dedupKey` that names its condition, so it is sent once.
   */
  extraMessages?: (repos: Repositories, now: Date) => Promise<NotifyInput[]>;
}

/** How far ahead the reservation rule looks. */
export const reservationLeadHours = 48;

const fullScopeRoles: readonly Role[] = ['admin', 'manager'];

/** Kinds a role gets by e-mail until the person chooses: everything, viewers nothing. */
export function defaultKinds(role: Role): AlertKind[] {
  return role === 'viewer' ? [] : [...alertKinds];
}

interface Person extends AlertRecipientRow {
  delivery: AlertDelivery;
  kinds: Set<AlertKind>;
}

/** The next time the daily digest goes out (server time), strictly after `now`. */
export function nextDigestAt(now: Date, hour: number): Date {
  const next = new Date(now);
  next.setHours(hour, 0, 0, 0);
  if (next.getTime() <= now.getTime()) next.setDate(next.getDate() + 1);
  return next;
}

function presentOutbox(row: Omit<OutboxListRow, 'text' | 'html'>): OutboxMessage {
  return {
    id: row.id,
    recipient: { userId: row.userId, email: row.recipientEmail, displayName: row.displayName },
    kind: row.kind,
    subject: row.subject,
    delivery: row.delivery,
    status: row.status,
    attempts: row.attempts,
    lastError: row.lastError,
    nextAttemptAt: row.nextAttemptAt,
    dedupKey: row.dedupKey,
    link: row.link,
    createdAt: row.createdAt,
    sentAt: row.sentAt,
  };
}

function amount(value: number, unit: 'g' | 'mL') {
  return formatQuantity(value, unit);
}

/** The in-app form of a condition. */
function presentCondition(condition: Condition, style: TextConfig): Alert {
  const { chemical, container } = condition;
  const base = {
    key: condition.key,
    kind: condition.kind,
    severity: condition.severity,
    chemical: { id: chemical.id, name: chemical.name },
    container: container
      ? { id: container.id, labelCode: container.labelCode, locationPath: container.locationPath }
      : null,
    dueOn: condition.dueOn,
    link: container ? `/stock/containers/${container.id}` : `/stock/chemicals/${chemical.id}`,
  };
  if (condition.kind === 'low-stock') {
    const stock = condition.stock!;
    const out = condition.severity === 'critical';
    return {
      ...base,
      title: `${out ? 'Out of stock' : 'Low stock'}: ${chemical.name}`,
      message: `${amount(stock.total, stock.unit)} usable in ${stock.containers.length} container${stock.containers.length === 1 ? '' : 's'}; reorder point ${amount(stock.reorderPoint, stock.unit)}.`,
    };
  }
  if (condition.kind === 'reservation-lapsing') {
    const r = condition.reservation!;
    return {
      ...base,
      container: { id: r.containerId, labelCode: r.labelCode, locationPath: r.locationPath },
      title: `Reservation lapsing: ${chemical.name}`,
      message: `${amount(r.quantity, r.unit)} in ${r.labelCode} reserved for “${r.planTitle}” lapses at ${formatDateTime(r.lapsesAt, { ...style, showZone: true })}.`,
      link: `/preparations/plans/${r.planId}`,
    };
  }
  const dueOn = formatDate(condition.dueOn, style);
  const where = `${container!.labelCode} (${amount(container!.quantity, container!.unit)}, ${container!.locationPath})`;
  const text: Record<'expiring' | 'expired' | 'peroxide-due', [string, string]> = {
    expiring: [`Expiring: ${chemical.name}`, `${where} expires on ${dueOn}.`],
    expired: [`Expired: ${chemical.name}`, `${where} expired on ${dueOn}.`],
    'peroxide-due': [
      `${condition.severity === 'critical' ? 'Peroxide test overdue' : 'Peroxide test due'}: ${chemical.name}`,
      `${where}: test for peroxides or discard by ${dueOn}.`,
    ],
  };
  const [title, message] = text[condition.kind as keyof typeof text];
  return { ...base, title, message };
}

export function alertsService(store: Store, config: Config, options: AlertsServiceOptions = {}) {
  const settings = config.alerts;

  function unsubscribeUrl(userId: number, kind: AlertKind | 'all'): string {
    return `${config.publicUrl}/api/alerts/unsubscribe?token=${unsubscribeToken(config.jwtSecret, { userId, kind })}`;
  }

  async function collect(repos: Repositories, now: Date, chemicalIds?: number[]) {
    const today = todayIso(now);
    const until = addDays(today, settings.expiryDays);
    const low = await repos.alerts.lowStock(today, chemicalIds);
    const usable = await repos.alerts.usableContainers(
      today,
      low.map((c) => c.id),
    );
    const dated = await repos.alerts.datedContainers(until, chemicalIds);
    const cutoff = new Date(now.getTime() + reservationLeadHours * 3600_000).toISOString();
    const reservations = options.reservations
      ? await options.reservations.lapsingBefore(cutoff, chemicalIds)
      : await repos.plans.lapsingBetween(today, cutoff.slice(0, 10), chemicalIds);
    return sortConditions([
      ...lowStockConditions(low, usable),
      ...datedConditions(dated, today, until),
      ...reservationConditions(reservations),
    ]);
  }

  async function people(repos: Repositories): Promise<Person[]> {
    const recipients = await repos.alerts.recipients();
    const saved = new Map(
      (await repos.alerts.findPreferences(recipients.map((r) => r.id))).map((p) => [p.userId, p]),
    );
    return recipients.map((r) => {
      const preference = saved.get(r.id);
      return {
        ...r,
        delivery: preference?.delivery ?? 'immediate',
        kinds: new Set(preference?.kinds ?? defaultKinds(r.role)),
      };
    });
  }

  /** Writes one message for one person unless they got the same key within the window. */
  async function queue(
    repos: Repositories,
    person: Pick<Person, 'id' | 'email' | 'delivery'>,
    message: {
      kind: string;
      subject: string;
      text: string;
      html: string;
      link: string | null;
      dedupKey: string | null;
    },
    now: Date,
  ): Promise<boolean> {
    if (message.dedupKey && settings.dedupHours > 0) {
      const since = new Date(now.getTime() - settings.dedupHours * 3600_000).toISOString();
      if (await repos.alerts.mailedSince(person.email, message.dedupKey, since)) return false;
    }
    const at = now.toISOString();
    await repos.alerts.insertMessage({
      userId: person.id,
      recipientEmail: person.email,
      kind: message.kind,
      subject: message.subject.slice(0, 300),
      text: message.text,
      html: message.html,
      link: message.link ? message.link.slice(0, 500) : null,
      dedupKey: message.dedupKey ? message.dedupKey.slice(0, 200) : null,
      delivery: person.delivery,
      status: 'queued',
      attempts: 0,
      lastError: null,
      nextAttemptAt:
        person.delivery === 'digest' ? nextDigestAt(now, settings.digestHour).toISOString() : at,
      claimedBy: null,
      leaseUntil: null,
      createdAt: at,
      updatedAt: at,
      sentAt: null,
    });
    return true;
  }

  function queued(count: number) {
    if (count > 0) options.onQueued?.();
  }

  /**
   * Runs every rule (only for `chemicalIds` when given) and queues an e-mail per topic for
   * each person who gets it, in the caller's transaction.
   */
  async function evaluate(
    repos: Repositories,
    { now = new Date(), chemicalIds }: { now?: Date; chemicalIds?: number[] } = {},
  ): Promise<AlertEvaluation> {
    // one evaluation at a time across app instances: the next sees what this one queued
    await repos.alerts.takeRulesTurn();
    const conditions = await collect(repos, now, chemicalIds);
    const result = { conditions: conditions.length, queued: 0, duplicates: 0 };
    for (const message of options.extraMessages ? await options.extraMessages(repos, now) : []) {
      const sent = await notify(repos, message, now);
      result.conditions++;
      result.queued += sent.queued;
      result.duplicates += sent.duplicates;
    }
    if (conditions.length === 0) return result;
    const topics = mailTopics(conditions);
    const everyone = await people(repos);
    const mineIds = everyone.filter((p) => !fullScopeRoles.includes(p.role)).map((p) => p.id);
    const topicChemicalIds = [...new Set(topics.map((topic) => topic.chemical.id))];
    const used = await repos.alerts.usedChemicals(mineIds, topicChemicalIds);
    const claimed = options.claims ? await options.claims.claimedChemicals(mineIds) : new Map();
    for (const topic of topics) {
      const content = topicMessage(topic, config.publicUrl, config.text);
      for (const person of everyone) {
        if (!person.kinds.has(topic.kind)) continue;
        if (topic.userIds) {
          if (!topic.userIds.includes(person.id)) continue;
        } else if (!fullScopeRoles.includes(person.role)) {
          const chemicalId = topic.chemical.id;
          const mine =
            used.get(person.id)?.has(chemicalId) || claimed.get(person.id)?.has(chemicalId);
          if (!mine) continue;
        }
        const written = await queue(
          repos,
          person,
          { ...content, kind: topic.kind, dedupKey: topic.dedupKey },
          now,
        );
        if (written) result.queued++;
        else result.duplicates++;
      }
    }
    queued(result.queued);
    return result;
  }

  /** The general message API; see `NotifyInput`. Answers how many were queued. */
  async function notify(
    repos: Repositories,
    input: NotifyInput,
    now = new Date(),
  ): Promise<{ queued: number; duplicates: number }> {
    const everyone = await people(repos);
    const chosen = input.recipients
      ? everyone.filter((p) => input.recipients!.includes(p.id))
      : everyone.filter((p) =>
          input.audience === 'managers'
            ? fullScopeRoles.includes(p.role)
            : input.audience === 'members'
              ? p.role !== 'viewer'
              : input.audience === 'everyone',
        );
    const link = input.link
      ? /^https?:\/\//.test(input.link)
        ? input.link
        : `${config.publicUrl}${input.link.startsWith('/') ? '' : '/'}${input.link}`
      : null;
    const html = input.html ?? textToHtml(input.subject, input.text, link);
    const text = link ? `${input.text}\n\nOpen in Lotwise: ${link}` : input.text;
    const result = { queued: 0, duplicates: 0 };
    for (const person of chosen) {
      if (!person.kinds.has(input.kind)) continue;
      const written = await queue(
        repos,
        person,
        {
          kind: input.kind,
          subject: input.subject,
          text,
          html,
          link,
          dedupKey: input.dedupKey ?? null,
        },
        now,
      );
      if (written) result.queued++;
      else result.duplicates++;
    }
    queued(result.queued);
    return result;
  }

  return {
    evaluate,

    /** One evaluation in its own transaction (scheduler, admin button, command line). */
    evaluateNow(now = new Date()): Promise<AlertEvaluation> {
      return store.transaction((repos) => evaluate(repos, { now }));
    },

    /** The general message API; see `NotifyInput`. Answers how many were queued. */
    notify,

    /** Current conditions, computed live. */
    async current(query: AlertListQuery, now = new Date()): Promise<AlertList> {
      const conditions = await collect(store.repos, now);
      return {
        items: conditions
          .filter((c) => !query.kind || c.kind === query.kind)
          .map((c) => presentCondition(c, config.text)),
        evaluatedAt: now.toISOString(),
        expiryWindowDays: settings.expiryDays,
      };
    },

    /**
     * Current conditions in their in-app form with the chemical's pictograms, most severe
     * first (the start page groups them into its sections).
     */
    async currentWithHazards(
      now = new Date(),
    ): Promise<{ alert: Alert; ghsPictograms: GhsCode[] }[]> {
      const conditions = await collect(store.repos, now);
      return conditions.map((condition) => ({
        alert: presentCondition(condition, config.text),
        ghsPictograms: condition.chemical.ghsPictograms,
      }));
    },

    async preferences(user: User): Promise<AlertPreferences> {
      const [row] = await store.repos.alerts.findPreferences([user.id]);
      return {
        delivery: row?.delivery ?? 'immediate',
        kinds: row?.kinds ?? defaultKinds(user.role),
        digestHour: settings.digestHour,
        scope: fullScopeRoles.includes(user.role) ? 'all' : 'mine',
        isDefault: !row,
      };
    },

    async savePreferences(user: User, body: AlertPreferencesBody): Promise<AlertPreferences> {
      const kinds = alertKinds.filter((kind) => body.kinds.includes(kind));
      await store.repos.alerts.savePreference({
        userId: user.id,
        delivery: body.delivery,
        kinds,
        updatedAt: new Date().toISOString(),
      });
      return this.preferences(user);
    },

    /**
     * What an unsubscribe link would stop, without changing anything (the page a GET shows);
     * null when the token is not one Lotwise signed or the person is gone. `alreadyOff` when
     * they get none of those e-mails any more.
     */
    async readUnsubscribe(
      token: string,
    ): Promise<(UnsubscribeClaim & { email: string; alreadyOff: boolean }) | null> {
      const claim = readUnsubscribeToken(config.jwtSecret, token);
      if (!claim) return null;
      const user = await store.repos.users.findById(claim.userId);
      if (!user) return null;
      const [row] = await store.repos.alerts.findPreferences([user.id]);
      const current = row?.kinds ?? defaultKinds(user.role);
      const alreadyOff =
        claim.kind === 'all' ? current.length === 0 : !current.includes(claim.kind);
      return { ...claim, email: user.email, alreadyOff };
    },

    /** Applies an unsubscribe link (a POST); null when the token is not one Lotwise signed. */
    async unsubscribe(
      token: string,
    ): Promise<(UnsubscribeClaim & { email: string; kinds: AlertKind[] }) | null> {
      const claim = readUnsubscribeToken(config.jwtSecret, token);
      if (!claim) return null;
      return store.transaction(async (repos) => {
        const user = await repos.users.findById(claim.userId);
        if (!user) return null;
        const [row] = await repos.alerts.findPreferences([user.id]);
        const current = row?.kinds ?? defaultKinds(user.role);
        const kinds = claim.kind === 'all' ? [] : current.filter((k) => k !== claim.kind);
        await repos.alerts.savePreference({
          userId: user.id,
          delivery: row?.delivery ?? 'immediate',
          kinds,
          updatedAt: new Date().toISOString(),
        });
        return { ...claim, email: user.email, kinds };
      });
    },

    unsubscribeUrl,
    preferencesUrl: `${config.publicUrl}/alerts/preferences`,

    async listOutbox(query: OutboxListQuery): Promise<Page<OutboxMessage>> {
      const { rows, total } = await store.repos.alerts.listMessages(query);
      return { items: rows.map(presentOutbox), total, page: query.page, pageSize: query.pageSize };
    },

    async getOutbox(id: number): Promise<OutboxMessageDetail> {
      const row = await store.repos.alerts.findMessage(id);
      if (!row) throw AppError.notFound(`There is no outbox message #${id}.`);
      return { ...presentOutbox(row), text: row.text, html: row.html };
    },

    /** Queues a message again at once (failed, sent or waiting); not while it is being sent. */
    async resend(id: number, now = new Date()): Promise<OutboxMessageDetail> {
      await store.transaction(async (repos) => {
        const row = await repos.alerts.findMessage(id);
        if (!row) throw AppError.notFound(`There is no outbox message #${id}.`);
        if (row.status === 'sending') {
          throw AppError.conflict(`Message #${id} is being sent right now; try again shortly.`);
        }
        await repos.alerts.updateMessages([id], {
          status: 'queued',
          attempts: 0,
          nextAttemptAt: now.toISOString(),
          claimedBy: null,
          leaseUntil: null,
          updatedAt: now.toISOString(),
        });
      });
      options.onQueued?.();
      return this.getOutbox(id);
    },
  };
}
export type AlertsService = ReturnType<typeof alertsService>;
