import type { ReactNode } from 'react';
import { Outlet } from 'react-router';
import type { Permission } from '@lotwise/shared';
import { useCan } from '../../lib/auth';
import { ForbiddenPage } from './status-pages';

/** Shows the page (or, without children, the nested routes) only to roles holding the permission. */
export function RequirePermission({
  permission,
  children,
}: {
  permission: Permission;
  children?: ReactNode;
}) {
  const allowed = useCan(permission);
  if (!allowed) return <ForbiddenPage />;
  return children ?? <Outlet />;
}
