import { useCallback, useRef, useState } from 'react';
import { Search, UserPlus, Users } from 'lucide-react';
import {
  roleDescriptions,
  roleInSentence,
  roleLabels,
  userListQuerySchema,
  type Role,
  type User,
} from '@lotwise/shared';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog, Dialog } from '../../../components/ui/dialog';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { Input } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { errorMessage } from '../../../lib/api-client';
import { useCurrentUser } from '../../../lib/auth';
import { useListSearchParams } from '../../../lib/list-search-params';
import { useSearchBox } from '../../../lib/use-search-box';
import { useSlashFocus } from '../../../lib/use-slash-focus';
import { useReissueInvite, useUpdateUser, useUsers } from '../api';
import { CreateUserDialog } from '../components/create-user-dialog';
import { InviteLink } from '../components/invite-link';
import { UsersTable, type UserActions } from '../components/users-table';

const sortValues = userListQuerySchema.shape.sort.unwrap().unwrap().options;
const noFilters = [] as const;

type Outcome = { tone: 'ok' | 'danger'; title: string; detail?: string } | null;

export function UsersPage() {
  const { params, update } = useListSearchParams({
    defaultSort: 'displayName.asc',
    sortValues,
    filterKeys: noFilters,
  });
  const users = useUsers({
    q: params.q,
    sort: params.sort,
    page: params.page,
    pageSize: params.pageSize,
  });
  const { data: me } = useCurrentUser();
  const updateUser = useUpdateUser();
  const reissue = useReissueInvite();

  const [creating, setCreating] = useState(false);
  const [deactivating, setDeactivating] = useState<User | null>(null);
  const [roleChange, setRoleChange] = useState<{ user: User; role: Role } | null>(null);
  const [invite, setInvite] = useState<{ user: User; url: string } | null>(null);
  const [outcome, setOutcome] = useState<Outcome>(null);
  const [busyUserId, setBusyUserId] = useState<number | null>(null);

  const searchRef = useRef<HTMLInputElement>(null);
  useSlashFocus(searchRef);
  const commitSearch = useCallback((q: string) => update({ q }, { replace: true }), [update]);
  const [text, setText] = useSearchBox(params.q, commitSearch);

  const patch = useCallback(
    (user: User, change: Parameters<typeof updateUser.mutate>[0]['patch'], done: string) => {
      setBusyUserId(user.id);
      setOutcome(null);
      updateUser.mutate(
        { id: user.id, patch: change },
        {
          onSuccess: () => setOutcome({ tone: 'ok', title: done }),
          onError: (error) =>
            setOutcome({
              tone: 'danger',
              title: `Nothing changed for ${user.displayName}`,
              detail: errorMessage(error),
            }),
          onSettled: () => setBusyUserId(null),
        },
      );
    },
    [updateUser],
  );

  const actions: UserActions = {
    currentUserId: me?.id,
    busyUserId,
    onRoleChange: (user: User, role: Role) => {
      if (role !== user.role) setRoleChange({ user, role });
    },
    onDeactivate: (user: User) => setDeactivating(user),
    onReactivate: (user: User) =>
      patch(user, { active: true }, `${user.displayName} can sign in again.`),
    onReissueInvite: (user: User) => {
      setBusyUserId(user.id);
      setOutcome(null);
      reissue.mutate(user.id, {
        onSuccess: ({ inviteUrl }) => setInvite({ user, url: inviteUrl }),
        onError: (error) =>
          setOutcome({
            tone: 'danger',
            title: `No new link for ${user.displayName}`,
            detail: errorMessage(error),
          }),
        onSettled: () => setBusyUserId(null),
      });
    },
  };

  return (
    <div className="flex flex-col gap-5">
      <header className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-xl font-semibold text-ink-900">People</h1>
          <p className="text-sm text-ink-600">Who may sign in to Lotwise, and with which role.</p>
        </div>
        <Button
          variant="primary"
          onClick={() => setCreating(true)}
          icon={<UserPlus aria-hidden="true" className="size-4" />}
        >
          Add a person
        </Button>
      </header>

      <div role="search" className="flex max-w-md flex-col gap-1">
        <label htmlFor="user-search" className="text-sm font-medium text-ink-800">
          Search
        </label>
        <div className="relative">
          <Search
            aria-hidden="true"
            className="pointer-events-none absolute top-2.5 left-2.5 size-4 text-ink-500"
          />
          <Input
            id="user-search"
            ref={searchRef}
            type="search"
            value={text}
            onChange={(event) => setText(event.target.value)}
            placeholder="Name or e-mail"
            aria-keyshortcuts="/"
            className="pl-8"
          />
        </div>
      </div>

      {outcome && (
        <Notice tone={outcome.tone} title={outcome.title}>
          {outcome.detail}
        </Notice>
      )}

      {users.isError && !users.data ? (
        <ErrorState
          title="The list of people could not be loaded"
          error={users.error}
          onRetry={() => void users.refetch()}
        />
      ) : (
        <UsersTable
          rows={users.data?.items}
          total={users.data?.total ?? 0}
          sort={params.sort}
          page={params.page}
          pageSize={params.pageSize}
          loading={users.isPending}
          refreshing={users.isPlaceholderData && users.isFetching}
          actions={actions}
          onSortChange={(sort) => update({ sort })}
          onPageChange={(page) => update({ page })}
          onPageSizeChange={(pageSize) => update({ pageSize })}
          empty={
            <EmptyState
              icon={<Users />}
              title={params.q ? `Nobody matches “${params.q}”` : 'Nobody here yet'}
            >
              {params.q ? 'Try part of the name or e-mail address.' : 'Add the people of your lab.'}
            </EmptyState>
          }
        />
      )}

      <CreateUserDialog open={creating} onClose={() => setCreating(false)} />

      <ConfirmDialog
        open={deactivating !== null}
        title={`Deactivate ${deactivating?.displayName ?? ''}?`}
        confirmLabel="Deactivate"
        onCancel={() => setDeactivating(null)}
        onConfirm={() => {
          if (deactivating)
            patch(
              deactivating,
              { active: false },
              `${deactivating.displayName} can no longer sign in.`,
            );
          setDeactivating(null);
        }}
      >
        <p>
          They can no longer sign in. Their records — runs, ledger entries, order shares — stay as
          they are. You can reactivate them at any time.
        </p>
      </ConfirmDialog>

      <ConfirmDialog
        open={roleChange !== null}
        title={`Change the role of ${roleChange?.user.displayName ?? ''}?`}
        confirmLabel={roleChange ? `Make them ${roleInSentence[roleChange.role]}` : 'Change'}
        onCancel={() => setRoleChange(null)}
        onConfirm={() => {
          if (roleChange) {
            const { user, role } = roleChange;
            patch(user, { role }, `${user.displayName} is now ${roleInSentence[role]}.`);
          }
          setRoleChange(null);
        }}
      >
        {roleChange && (
          <>
            <p>
              {roleChange.user.displayName} is {roleInSentence[roleChange.user.role]} and becomes{' '}
              {roleInSentence[roleChange.role]}. The change takes effect at their next request.
            </p>
            <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1">
              <dt className="font-medium">Now: {roleLabels[roleChange.user.role]}</dt>
              <dd>{roleDescriptions[roleChange.user.role]}</dd>
              <dt className="font-medium">Then: {roleLabels[roleChange.role]}</dt>
              <dd>{roleDescriptions[roleChange.role]}</dd>
            </dl>
          </>
        )}
      </ConfirmDialog>

      <Dialog
        open={invite !== null}
        onClose={() => setInvite(null)}
        title={`New invitation link for ${invite?.user.displayName ?? ''}`}
        description="Any earlier link for them no longer works."
        footer={
          <Button variant="primary" onClick={() => setInvite(null)}>
            Done
          </Button>
        }
      >
        {invite && <InviteLink url={invite.url} name={invite.user.displayName} />}
      </Dialog>
    </div>
  );
}
