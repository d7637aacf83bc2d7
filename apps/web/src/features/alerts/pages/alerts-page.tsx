import { useState, type ReactNode } from 'react';
import { Link } from 'react-router';
import { BellOff, CircleAlert, Info, RefreshCw, Settings, TriangleAlert } from 'lucide-react';
import {
  countOf,
  alertKindLabels,
  alertKinds,
  safetyDeferral,
  type AlertKind,
  type AlertSeverity,
} from '@lotwise/shared';
import { Badge, type BadgeTone } from '../../../components/ui/badge';
import { Button, buttonClasses } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { Select } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { PageSpinner } from '../../../components/ui/spinner';
import { errorMessage } from '../../../lib/api-client';
import { useCan } from '../../../lib/auth';
import { formatDate, formatDateTime } from '../../../lib/format';
import { alertPaths, useCurrentAlerts, useEvaluateAlerts } from '../api';

const severityBadge: Record<AlertSeverity, { tone: BadgeTone; label: string; icon: ReactNode }> = {
  critical: {
    tone: 'danger',
    label: 'Act now',
    icon: <CircleAlert aria-hidden="true" />,
  },
  warning: {
    tone: 'warn',
    label: 'Needs attention',
    icon: <TriangleAlert aria-hidden="true" />,
  },
  info: { tone: 'neutral', label: 'Heads-up', icon: <Info aria-hidden="true" /> },
};

/** Alerts: what needs attention in the stock now, worked out live (no e-mail needed). */
export function AlertsPage() {
  const [kind, setKind] = useState<AlertKind | ''>('');
  const alerts = useCurrentAlerts(kind || undefined);
  const mayEvaluate = useCan('outbox.manage');
  const evaluate = useEvaluateAlerts();

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-xl font-semibold text-ink-900">Alerts</h1>
          <p className="text-sm text-ink-600">
            Low stock, expiry dates and peroxide tests, as they stand right now.
          </p>
        </div>
        <div className="flex flex-wrap items-center gap-2">
          <label className="flex items-center gap-2 text-sm text-ink-700">
            Show
            <Select
              value={kind}
              onChange={(event) => setKind(event.target.value as AlertKind | '')}
              className="w-64"
            >
              <option value="">Every kind</option>
              {alertKinds.slice(0, 5).map((k) => (
                <option key={k} value={k}>
                  {alertKindLabels[k]}
                </option>
              ))}
            </Select>
          </label>
          <Link to={alertPaths.preferences} className={buttonClasses('ghost')}>
            <Settings aria-hidden="true" className="size-4" />
            E-mail settings
          </Link>
          {mayEvaluate && (
            <Button
              icon={<RefreshCw aria-hidden="true" className="size-4" />}
              busy={evaluate.isPending}
              onClick={() => evaluate.mutate()}
            >
              Check and e-mail now
            </Button>
          )}
        </div>
      </div>

      {evaluate.isSuccess && (
        <Notice tone="ok" title="Checked">
          {countOf(evaluate.data.conditions, 'condition')} found,{' '}
          {countOf(evaluate.data.queued, 'e-mail')} queued, {evaluate.data.duplicates} already sent
          within the window.
        </Notice>
      )}
      {evaluate.isError && <Notice tone="danger">{errorMessage(evaluate.error)}</Notice>}

      {alerts.isPending ? (
        <PageSpinner label="Checking the stock…" />
      ) : alerts.isError ? (
        <ErrorState error={alerts.error} onRetry={() => void alerts.refetch()} />
      ) : alerts.data.items.length === 0 ? (
        <EmptyState icon={<BellOff aria-hidden="true" />} title="Nothing needs attention">
          No chemical is at or below its reorder point, and nothing expires or is due a peroxide
          test in the next {alerts.data.expiryWindowDays} days.
        </EmptyState>
      ) : (
        <ul className="flex flex-col divide-y divide-ink-100 rounded-lg border border-ink-200 bg-white">
          {alerts.data.items.map((alert) => {
            const badge = severityBadge[alert.severity];
            return (
              <li key={alert.key} className="flex flex-col gap-1 px-4 py-3 sm:flex-row sm:gap-4">
                <div className="w-36 shrink-0">
                  <Badge tone={badge.tone} icon={badge.icon}>
                    {badge.label}
                  </Badge>
                </div>
                <div className="flex-1">
                  <Link
                    to={alert.link}
                    className="font-medium text-ink-900 underline-offset-2 hover:underline"
                  >
                    {alert.title}
                  </Link>
                  <p className="text-sm text-ink-700">{alert.message}</p>
                </div>
                <div className="text-sm text-ink-600 sm:w-40 sm:text-right">
                  {alertKindLabels[alert.kind]}
                  {alert.dueOn && <div>{formatDate(alert.dueOn)}</div>}
                </div>
              </li>
            );
          })}
        </ul>
      )}

      {alerts.data && (
        <p className="text-xs text-ink-500">
          Worked out at {formatDateTime(alerts.data.evaluatedAt)}. {safetyDeferral}
        </p>
      )}
    </div>
  );
}
