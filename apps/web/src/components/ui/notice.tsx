import type { ReactNode } from 'react';
import { CircleAlert, CircleCheck, Info, TriangleAlert } from 'lucide-react';
import { cn } from '../../lib/cn';

type NoticeTone = 'info' | 'ok' | 'warn' | 'danger';

const tones: Record<NoticeTone, { box: string; icon: ReactNode }> = {
  info: { box: 'border-ink-200 bg-white text-ink-800', icon: <Info aria-hidden="true" /> },
  ok: { box: 'border-ok-200 bg-ok-50 text-ok-700', icon: <CircleCheck aria-hidden="true" /> },
  warn: {
    box: 'border-warn-200 bg-warn-50 text-warn-700',
    icon: <TriangleAlert aria-hidden="true" />,
  },
  danger: {
    box: 'border-danger-200 bg-danger-50 text-danger-700',
    icon: <CircleAlert aria-hidden="true" />,
  },
};

/** A boxed message with an icon; errors are announced (`role="alert"`). */
export function Notice({
  tone = 'info',
  title,
  children,
  className,
}: {
  tone?: NoticeTone;
  title?: ReactNode;
  children?: ReactNode;
  className?: string;
}) {
  return (
    <div
      role={tone === 'danger' ? 'alert' : 'status'}
      className={cn(
        'flex gap-2.5 rounded-md border px-3 py-2.5 text-sm [&>svg]:mt-0.5 [&>svg]:size-4 [&>svg]:shrink-0',
        tones[tone].box,
        className,
      )}
    >
      {tones[tone].icon}
      <div className="min-w-0">
        {title && <p className="font-semibold">{title}</p>}
        {children && <div className={title ? 'mt-0.5' : undefined}>{children}</div>}
      </div>
    </div>
  );
}
