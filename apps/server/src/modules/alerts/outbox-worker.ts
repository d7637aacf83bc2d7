import { alertKinds, type AlertKind } from '@lotwise/shared';
import type { Config } from '../../config';
import type { Store } from '../../db/store';
import { createLogger, type Logger } from '../../lib/logger';
import { digestContent, footer, htmlDocument, kindLabel, type FooterLinks } from './messages';
import type { OutboxRow } from './outbox-message.entity';
import { unsubscribeToken } from './unsubscribe-token';

/** What the worker needs from a mail transport (nodemailer's `Transporter` fits). */
export interface MailTransport {
  sendMail(mail: {
    from: string;
    to: string;
    subject: string;
    text: string;
    html: string;
    headers?: Record<string, string>;
  }): Promise<unknown>;
}

/** Seconds to wait after the n-th failed attempt (1-based): 30 s, 2 min, 10 min, … 6 h. */
const retryDelays = [30, 120, 600, 1800, 3600, 7200, 14400, 21600];

export function retryDelaySeconds(failedAttempts: number): number {
  return retryDelays[Math.min(Math.max(failedAttempts, 1), retryDelays.length) - 1]!;
}

/** A message left `sending` this long was interrupted (the process stopped) and is sent again. */
const staleSendingMs = 10 * 60_000;

export interface OutboxWorkerOptions {
  store: Store;
  transport: MailTransport;
  config: Config;
  logger?: Logger;
  /** The time; tests move it forward instead of waiting. */
  clock?: () => Date;
  batchSize?: number;
}

export interface OutboxRunResult {
  /** Messages taken from the outbox in this run (at most the batch size). */
  claimed: number;
  sent: number;
  retrying: number;
  failed: number;
}

/**
 * Sends what the outbox holds: immediate messages one by one, digest messages of one person
 * together in one e-mail. A failed send keeps its error and is tried again after a growing
 * delay; after `outboxMaxAttempts` it is marked failed (an admin can resend it).
 */
export function outboxWorker({
  store,
  transport,
  config,
  logger = createLogger(config.logLevel),
  clock = () => new Date(),
  batchSize = 50,
}: OutboxWorkerOptions) {
  let timer: NodeJS.Timeout | null = null;
  let running: Promise<OutboxRunResult> | null = null;
  let again = false;

  const links = (userId: number | null, kinds: string[]): FooterLinks => {
    const unsubscribe: FooterLinks['unsubscribe'] = [];
    if (userId !== null) {
      for (const kind of new Set(kinds as AlertKind[])) {
        if (!alertKinds.includes(kind)) continue;
        const token = unsubscribeToken(config.jwtSecret, { userId, kind });
        unsubscribe.push({
          kind,
          label: `Stop e-mails about: ${kindLabel(kind).toLowerCase()}`,
          url: `${config.publicUrl}/api/alerts/unsubscribe?token=${token}`,
        });
      }
      const all = unsubscribeToken(config.jwtSecret, { userId, kind: 'all' });
      unsubscribe.push({
        kind: 'all',
        label: 'Stop all Lotwise alert e-mails',
        url: `${config.publicUrl}/api/alerts/unsubscribe?token=${all}`,
      });
    }
    return { unsubscribe, preferencesUrl: `${config.publicUrl}/alerts/preferences` };
  };

  /** The e-mail for a group of rows of one recipient (one row, or a digest of several). */
  function compose(rows: OutboxRow[]) {
    const first = rows[0]!;
    const kinds = rows.map((r) => r.kind);
    const content =
      rows.length === 1
        ? { subject: first.subject, text: first.text, html: first.html }
        : digestContent(rows);
    const footerLinks = links(first.userId, kinds);
    const end = footer(footerLinks);
    const oneClick = footerLinks.unsubscribe.at(rows.length === 1 ? 0 : -1);
    return {
      from: config.mail.from,
      to: first.recipientEmail,
      subject: content.subject,
      text: `${content.text}\n\n${end.text}\n`,
      html: htmlDocument(content.subject, `${content.html}${end.html}`),
      headers: {
        'Auto-Submitted': 'auto-generated',
        ...(oneClick
          ? {
              'List-Unsubscribe': `<${oneClick.url}>`,
              'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click',
            }
          : {}),
      } as Record<string, string>,
    };
  }

  async function runOnce(): Promise<OutboxRunResult> {
    const result: OutboxRunResult = { claimed: 0, sent: 0, retrying: 0, failed: 0 };
    const now = clock();
    const claimed = await store.transaction(async (repos) => {
      const due = await repos.alerts.dueMessages(
        now.toISOString(),
        new Date(now.getTime() - staleSendingMs).toISOString(),
        batchSize,
      );
      await repos.alerts.updateMessages(
        due.map((r) => r.id),
        { status: 'sending', updatedAt: now.toISOString() },
      );
      return due;
    });
    result.claimed = claimed.length;
    // Immediate messages alone; digest messages grouped per recipient.
    const groups: OutboxRow[][] = [];
    const digests = new Map<string, OutboxRow[]>();
    for (const row of claimed) {
      if (row.delivery !== 'digest') groups.push([row]);
      else {
        const key = row.recipientEmail;
        if (!digests.has(key)) digests.set(key, []);
        digests.get(key)!.push(row);
      }
    }
    groups.push(...digests.values());

    for (const rows of groups) {
      const ids = rows.map((r) => r.id);
      try {
        await transport.sendMail(compose(rows));
        const at = clock().toISOString();
        await store.transaction(async (repos) => {
          for (const row of rows) {
            await repos.alerts.updateMessages([row.id], {
              status: 'sent',
              attempts: row.attempts + 1,
              sentAt: at,
              nextAttemptAt: null,
              updatedAt: at,
            });
          }
        });
        result.sent += rows.length;
      } catch (error) {
        const message = (error instanceof Error ? error.message : String(error)).slice(0, 2000);
        const at = clock();
        await store.transaction(async (repos) => {
          for (const row of rows) {
            const attempts = row.attempts + 1;
            const givingUp = attempts >= config.alerts.outboxMaxAttempts;
            await repos.alerts.updateMessages([row.id], {
              status: givingUp ? 'failed' : 'queued',
              attempts,
              lastError: message,
              nextAttemptAt: givingUp
                ? null
                : new Date(at.getTime() + retryDelaySeconds(attempts) * 1000).toISOString(),
              updatedAt: at.toISOString(),
            });
            if (givingUp) result.failed++;
            else result.retrying++;
          }
        });
        logger.warn('Could not send e-mail; it stays in the outbox', {
          ids,
          to: rows[0]!.recipientEmail,
          error: message,
        });
      }
    }
    return result;
  }

  /** Runs once, or once more after the current run when one is in progress. */
  function run(): Promise<OutboxRunResult> {
    if (running) {
      again = true;
      return running;
    }
    running = drain()
      .catch((error: unknown) => {
        logger.error('Outbox worker failed', {
          error: error instanceof Error ? error.message : String(error),
        });
        return { claimed: 0, sent: 0, retrying: 0, failed: 0 };
      })
      .finally(() => {
        running = null;
        if (again) {
          again = false;
          void run();
        }
      });
    return running;
  }

  /** Runs until less than a full batch was due (what fails waits for its next attempt). */
  async function drain(): Promise<OutboxRunResult> {
    const total: OutboxRunResult = { claimed: 0, sent: 0, retrying: 0, failed: 0 };
    for (;;) {
      const one = await runOnce();
      total.claimed += one.claimed;
      total.sent += one.sent;
      total.retrying += one.retrying;
      total.failed += one.failed;
      if (one.claimed < batchSize) return total;
    }
  }

  return {
    runOnce,
    drain,
    /** Send soon (after the current transaction, which the write queue runs first). */
    kick() {
      if (timer) setImmediate(() => void run());
    },
    start(intervalSeconds = config.alerts.outboxIntervalSeconds) {
      if (timer || intervalSeconds <= 0) return;
      timer = setInterval(() => void run(), intervalSeconds * 1000);
      timer.unref();
      setImmediate(() => void run());
    },
    async stop() {
      if (timer) clearInterval(timer);
      timer = null;
      again = false;
      await running;
    },
  };
}
export type OutboxWorker = ReturnType<typeof outboxWorker>;
