import { useState, type FormEvent } from 'react';
import type { OrderDetail } from '@lotwise/shared';
import { Button } from '../../../components/ui/button';
import { Input } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { errorMessage } from '../../../lib/api-client';
import { useUpdateOrder } from '../api';

/** The coordinator sets the claim deadline (needed to open the order) while claims may change. */
export function DeadlineEditor({ order }: { order: OrderDetail }) {
  const update = useUpdateOrder(order.id);
  const [deadline, setDeadline] = useState(order.claimDeadline ?? '');

  function submit(event: FormEvent) {
    event.preventDefault();
    update.mutate({ claimDeadline: deadline || null });
  }

  return (
    <form onSubmit={submit} className="mt-1 flex flex-col gap-1.5">
      <div className="flex flex-wrap items-center gap-1.5">
        <div className="w-44">
          <Input
            type="date"
            aria-label="Claim deadline"
            value={deadline}
            onChange={(e) => setDeadline(e.target.value)}
          />
        </div>
        <Button type="submit" size="sm" busy={update.isPending}>
          Set deadline
        </Button>
      </div>
      {update.isError && <Notice tone="danger">{errorMessage(update.error)}</Notice>}
    </form>
  );
}
