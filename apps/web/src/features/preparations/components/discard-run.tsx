import { useState } from 'react';
import { useNavigate } from 'react-router';
import { Trash2 } from 'lucide-react';
import { mayRecordRun, type Run } from '@lotwise/shared';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/dialog';
import { Notice } from '../../../components/ui/notice';
import { errorMessage } from '../../../lib/api-client';
import { useCurrentUser } from '../../../lib/auth';
import { paths } from '../../../config/paths';
import { useDiscardRun } from '../api';

/**
 * Discard an opened run that will not be recorded (started by mistake, or the session did
 * not happen): asked first; nothing of it is in the ledger, so nothing in stock changes.
 */
export function DiscardRunButton({ run }: { run: Run }) {
  const { data: me } = useCurrentUser();
  const discard = useDiscardRun(run.id);
  const navigate = useNavigate();
  const [asking, setAsking] = useState(false);
  if (
    !me ||
    run.status !== 'open' ||
    !mayRecordRun(me, { performerId: run.performedBy?.id ?? null })
  )
    return null;

  return (
    <>
      <Button
        variant="ghost"
        onClick={() => setAsking(true)}
        icon={<Trash2 aria-hidden="true" className="size-4" />}
      >
        Discard this run
      </Button>
      <ConfirmDialog
        open={asking}
        title={`Discard run #${run.id}?`}
        confirmLabel="Discard the run"
        busy={discard.isPending}
        onCancel={() => {
          discard.reset();
          setAsking(false);
        }}
        onConfirm={() =>
          discard.mutate(undefined, {
            onSuccess: () => navigate(paths.runs, { replace: true }),
          })
        }
        error={
          discard.isError && (
            <Notice tone="danger" title="The run was not discarded">
              {errorMessage(discard.error)}
            </Notice>
          )
        }
      >
        <p>
          Run #{run.id} of {run.procedure.title} is opened but not recorded: nothing has been drawn
          from stock for it, so discarding it changes no container and no ledger.
        </p>
        {run.planId !== null && (
          <p>Plan #{run.planId} stays as it is; a new run can be started from it.</p>
        )}
      </ConfirmDialog>
    </>
  );
}
