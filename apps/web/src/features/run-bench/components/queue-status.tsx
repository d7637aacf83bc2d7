import { countOf } from '@lotwise/shared';
import { CloudCheck, CloudOff, CloudUpload } from 'lucide-react';

/** How many entries wait on this device, said plainly. */
export function QueueStatus({
  waiting,
  refused,
  online,
  sending,
  problem,
}: {
  waiting: number;
  refused: number;
  online: boolean;
  sending: boolean;
  problem: string | null;
}) {
  const entries = countOf(waiting, 'entry', 'entries');
  const verb = waiting === 1 ? 'waits' : 'wait';
  let text: string;
  let Icon = CloudCheck;
  if (waiting === 0) {
    text = 'All entries sent';
  } else if (!online) {
    text = `${entries} ${verb} to be sent (offline)`;
    Icon = CloudOff;
  } else if (problem && !sending) {
    text = `${entries} ${verb} to be sent (the server cannot be reached; trying again)`;
    Icon = CloudOff;
  } else {
    text = `${entries} ${verb} to be sent (sending…)`;
    Icon = CloudUpload;
  }
  return (
    <div
      role="status"
      data-testid="queue-status"
      className={
        waiting === 0
          ? 'flex items-center gap-2 text-sm text-ok-700'
          : 'flex items-center gap-2 rounded-md border border-warn-200 bg-warn-50 px-3 py-2 text-sm font-medium text-warn-700'
      }
    >
      <Icon aria-hidden="true" className="size-4 shrink-0" />
      <span>
        {text}
        {refused > 0 &&
          `; ${countOf(refused, 'entry', 'entries')} refused by the server (see below)`}
      </span>
    </div>
  );
}
