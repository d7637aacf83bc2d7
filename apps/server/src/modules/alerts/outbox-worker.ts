import { createHash, randomUUID } from 'node:crypto';
import { alertKinds, type AlertKind } from '@lotwise/shared';
import type { Config } from '../../config';
import type { Repositories, Store } from '../../db/store';
import { createLogger, type Logger } from '../../lib/logger';
import {
  digestContent,
  footer,
  htmlDocument,
  kindLabel,
  textToHtml,
  type FooterLinks,
} from './messages';
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
    /** The Message-ID header, angle brackets included (nodemailer's `messageId`). */
    messageId?: string;
  }): Promise<unknown>;
}

/** Seconds to wait after the n-th failed attempt (1-based): 30 s, 2 min, 10 min, … 6 h. */
const retryDelays = [30, 120, 600, 1800, 3600, 7200, 14400, 21600];

export function retryDelaySeconds(failedAttempts: number): number {
  return retryDelays[Math.min(Math.max(failedAttempts, 1), retryDelays.length) - 1]!;
}

/**
 * The Message-ID of the e-mail carrying these outbox rows, the same on every attempt. A
 * sender that dies after the mail server accepted an e-mail but before the database recorded
 * it as sent leaves the row claimed; once the lease runs out the e-mail goes out again, and
 * the second copy carries the first one's Message-ID, so mail systems and people can tell it
 * is the same message. The row's id and creation time keep it unique across installations.
 */
export function outboxMessageId(
  rows: Pick<OutboxRow, 'id' | 'createdAt'>[],
  publicUrl: string,
): string {
  const host = new URL(publicUrl).hostname.replace(/[^A-Za-z0-9.-]/g, '') || 'lotwise.invalid';
  const stamp = (row: Pick<OutboxRow, 'id' | 'createdAt'>) =>
    `${row.id}.${Date.parse(row.createdAt).toString(36)}`;
  const part =
    rows.length === 1
      ? stamp(rows[0]!)
      : `digest.${createHash('sha256').update(rows.map(stamp).join(',')).digest('hex').slice(0, 24)}`;
  return `<lotwise.outbox.${part}@${host}>`;
}

/** The kind of the notice an admin gets when a message is given up; never itself noticed. */
export const failedMailKind = 'outbox-failed';

export interface OutboxWorkerOptions {
  store: Store;
  transport: MailTransport;
  config: Config;
  logger?: Logger;
  /** The time; tests move it forward instead of waiting. */
  clock?: () => Date;
  batchSize?: number;
  /**
   * How long a claim holds without renewal (default OUTBOX_LEASE_SECONDS, 45 s). A sender
   * renews it before each e-mail and while the e-mail is being sent; when it stops (crash,
   * restart) the lease runs out and the next run — within the send interval — takes the
   * message again.
   */
  leaseSeconds?: number;
}

export interface OutboxRunResult {
  /** Messages taken from the outbox in this run (at most the batch size). */
  claimed: number;
  sent: number;
  retrying: number;
  failed: number;
  /** Claimed but taken over by another sender before this one got to them (not sent here). */
  lost: number;
}

const emptyResult = (): OutboxRunResult => ({
  claimed: 0,
  sent: 0,
  retrying: 0,
  failed: 0,
  lost: 0,
});

/**
 * The notice every admin gets, in the same transaction that marks a message failed: what
 * was not delivered, to whom, why, and where to resend it.
 */
export function failedMailNotice(
  row: OutboxRow,
  attempts: number,
  error: string,
  publicUrl: string,
) {
  const link = `${publicUrl}/admin/outbox`;
  const subject = `E-mail not delivered: “${row.subject}”`.slice(0, 300);
  const text = [
    `Lotwise gave up sending an e-mail after ${attempts} attempt${attempts === 1 ? '' : 's'}.`,
    `To: ${row.recipientEmail}\nSubject: ${row.subject}\nLast error: ${error}`,
    'The message stays in the outbox as failed. Fix the cause (the address, or the mail server settings), then resend it from the outbox page. The alert it carried is still shown on the Alerts page.',
    `Open in Lotwise: ${link}`,
  ].join('\n\n');
  return { subject, text, html: textToHtml(subject, text, link), link };
}

/**
 * Sends what the outbox holds: immediate messages one by one, digest messages of one person
 * together in one e-mail. Messages are claimed with a lease (`claimed_by`, `lease_until`) in
 * one UPDATE, so two senders never take the same message and a stopped sender's messages are
 * taken again once the lease runs out. A failed send keeps its error and is tried again after
 * a growing delay; the attempt that reaches `outboxMaxAttempts` marks it failed and, in the
 * same transaction, queues a notice to every admin (an admin can resend it).
 */
export function outboxWorker({
  store,
  transport,
  config,
  logger = createLogger(config.logLevel),
  clock = () => new Date(),
  batchSize = 50,
  leaseSeconds = config.alerts.outboxLeaseSeconds,
}: OutboxWorkerOptions) {
  const leaseFrom = (at: Date) => new Date(at.getTime() + leaseSeconds * 1000).toISOString();
  /** While an e-mail is being sent, its claim is renewed three times per lease. */
  const renewEveryMs = (leaseSeconds * 1000) / 3;
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
      messageId: outboxMessageId(rows, config.publicUrl),
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

  /** Queues the failure notice to every active admin, in the caller's transaction. */
  async function tellAdmins(repos: Repositories, row: OutboxRow, attempts: number, error: string) {
    if (row.kind === failedMailKind) return; // a notice that fails is not noticed again
    const notice = failedMailNotice(row, attempts, error, config.publicUrl);
    const at = clock().toISOString();
    const admins = (await repos.alerts.recipients()).filter((p) => p.role === 'admin');
    for (const admin of admins) {
      await repos.alerts.insertMessage({
        userId: admin.id,
        recipientEmail: admin.email,
        kind: failedMailKind,
        ...notice,
        dedupKey: `${failedMailKind}:${row.id}`,
        delivery: 'immediate',
        status: 'queued',
        attempts: 0,
        lastError: null,
        nextAttemptAt: at,
        claimedBy: null,
        leaseUntil: null,
        createdAt: at,
        updatedAt: at,
        sentAt: null,
      });
    }
    logger.warn('Gave up sending an e-mail; admins were told', {
      id: row.id,
      to: row.recipientEmail,
      admins: admins.length,
    });
  }

  async function runOnce(): Promise<OutboxRunResult> {
    const result = emptyResult();
    const now = clock();
    // One id per claim: the rows this run took are exactly those carrying it.
    const claimId = `${process.pid}:${randomUUID()}`;
    const claimed = await store.transaction((repos) =>
      repos.alerts.claimDue(claimId, now.toISOString(), leaseFrom(now), batchSize),
    );
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
      // Renew the lease right before sending; a message taken over meanwhile is not sent here.
      const held = await store.transaction((repos) =>
        repos.alerts.renewClaim(ids, claimId, leaseFrom(clock())),
      );
      if (held < ids.length) {
        result.lost += rows.length;
        logger.warn('Another sender took over these e-mails; not sending them here', { ids });
        continue;
      }
      // A slow mail server must not let the lease run out while the e-mail is on its way:
      // another sender would take the message and send it a second time.
      const keep = setInterval(() => {
        store
          .transaction((repos) => repos.alerts.renewClaim(ids, claimId, leaseFrom(clock())))
          .catch((error: unknown) =>
            logger.warn('Could not renew the claim on e-mails being sent', {
              ids,
              error: error instanceof Error ? error.message : String(error),
            }),
          );
      }, renewEveryMs);
      keep.unref();
      try {
        await transport.sendMail(compose(rows));
      } catch (error) {
        const message = (error instanceof Error ? error.message : String(error)).slice(0, 2000);
        const at = clock();
        await store.transaction(async (repos) => {
          for (const row of rows) {
            const attempts = row.attempts + 1;
            const givingUp = attempts >= config.alerts.outboxMaxAttempts;
            const recorded = await repos.alerts.finishClaim(row.id, claimId, {
              status: givingUp ? 'failed' : 'queued',
              attempts,
              lastError: message,
              nextAttemptAt: givingUp
                ? null
                : new Date(at.getTime() + retryDelaySeconds(attempts) * 1000).toISOString(),
              updatedAt: at.toISOString(),
            });
            if (!recorded) result.lost++;
            else if (givingUp) {
              await tellAdmins(repos, row, attempts, message);
              result.failed++;
            } else result.retrying++;
          }
        });
        logger.warn('Could not send e-mail; it stays in the outbox', {
          ids,
          to: rows[0]!.recipientEmail,
          error: message,
        });
        continue;
      } finally {
        clearInterval(keep);
      }
      const at = clock().toISOString();
      await store.transaction(async (repos) => {
        for (const row of rows) {
          const recorded = await repos.alerts.finishClaim(row.id, claimId, {
            status: 'sent',
            attempts: row.attempts + 1,
            sentAt: at,
            nextAttemptAt: null,
            updatedAt: at,
          });
          if (recorded) result.sent++;
          else result.lost++;
        }
      });
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
        return emptyResult();
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
    const total = emptyResult();
    for (;;) {
      const one = await runOnce();
      total.claimed += one.claimed;
      total.sent += one.sent;
      total.retrying += one.retrying;
      total.failed += one.failed;
      total.lost += one.lost;
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
