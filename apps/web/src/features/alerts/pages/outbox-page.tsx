import { useState, type ReactNode } from 'react';
import { CircleAlert, CircleCheck, Clock, Mail, Send } from 'lucide-react';
import { outboxStatuses, type OutboxStatus } from '@lotwise/shared';
import { Badge, type BadgeTone } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { Select } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { Pagination } from '../../../components/ui/pagination';
import { PageSpinner } from '../../../components/ui/spinner';
import { errorMessage } from '../../../lib/api-client';
import { formatDateTime } from '../../../lib/format';
import { useOutbox, useOutboxMessage, useResendOutboxMessage } from '../api';
import { TableScroll } from '../../../components/ui/table-scroll';

const statusBadge: Record<OutboxStatus, { tone: BadgeTone; icon: ReactNode }> = {
  queued: { tone: 'neutral', icon: <Clock aria-hidden="true" /> },
  sending: { tone: 'accent', icon: <Send aria-hidden="true" /> },
  sent: { tone: 'ok', icon: <CircleCheck aria-hidden="true" /> },
  failed: { tone: 'danger', icon: <CircleAlert aria-hidden="true" /> },
};

/** Admin: every e-mail Lotwise queued, with status, attempts and errors; resend from here. */
export function OutboxPage() {
  const [status, setStatus] = useState<OutboxStatus | ''>('');
  const [page, setPage] = useState(1);
  const [pageSize, setPageSize] = useState(25);
  const [openId, setOpenId] = useState<number | null>(null);
  const outbox = useOutbox({ status: status || undefined, q: '', page, pageSize });
  const open = useOutboxMessage(openId);
  const resend = useResendOutboxMessage();

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-xl font-semibold text-ink-900">Outbox</h1>
          <p className="text-sm text-ink-600">
            Every alert e-mail, kept with its attempts and last error. Failed messages are never
            dropped: resend them once the mail server works.
          </p>
        </div>
        <label className="flex items-center gap-2 text-sm text-ink-700">
          Status
          <Select
            value={status}
            onChange={(event) => {
              setStatus(event.target.value as OutboxStatus | '');
              setPage(1);
            }}
            className="w-36"
          >
            <option value="">All</option>
            {outboxStatuses.map((s) => (
              <option key={s} value={s}>
                {s}
              </option>
            ))}
          </Select>
        </label>
      </div>

      {resend.isError && <Notice tone="danger">{errorMessage(resend.error)}</Notice>}

      {outbox.isPending ? (
        <PageSpinner label="Loading the outbox…" />
      ) : outbox.isError ? (
        <ErrorState error={outbox.error} onRetry={() => void outbox.refetch()} />
      ) : outbox.data.total === 0 ? (
        <EmptyState icon={<Mail aria-hidden="true" />} title="No messages">
          Nothing {status ? `is ${status}` : 'was queued yet'}.
        </EmptyState>
      ) : (
        <>
          <TableScroll className="rounded-lg border border-ink-200 bg-white">
            <table className="w-full text-left text-sm">
              <thead className="bg-ink-50 text-ink-700">
                <tr>
                  <th className="px-3 py-2">Queued</th>
                  <th className="px-3 py-2">To</th>
                  <th className="px-3 py-2">Subject</th>
                  <th className="px-3 py-2">Status</th>
                  <th className="px-3 py-2">Attempts</th>
                  <th className="px-3 py-2">Last error</th>
                  <th className="px-3 py-2" aria-label="Actions" />
                </tr>
              </thead>
              <tbody className="divide-y divide-ink-100">
                {outbox.data.items.map((message) => (
                  <tr key={message.id}>
                    <td className="px-3 py-2 whitespace-nowrap">
                      {formatDateTime(message.createdAt)}
                    </td>
                    <td className="px-3 py-2">
                      {message.recipient.displayName ?? message.recipient.email}
                      <div className="text-xs text-ink-500">{message.recipient.email}</div>
                    </td>
                    <td className="px-3 py-2">
                      <button
                        type="button"
                        className="text-left underline-offset-2 hover:underline"
                        onClick={() => setOpenId(message.id === openId ? null : message.id)}
                      >
                        {message.subject}
                      </button>
                      {message.delivery === 'digest' && (
                        <div className="text-xs text-ink-500">daily digest</div>
                      )}
                    </td>
                    <td className="px-3 py-2">
                      <Badge
                        tone={statusBadge[message.status].tone}
                        icon={statusBadge[message.status].icon}
                      >
                        {message.status}
                      </Badge>
                      {message.status === 'queued' && message.nextAttemptAt && (
                        <div className="text-xs text-ink-500">
                          next {formatDateTime(message.nextAttemptAt)}
                        </div>
                      )}
                    </td>
                    <td className="px-3 py-2 tabular-nums">{message.attempts}</td>
                    <td className="max-w-xs px-3 py-2 text-xs break-words text-ink-700">
                      {message.lastError ?? '—'}
                    </td>
                    <td className="px-3 py-2">
                      {message.status !== 'sending' && (
                        <Button
                          size="sm"
                          busy={resend.isPending && resend.variables === message.id}
                          onClick={() => resend.mutate(message.id)}
                        >
                          Resend
                        </Button>
                      )}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </TableScroll>
          <Pagination
            page={page}
            pageCount={Math.ceil(outbox.data.total / pageSize)}
            pageSize={pageSize}
            total={outbox.data.total}
            noun="messages"
            onPageChange={setPage}
            onPageSizeChange={(size) => {
              setPageSize(size);
              setPage(1);
            }}
          />
        </>
      )}

      {openId !== null && open.data && (
        <section className="rounded-lg border border-ink-200 bg-white p-4">
          <h2 className="mb-2 font-semibold text-ink-900">{open.data.subject}</h2>
          <pre className="text-sm whitespace-pre-wrap text-ink-800">{open.data.text}</pre>
        </section>
      )}
    </div>
  );
}
