import {
  feeRuleLabels,
  formatMoney,
  orderStatusLabels,
  sharePaymentStatusLabels,
  type FeeRule,
  type OrderStatus,
  type SharePaymentStatus,
} from '@lotwise/shared';
import {
  Ban,
  CircleCheck,
  CircleDashed,
  FilePen,
  Hourglass,
  PackageCheck,
  Truck,
  Undo2,
  Users,
  Wallet,
  type LucideIcon,
} from 'lucide-react';
import { Badge, type BadgeTone } from '../../components/ui/badge';

interface StatusLook {
  label: string;
  icon: LucideIcon;
  tone: BadgeTone;
}

export const orderStatusLooks: Record<OrderStatus, StatusLook> = {
  draft: { label: orderStatusLabels.draft, icon: FilePen, tone: 'neutral' },
  open: { label: orderStatusLabels.open, icon: Users, tone: 'accent' },
  funded: { label: orderStatusLabels.funded, icon: Wallet, tone: 'ok' },
  ordered: { label: orderStatusLabels.ordered, icon: Truck, tone: 'accent' },
  received: { label: orderStatusLabels.received, icon: PackageCheck, tone: 'ok' },
  closed: { label: orderStatusLabels.closed, icon: CircleCheck, tone: 'neutral' },
  cancelled: { label: orderStatusLabels.cancelled, icon: Ban, tone: 'danger' },
};

const paymentLooks: Record<SharePaymentStatus, StatusLook> = {
  unpaid: { label: sharePaymentStatusLabels.unpaid, icon: CircleDashed, tone: 'warn' },
  pending: { label: sharePaymentStatusLabels.pending, icon: Hourglass, tone: 'neutral' },
  paid: { label: sharePaymentStatusLabels.paid, icon: CircleCheck, tone: 'ok' },
  refunded: { label: sharePaymentStatusLabels.refunded, icon: Undo2, tone: 'neutral' },
};

function LookBadge({ look }: { look: StatusLook }) {
  const Icon = look.icon;
  return (
    <Badge tone={look.tone} icon={<Icon aria-hidden="true" />}>
      {look.label}
    </Badge>
  );
}

/** The order's status in a word and an icon; open orders say whether members still claim. */
export function OrderStatusBadge({
  status,
  claimsClosedAt,
}: {
  status: OrderStatus;
  claimsClosedAt: string | null;
}) {
  if (status === 'open') {
    return (
      <LookBadge
        look={
          claimsClosedAt
            ? { label: 'Open: members pay', icon: Wallet, tone: 'warn' }
            : { label: 'Open for claims', icon: Users, tone: 'accent' }
        }
      />
    );
  }
  return <LookBadge look={orderStatusLooks[status]} />;
}

export function PaymentStatusBadge({ status }: { status: SharePaymentStatus }) {
  return <LookBadge look={paymentLooks[status]} />;
}

/** How the fees are shared, said plainly. */
export const feeRuleExplanations: Record<FeeRule, string> = {
  value:
    'Shipping and hazardous-goods fees are shared in proportion to what each share’s goods cost.',
  member: 'Shipping and hazardous-goods fees are shared equally by everyone with a share.',
  mass: 'Shipping and hazardous-goods fees are shared in proportion to each share’s mass (liquids weighed through their density).',
};

export function feeRuleLabel(rule: FeeRule): string {
  return feeRuleLabels[rule];
}

/** Minor units in the reader's own locale (the browser's), e.g. €12.34 or 12,34 €. */
export function money(minor: number, currency: string): string {
  return formatMoney(minor, currency, undefined);
}
