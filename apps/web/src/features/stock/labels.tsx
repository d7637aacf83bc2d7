import type { ContainerStatus, LedgerReason, LocationKind, ReorderStatus } from '@lotwise/shared';
import {
  ArrowRightLeft,
  CircleCheck,
  CircleDashed,
  CircleMinus,
  Clock,
  Hourglass,
  Lock,
  PackageOpen,
  PackagePlus,
  Scale,
  Scissors,
  Trash2,
  TrendingDown,
  TriangleAlert,
  type LucideIcon,
} from 'lucide-react';
import { Badge, type BadgeTone } from '../../components/ui/badge';
import { daysBetween, relativeDays, todayIsoDate } from '../../lib/dates';
import { formatDate } from '../../lib/format';

interface StatusLook {
  label: string;
  icon: LucideIcon;
  tone: BadgeTone;
}

export const containerStatusLooks: Record<ContainerStatus, StatusLook> = {
  sealed: { label: 'Sealed', icon: Lock, tone: 'neutral' },
  open: { label: 'Open', icon: PackageOpen, tone: 'accent' },
  empty: { label: 'Empty', icon: CircleDashed, tone: 'warn' },
  disposed: { label: 'Disposed', icon: Trash2, tone: 'neutral' },
};

export const reorderStatusLooks: Record<ReorderStatus, StatusLook> = {
  below: { label: 'Below reorder point', icon: TrendingDown, tone: 'danger' },
  at: { label: 'At reorder point', icon: TriangleAlert, tone: 'warn' },
  ok: { label: 'OK', icon: CircleCheck, tone: 'ok' },
  none: { label: 'No reorder point', icon: CircleMinus, tone: 'neutral' },
};

export const ledgerReasonLooks: Record<LedgerReason, { label: string; icon: LucideIcon }> = {
  received: { label: 'Received', icon: PackagePlus },
  drawn: { label: 'Drawn', icon: Scale },
  adjusted: { label: 'Adjusted', icon: CircleCheck },
  transferred: { label: 'Moved', icon: ArrowRightLeft },
  disposed: { label: 'Disposed', icon: Trash2 },
  split: { label: 'Split', icon: Scissors },
};

export const locationKindLabels: Record<LocationKind, string> = {
  room: 'Room',
  cabinet: 'Cabinet',
  shelf: 'Shelf',
  fridge: 'Fridge',
  other: 'Other',
};

function StatusBadge({ look }: { look: StatusLook }) {
  const Icon = look.icon;
  return (
    <Badge tone={look.tone} icon={<Icon aria-hidden="true" />}>
      {look.label}
    </Badge>
  );
}

export function ContainerStatusBadge({ status }: { status: ContainerStatus }) {
  return <StatusBadge look={containerStatusLooks[status]} />;
}

export function ReorderStatusBadge({ status }: { status: ReorderStatus }) {
  return <StatusBadge look={reorderStatusLooks[status]} />;
}

/** An expiry date with words: "expired 3 days ago", "expires in 12 days", or the plain date. */
export function ExpiryText({
  expiresOn,
  expired,
  soonDays = 30,
}: {
  expiresOn: string | null;
  expired: boolean;
  soonDays?: number;
}) {
  if (!expiresOn) return <span className="text-ink-600">No expiry date</span>;
  const days = daysBetween(todayIsoDate(), expiresOn);
  const date = <span className="tabular-nums">{formatDate(expiresOn)}</span>;
  if (expired || days < 0) {
    return (
      <span className="flex flex-col items-start gap-0.5">
        {date}
        <Badge tone="danger" icon={<Hourglass aria-hidden="true" />}>
          Expired {relativeDays(days)}
        </Badge>
      </span>
    );
  }
  if (days <= soonDays) {
    return (
      <span className="flex flex-col items-start gap-0.5">
        {date}
        <Badge tone="warn" icon={<Clock aria-hidden="true" />}>
          Expires {relativeDays(days)}
        </Badge>
      </span>
    );
  }
  return date;
}

/** The peroxide test-or-discard date of a peroxide former. */
export function PeroxideDueText({
  peroxide,
}: {
  peroxide: { dueOn: string; overdue: boolean; rule: string } | null;
}) {
  if (!peroxide) return <span className="text-ink-600">—</span>;
  const days = daysBetween(todayIsoDate(), peroxide.dueOn);
  return (
    <span className="flex flex-col items-start gap-0.5" title={peroxide.rule}>
      <span className="tabular-nums">{formatDate(peroxide.dueOn)}</span>
      {peroxide.overdue || days < 0 ? (
        <Badge tone="danger" icon={<TriangleAlert aria-hidden="true" />}>
          Test or discard now
        </Badge>
      ) : days <= 30 ? (
        <Badge tone="warn" icon={<Clock aria-hidden="true" />}>
          Test due {relativeDays(days)}
        </Badge>
      ) : null}
    </span>
  );
}
