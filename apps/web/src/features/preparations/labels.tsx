import type { LineRole, PlanStatus, RunStatus, StockCheckLine } from '@lotwise/shared';
import {
  Ban,
  CircleCheck,
  CircleHelp,
  CircleDashed,
  FilePen,
  Hourglass,
  Lock,
  TriangleAlert,
  type LucideIcon,
} from 'lucide-react';
import { Badge, type BadgeTone } from '../../components/ui/badge';

interface StatusLook {
  label: string;
  icon: LucideIcon;
  tone: BadgeTone;
}

export const roleLabels: Record<LineRole, string> = {
  'limiting-reagent': 'Limiting reagent',
  reagent: 'Reagent',
  solvent: 'Solvent',
  catalyst: 'Catalyst',
  'work-up': 'Work-up',
  product: 'Product',
};

export const planStatusLooks: Record<PlanStatus, StatusLook> = {
  draft: { label: 'Draft: nothing held', icon: FilePen, tone: 'neutral' },
  reserved: { label: 'Reserved', icon: Lock, tone: 'accent' },
  recorded: { label: 'Run recorded', icon: CircleCheck, tone: 'ok' },
  cancelled: { label: 'Cancelled', icon: Ban, tone: 'neutral' },
  lapsed: { label: 'Lapsed: holds nothing', icon: Hourglass, tone: 'warn' },
};

export const runStatusLooks: Record<RunStatus, StatusLook> = {
  open: { label: 'Not recorded yet', icon: CircleDashed, tone: 'warn' },
  recorded: { label: 'Recorded', icon: CircleCheck, tone: 'ok' },
};

export const stockLineLooks: Record<StockCheckLine['status'], StatusLook> = {
  ok: { label: 'Enough', icon: CircleCheck, tone: 'ok' },
  short: { label: 'Short', icon: TriangleAlert, tone: 'danger' },
  unconvertible: { label: 'Cannot be checked', icon: CircleHelp, tone: 'warn' },
};

export function StatusBadge({ look }: { look: StatusLook }) {
  const Icon = look.icon;
  return (
    <Badge tone={look.tone} icon={<Icon aria-hidden="true" />}>
      {look.label}
    </Badge>
  );
}

export function PlanStatusBadge({ status }: { status: PlanStatus }) {
  return <StatusBadge look={planStatusLooks[status]} />;
}

export function RunStatusBadge({ status }: { status: RunStatus }) {
  return <StatusBadge look={runStatusLooks[status]} />;
}
