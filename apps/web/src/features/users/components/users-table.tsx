import { createColumnHelper } from '@tanstack/react-table';
import { CircleCheck, CircleSlash, Mail, RotateCcw, Send, UserX } from 'lucide-react';
import { createContext, use, type ReactNode } from 'react';
import { roleLabels, roles, type Role, type User } from '@lotwise/shared';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { DataTable, type ServerTableFeatures } from '../../../components/ui/data-table';
import { Select } from '../../../components/ui/input';
import { Pagination } from '../../../components/ui/pagination';
import { useServerTable, type ServerTableState } from '../../../components/ui/use-server-table';
import { formatDateTime } from '../../../lib/format';

/** What the rows can ask the page to do. */
export interface UserActions {
  currentUserId: number | undefined;
  busyUserId: number | null;
  onRoleChange: (user: User, role: Role) => void;
  onDeactivate: (user: User) => void;
  onReactivate: (user: User) => void;
  onReissueInvite: (user: User) => void;
}

// Row actions reach the cells through context, so the column definitions stay stable.
const UserActionsContext = createContext<UserActions | null>(null);
function useUserActions(): UserActions {
  const actions = use(UserActionsContext);
  if (!actions) throw new Error('UsersTable cells need UserActionsContext');
  return actions;
}

function NameCell({ user }: { user: User }) {
  const { currentUserId } = useUserActions();
  return (
    <span className="font-medium whitespace-nowrap text-ink-900">
      {user.displayName}
      {user.id === currentUserId && <span className="ml-1.5 font-normal text-ink-600">(you)</span>}
    </span>
  );
}

function RoleCell({ user }: { user: User }) {
  const { busyUserId, onRoleChange } = useUserActions();
  return (
    <Select
      aria-label={`Role of ${user.displayName}`}
      className="h-8 w-28 min-w-24"
      value={user.role}
      disabled={busyUserId === user.id}
      onChange={(event) => onRoleChange(user, event.target.value as Role)}
    >
      {roles.map((r) => (
        <option key={r} value={r}>
          {roleLabels[r]}
        </option>
      ))}
    </Select>
  );
}

function ActionsCell({ user }: { user: User }) {
  const actions = useUserActions();
  const busy = actions.busyUserId === user.id;
  return (
    <div className="flex justify-end gap-1">
      {user.invitePending && (
        <Button
          size="sm"
          variant="ghost"
          disabled={busy}
          title="Make a new invitation link; the old one stops working"
          onClick={() => actions.onReissueInvite(user)}
          icon={<Send aria-hidden="true" className="size-4" />}
        >
          New link
        </Button>
      )}
      {user.active ? (
        <Button
          size="sm"
          variant="ghost"
          disabled={busy}
          onClick={() => actions.onDeactivate(user)}
          icon={<UserX aria-hidden="true" className="size-4" />}
        >
          Deactivate
        </Button>
      ) : (
        <Button
          size="sm"
          variant="ghost"
          disabled={busy}
          onClick={() => actions.onReactivate(user)}
          icon={<RotateCcw aria-hidden="true" className="size-4" />}
        >
          Reactivate
        </Button>
      )}
    </div>
  );
}

/** An address that may break before the `@` when the table is narrow, never inside a part. */
function EmailAddress({ value }: { value: string }) {
  const at = value.indexOf('@');
  if (at < 0) return <span className="whitespace-nowrap">{value}</span>;
  return (
    <span>
      <span className="whitespace-nowrap">{value.slice(0, at)}</span>
      <wbr />
      <span className="whitespace-nowrap">{value.slice(at)}</span>
    </span>
  );
}

const column = createColumnHelper<ServerTableFeatures, User>();

const columns = column.columns([
  column.accessor('displayName', {
    header: 'Name',
    cell: ({ row }) => <NameCell user={row.original} />,
  }),
  column.accessor('email', {
    header: 'E-mail',
    cell: ({ getValue }) => <EmailAddress value={getValue()} />,
  }),
  column.accessor('role', { header: 'Role', cell: ({ row }) => <RoleCell user={row.original} /> }),
  column.display({
    id: 'status',
    header: 'Status',
    cell: ({ row }) => (
      <div className="flex flex-col items-start gap-1">
        {row.original.active ? (
          <Badge tone="ok" icon={<CircleCheck aria-hidden="true" />}>
            Active
          </Badge>
        ) : (
          <Badge tone="neutral" icon={<CircleSlash aria-hidden="true" />}>
            Deactivated
          </Badge>
        )}
        {row.original.invitePending && (
          <Badge tone="warn" icon={<Mail aria-hidden="true" />}>
            Invite pending
          </Badge>
        )}
      </div>
    ),
  }),
  column.accessor('lastLoginAt', {
    header: 'Last sign-in',
    cell: ({ getValue }) => {
      const value = getValue();
      return value ? (
        <span className="whitespace-nowrap tabular-nums">{formatDateTime(value)}</span>
      ) : (
        <span className="text-ink-600">Never</span>
      );
    },
  }),
  column.display({
    id: 'actions',
    header: () => <span className="sr-only">Actions</span>,
    cell: ({ row }) => <ActionsCell user={row.original} />,
  }),
]);

interface UsersTableProps extends ServerTableState<User> {
  loading: boolean;
  refreshing: boolean;
  actions: UserActions;
  empty: ReactNode;
}

export function UsersTable({ loading, refreshing, actions, empty, ...list }: UsersTableProps) {
  const table = useServerTable(columns, (user) => String(user.id), list);

  return (
    <div>
      <UserActionsContext value={actions}>
        <DataTable
          table={table}
          label="People"
          loading={loading}
          refreshing={refreshing}
          empty={empty}
          rowAlign="middle"
        />
      </UserActionsContext>
      {list.total > 0 && (
        <Pagination
          page={list.page}
          pageCount={table.getPageCount()}
          pageSize={list.pageSize}
          total={list.total}
          noun={list.total === 1 ? 'person' : 'people'}
          onPageChange={(next) => table.setPageIndex(next - 1)}
          onPageSizeChange={(next) => table.setPageSize(next)}
        />
      )}
    </div>
  );
}
