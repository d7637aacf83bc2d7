import { useState, type FormEvent } from 'react';
import type { OrderDetail, OrderLine } from '@lotwise/shared';
import { Button } from '../../../components/ui/button';
import { Input } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { errorMessage } from '../../../lib/api-client';
import { useChangeLinePacks, useRemoveLine } from '../api';

/**
 * The coordinator changes a line's packs while the order is a draft or claims are open
 * (never below what members claimed: the server says so), or removes an unclaimed line.
 */
export function LinePacksEditor({ order, line }: { order: OrderDetail; line: OrderLine }) {
  const change = useChangeLinePacks(order.id);
  const remove = useRemoveLine(order.id);
  const [packs, setPacks] = useState(String(line.packs));
  const error = change.error ?? remove.error;

  function submit(event: FormEvent) {
    event.preventDefault();
    change.mutate({ lineId: line.id, packs: Number(packs) });
  }

  return (
    <form onSubmit={submit} className="mt-2 flex flex-col gap-1.5">
      <div className="flex flex-wrap items-center gap-1.5">
        <div className="w-20">
          <Input
            type="number"
            min={1}
            step={1}
            aria-label={`Packs of ${line.chemical.name}`}
            value={packs}
            onChange={(e) => setPacks(e.target.value)}
          />
        </div>
        <Button type="submit" size="sm" busy={change.isPending}>
          Set packs
        </Button>
        {line.claimedQuantity === 0 && (
          <Button
            size="sm"
            variant="ghost"
            busy={remove.isPending}
            onClick={() => remove.mutate(line.id)}
          >
            Remove
          </Button>
        )}
      </div>
      {error && <Notice tone="danger">{errorMessage(error)}</Notice>}
    </form>
  );
}
