import { addDays } from '@lotwise/chem';
import {
  can,
  formatDate,
  formatDateTime,
  formatMoney,
  formatQuantity,
  safetyDeferral,
  todayIso,
  todayItemsPerSection,
  todaySectionPermissions,
  type Alert,
  type GhsCode,
  type OrderStatus,
  type Today,
  type TodayChemical,
  type TodayItem,
  type TodaySection,
  type TodaySectionKey,
  type User,
} from '@lotwise/shared';
import type { Config } from '../../config';
import type { Repositories, Store } from '../../db/store';
import type { AlertsService } from '../alerts/alerts.service';
import { claimsOpen, paymentsOpen } from '../orders/order-lifecycle';
import { shareFigures } from '../receiving/money';
import { labAreasNearLimits } from '../lab-areas/lab-areas.service';
import { segregationService } from '../segregation/segregation.service';
import { stockCheckOf } from '../plans/stock-check';
import type { TodayPlanRow, TodayShareRow } from './today.repository';

const limit = todayItemsPerSection;

/** "1 bench", "4 benches". */
function count(n: number, one: string, many: string): string {
  return `${n} ${n === 1 ? one : many}`;
}

function section(items: TodayItem[], total: number, moreLink: string): TodaySection {
  return { total, items: items.slice(0, limit), moreLink };
}

/** Where an order shows up for the member: what they are asked to do on it. */
const waitingStatuses: readonly OrderStatus[] = ['open', 'received'];

/**
 * The start page of the signed-in person: each section they may see (the permission of the
 * list it comes from, `todaySectionPermissions`), with its first few items and its total.
 * Every section reads through the service or repository that owns its list — the alert
 * rules, the plans' stock check, the segregation rules, the outbox, the shares' money — so
 * nothing here works a figure out a second way.
 */
export function todayService(store: Store, config: Config, deps: { alerts: AlertsService }) {
  const date = (value: string) => formatDate(value, config.text);

  async function chemicalsOf(repos: Repositories, ids: number[]) {
    const rows = await repos.chemicals.findRows([...new Set(ids)]);
    return new Map<number, TodayChemical>(
      rows.map((row) => [
        row.id,
        { id: row.id, name: row.name, ghsPictograms: row.ghsPictograms as GhsCode[] },
      ]),
    );
  }

  /** Below reorder point, expired and expiring, peroxide tests due: the alert rules' findings. */
  async function stockConditions(now: Date) {
    const found = await deps.alerts.currentWithHazards(now);
    const item = (alert: Alert, ghsPictograms: GhsCode[], status: string): TodayItem => ({
      key: alert.key,
      severity: alert.severity,
      status,
      title: alert.chemical?.name ?? alert.title,
      detail: alert.message,
      notes: [],
      link: alert.link,
      chemicals: alert.chemical ? [{ ...alert.chemical, ghsPictograms }] : [],
      dueOn: alert.dueOn,
    });
    const low: TodayItem[] = [];
    const expiry: TodayItem[] = [];
    const peroxide: TodayItem[] = [];
    for (const { alert, ghsPictograms } of found) {
      if (alert.kind === 'low-stock') {
        const out = alert.severity === 'critical';
        low.push(item(alert, ghsPictograms, out ? 'Out of stock' : 'Low'));
      } else if (alert.kind === 'expired') {
        expiry.push(item(alert, ghsPictograms, 'Expired'));
      } else if (alert.kind === 'expiring') {
        expiry.push(item(alert, ghsPictograms, 'Expires soon'));
      } else if (alert.kind === 'peroxide-due') {
        const overdue = alert.severity === 'critical';
        peroxide.push(item(alert, ghsPictograms, overdue ? 'Test overdue' : 'Test due'));
      }
    }
    return {
      belowReorderPoint: section(low, low.length, '/alerts'),
      expiry: section(expiry, expiry.length, '/alerts'),
      peroxideDue: section(peroxide, peroxide.length, '/alerts'),
    };
  }

  /**
   * Plans from today to the end of the week with the shortfalls of their stock check (the
   * plans module's `stockCheckOf`, run for the listed plans only) and what they hold.
   */
  async function plans(repos: Repositories, today: string, weekEnd: string) {
    const { rows, total } = await repos.today.plansBetween(today, weekEnd, limit);
    const reservations = await repos.plans.reservationsOfPlans(rows.map((row) => row.id));
    const checks = new Map<number, Awaited<ReturnType<typeof stockCheckOf>>['check']>();
    for (const row of rows) checks.set(row.id, (await stockCheckOf(repos, row, today)).check);
    const shortIds = [...checks.values()].flatMap((check) =>
      check.lines.filter((line) => line.status !== 'ok').map((line) => line.chemical.id),
    );
    const chemicals = await chemicalsOf(repos, shortIds);
    const items = rows.map((row: TodayPlanRow): TodayItem => {
      const check = checks.get(row.id)!;
      const short = check.lines.filter((line) => line.status !== 'ok');
      const held = reservations.filter((r) => r.planId === row.id && r.status === 'active');
      const notes = short.map((line) =>
        line.status === 'short'
          ? `${line.chemical.name}: short by ${formatQuantity(line.shortfall, line.unit)}${line.optional ? ' (optional)' : ''}`
          : `${line.chemical.name}: ${line.problem ?? 'the amount cannot be worked out'}`,
      );
      if (held.length > 0) {
        const until = held
          .map((r) => r.until)
          .sort()
          .at(-1)!;
        notes.push(
          `Reserved: ${count(new Set(held.map((r) => r.containerId)).size, 'container', 'containers')} until ${date(until)}.`,
        );
      } else {
        notes.push('Nothing reserved yet.');
      }
      const when = row.plannedOn === today ? 'Today' : date(row.plannedOn);
      return {
        key: `plan:${row.id}`,
        severity: check.ok ? 'info' : row.plannedOn === today ? 'critical' : 'warning',
        status: check.ok
          ? 'Stock covers it'
          : `Short of ${count(check.shortCount, 'reagent', 'reagents')}`,
        title: row.procedureTitle,
        detail: `${when} · ${count(row.benches, 'bench', 'benches')} at ×${row.scaleFactor}${row.authorName ? ` · planned by ${row.authorName}` : ''}`,
        notes,
        link: `/preparations/plans/${row.id}`,
        chemicals: [...new Set(short.map((line) => line.chemical.id))].flatMap((id) =>
          chemicals.has(id) ? [chemicals.get(id)!] : [],
        ),
        dueOn: row.plannedOn,
      };
    });
    return section(items, total, '/preparations/plans');
  }

  async function myOpenRuns(repos: Repositories, actor: User) {
    const { rows, total } = await repos.today.openRunsOf(actor.id, limit);
    const items = rows.map((run): TodayItem => ({
      key: `run:${run.id}`,
      severity: 'info',
      status: 'Open',
      title: run.procedureTitle,
      detail: `Opened ${formatDateTime(run.createdAt, config.text)} at ×${run.scaleFactor}${run.planId === null ? '' : ` from plan #${run.planId}`}; follow its steps at the bench, then record what was used and made.`,
      notes: [],
      link: `/preparations/runs/${run.id}`,
      chemicals: [],
      dueOn: null,
    }));
    return section(items, total, '/preparations/runs');
  }

  async function storageConflicts(repos: Repositories) {
    const found = await segregationService(repos).conflicts();
    const listed = found.items.slice(0, limit);
    const chemicals = await chemicalsOf(
      repos,
      listed.flatMap((c) => [
        ...c.pairs.flatMap((p) => [...p.first, ...p.second].map((x) => x.chemicalId)),
        ...c.mismatches.map((x) => x.chemicalId),
      ]),
    );
    const items = listed.map((conflict): TodayItem => {
      const notes = [
        ...conflict.pairs.map(
          (pair) =>
            `${pair.first.map((c) => `${c.labelCode} (${c.chemicalName})`).join(', ')} with ${pair.second
              .map((c) => `${c.labelCode} (${c.chemicalName})`)
              .join(', ')}: ${pair.reason}`,
        ),
        ...conflict.mismatches.map(
          (c) => `${c.labelCode} (${c.chemicalName}) is not meant to be stored here.`,
        ),
      ];
      const ids = new Set([
        ...conflict.pairs.flatMap((p) => [...p.first, ...p.second].map((c) => c.chemicalId)),
        ...conflict.mismatches.map((c) => c.chemicalId),
      ]);
      return {
        key: `storage:location:${conflict.location.id}`,
        severity: conflict.pairs.length > 0 ? 'warning' : 'info',
        status: conflict.pairs.length > 0 ? 'Store apart' : 'Wrong place',
        title: conflict.location.path,
        detail:
          conflict.pairs.length > 0
            ? `${count(conflict.pairs.length, 'pair of groups', 'pairs of groups')} that must be stored apart.`
            : `${count(conflict.mismatches.length, 'container', 'containers')} of a group this place is not meant for.`,
        notes,
        link: `/stock/locations/${conflict.location.id}`,
        chemicals: [...ids].flatMap((id) => (chemicals.has(id) ? [chemicals.get(id)!] : [])),
        dueOn: null,
      };
    });
    return section(items, found.total, '/stock/segregation');
  }

  async function failedEmails() {
    const page = await deps.alerts.listOutbox({
      status: 'failed',
      q: '',
      page: 1,
      pageSize: limit,
      sort: 'createdAt.desc',
    });
    const items = page.items.map((message): TodayItem => ({
      key: `outbox:${message.id}`,
      severity: 'warning',
      status: 'Not sent',
      title: message.subject,
      detail: `To ${message.recipient.email} · ${count(message.attempts, 'attempt', 'attempts')}${message.lastError ? ` · ${message.lastError}` : ''}`,
      notes: [],
      link: '/admin/outbox',
      chemicals: [],
      dueOn: null,
    }));
    return section(items, page.total, '/admin/outbox');
  }

  /**
   * Orders the person joined that wait for them: claims open (check the claim before they
   * close), a fixed amount still owed (pay), or a received portion (collect).
   */
  async function ordersWaiting(repos: Repositories, actor: User) {
    const shares = await repos.today.sharesOf(actor.id, waitingStatuses);
    const payments = await repos.receiving.paymentsOf(shares.map((s) => s.orderId));
    const chemicals = await chemicalsOf(
      repos,
      shares.map((s) => s.chemicalId),
    );
    const byOrder = new Map<number, TodayShareRow[]>();
    for (const share of shares)
      byOrder.set(share.orderId, [...(byOrder.get(share.orderId) ?? []), share]);
    const items: TodayItem[] = [];
    for (const [orderId, mine] of byOrder) {
      const order = {
        status: mine[0]!.orderStatus,
        claimsClosedAt: mine[0]!.claimsClosedAt,
      };
      const base = {
        key: `order:${orderId}`,
        title: mine[0]!.orderTitle,
        notes: [],
        link: `/orders/${orderId}`,
        chemicals: [...new Set(mine.map((s) => s.chemicalId))].flatMap((id) =>
          chemicals.has(id) ? [chemicals.get(id)!] : [],
        ),
      };
      if (claimsOpen(order)) {
        const deadline = mine[0]!.claimDeadline;
        items.push({
          ...base,
          severity: 'info',
          status: 'To confirm',
          detail: `Claims are open${deadline ? ` until ${date(deadline)}` : ''}: check what you claimed before they close.`,
          dueOn: deadline,
        });
        continue;
      }
      if (paymentsOpen(order)) {
        const owed = mine
          .map(
            (share) =>
              shareFigures(order, { id: share.shareId, amountMinor: share.amountMinor }, payments)
                .owedMinor,
          )
          .reduce((sum, value) => sum + value, 0);
        if (owed > 0) {
          items.push({
            ...base,
            severity: 'warning',
            status: 'To pay',
            detail: `You owe ${formatMoney(owed, mine[0]!.currency, config.text.locale)} for your share.`,
            dueOn: null,
          });
        }
        continue;
      }
      const ready = mine.filter((share) => share.containerId !== null);
      if (order.status === 'received' && ready.length > 0) {
        items.push({
          ...base,
          severity: 'info',
          status: 'To collect',
          detail: `${count(ready.length, 'portion is', 'portions are')} in stock for you: collect ${ready.length === 1 ? 'it' : 'them'}.`,
          dueOn: null,
        });
      }
    }
    return section(items, items.length, '/purchases');
  }

  return {
    async forUser(actor: User, now = new Date()): Promise<Today> {
      const repos = store.repos;
      const today = todayIso(now);
      const weekEnd = addDays(today, 6);
      const may = (key: TodaySectionKey) => can(actor.role, todaySectionPermissions[key]);
      const sections: Today['sections'] = {};
      if (may('belowReorderPoint') || may('expiry') || may('peroxideDue')) {
        const found = await stockConditions(now);
        if (may('belowReorderPoint')) sections.belowReorderPoint = found.belowReorderPoint;
        if (may('expiry')) sections.expiry = found.expiry;
        if (may('peroxideDue')) sections.peroxideDue = found.peroxideDue;
      }
      if (may('plans')) sections.plans = await plans(repos, today, weekEnd);
      if (may('myOpenRuns')) sections.myOpenRuns = await myOpenRuns(repos, actor);
      if (may('storageConflicts')) sections.storageConflicts = await storageConflicts(repos);
      if (may('labAreaLimits')) {
        const found = await labAreasNearLimits(repos);
        sections.labAreaLimits = section(found, found.length, '/stock/lab-areas');
      }
      if (may('failedEmails')) sections.failedEmails = await failedEmails();
      if (may('ordersWaiting')) sections.ordersWaiting = await ordersWaiting(repos, actor);
      return {
        date: today,
        weekEnd,
        expiryWindowDays: config.alerts.expiryDays,
        sections,
        safetyDeferral,
      };
    },
  };
}
export type TodayService = ReturnType<typeof todayService>;
