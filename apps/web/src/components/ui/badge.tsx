import type { ReactNode } from 'react';
import { cn } from '../../lib/cn';

export type BadgeTone = 'neutral' | 'accent' | 'ok' | 'warn' | 'danger';

const tones: Record<BadgeTone, string> = {
  neutral: 'bg-ink-100 text-ink-700 border-ink-200',
  accent: 'bg-accent-50 text-accent-800 border-accent-200',
  ok: 'bg-ok-50 text-ok-700 border-ok-200',
  warn: 'bg-warn-50 text-warn-700 border-warn-200',
  danger: 'bg-danger-50 text-danger-700 border-danger-200',
};

/** A small label. Status badges always carry a word and an icon, never colour alone. */
export function Badge({
  tone = 'neutral',
  icon,
  children,
  className,
}: {
  tone?: BadgeTone;
  icon?: ReactNode;
  children: ReactNode;
  className?: string;
}) {
  return (
    <span
      className={cn(
        'inline-flex items-center gap-1 rounded border px-1.5 py-px text-xs font-medium whitespace-nowrap [&_svg]:size-3.5',
        tones[tone],
        className,
      )}
    >
      {icon}
      {children}
    </span>
  );
}
