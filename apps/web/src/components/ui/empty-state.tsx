import type { ReactNode } from 'react';

export function EmptyState({
  icon,
  title,
  children,
  action,
}: {
  icon?: ReactNode;
  title: ReactNode;
  children?: ReactNode;
  action?: ReactNode;
}) {
  return (
    <div className="flex flex-col items-center gap-3 px-6 py-12 text-center">
      {icon && <div className="text-ink-400 [&_svg]:size-8">{icon}</div>}
      <div className="max-w-md">
        <p className="font-semibold text-ink-900">{title}</p>
        {children && <div className="mt-1 text-sm text-ink-600">{children}</div>}
      </div>
      {action}
    </div>
  );
}
