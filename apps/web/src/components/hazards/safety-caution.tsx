import { safetyDeferral } from '@lotwise/shared';
import { ShieldAlert } from 'lucide-react';
import { cn } from '../../lib/cn';

/** The line shown wherever hazards appear: Lotwise reminds, it never approves. */
export function SafetyCaution({ className, compact }: { className?: string; compact?: boolean }) {
  return (
    <p
      className={cn(
        'flex items-start gap-2 text-ink-700',
        compact ? 'text-xs' : 'rounded-md border border-warn-200 bg-warn-50 px-3 py-2 text-sm',
        className,
      )}
    >
      <ShieldAlert
        aria-hidden="true"
        className={cn('shrink-0 text-warn-700', compact ? 'mt-px size-3.5' : 'mt-0.5 size-4')}
      />
      <span>{safetyDeferral}</span>
    </p>
  );
}
