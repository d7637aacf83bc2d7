import { Ban, CircleCheck, CircleDot, PackageCheck, PencilLine, Truck, Wallet } from 'lucide-react';
import { orderStatusLabels, type OrderStatus } from '@lotwise/shared';
import { Badge, type BadgeTone } from '../../../components/ui/badge';

const looks: Record<OrderStatus, { tone: BadgeTone; icon: React.ReactNode }> = {
  draft: { tone: 'neutral', icon: <PencilLine aria-hidden="true" /> },
  open: { tone: 'accent', icon: <CircleDot aria-hidden="true" /> },
  funded: { tone: 'accent', icon: <Wallet aria-hidden="true" /> },
  ordered: { tone: 'accent', icon: <Truck aria-hidden="true" /> },
  received: { tone: 'ok', icon: <PackageCheck aria-hidden="true" /> },
  closed: { tone: 'neutral', icon: <CircleCheck aria-hidden="true" /> },
  cancelled: { tone: 'danger', icon: <Ban aria-hidden="true" /> },
};

/** An order's status in a word with an icon (never colour alone). */
export function OrderStatusBadge({ status }: { status: OrderStatus }) {
  const look = looks[status];
  return (
    <Badge tone={look.tone} icon={look.icon}>
      {orderStatusLabels[status]}
    </Badge>
  );
}
