import { useState } from 'react';
import { Link } from 'react-router';
import { Flame, Pencil, Trash2 } from 'lucide-react';
import { flammableStorageLabels, type FlammableStorageKind, type LabArea } from '@lotwise/shared';
import { paths } from '../../config/paths';
import { errorMessage } from '../../lib/api-client';
import { useCan } from '../../lib/auth';
import { formatFixed, formatLitres } from '../../lib/format';
import { Button } from '../ui/button';
import { Dialog } from '../ui/dialog';
import { ErrorState } from '../ui/error-state';
import { Notice } from '../ui/notice';
import { Spinner } from '../ui/spinner';
import { useDeleteLabArea, useLabAreas } from './api';
import { LabAreaFormDialog } from './lab-area-form-dialog';
import { floorAreaUnitLabels, labAreaKindLabels, worstLimit } from './lab-unit-classes';
import { LimitBar } from './limit-bar';

function UnmarkDialog({ area, onClose }: { area: LabArea; onClose: () => void }) {
  const remove = useDeleteLabArea(area.id);
  return (
    <Dialog
      open
      onClose={onClose}
      title={`Unmark ${area.name} as a lab area?`}
      description="The place and everything in it stay; Lotwise stops counting its liquids against limits."
      size="sm"
      footer={
        <>
          <Button onClick={onClose} disabled={remove.isPending}>
            Keep it
          </Button>
          <Button
            variant="danger"
            busy={remove.isPending}
            onClick={() => remove.mutate(undefined, { onSuccess: onClose })}
          >
            Unmark
          </Button>
        </>
      }
    >
      {remove.isError ? (
        <Notice tone="danger" title="Not unmarked">
          {errorMessage(remove.error)}
        </Notice>
      ) : (
        <p className="text-sm text-ink-700">You can mark it again at any time.</p>
      )}
    </Dialog>
  );
}

/** A lab area's facts in one line: "Lab unit, Class B, 40.0 m², storey 2, instructional". */
export function labAreaFacts(area: LabArea): string {
  return [
    labAreaKindLabels[area.kind],
    `Class ${area.unitClass}`,
    `${formatFixed(area.floorArea, 1)} ${floorAreaUnitLabels[area.floorAreaUnit]}`,
    `storey ${area.storey}`,
    area.instructional ? 'instructional' : null,
  ]
    .filter(Boolean)
    .join(', ');
}

/**
 * "Room rules" on a location's page: whether the place is a lab area (with its worst limit and
 * a link to its page), lies inside one, or can be marked as one.
 */
export function RoomRulesPanel({
  location,
}: {
  location: {
    id: number;
    name: string;
    path: string;
    flammableStorage: FlammableStorageKind | null;
  };
}) {
  const areas = useLabAreas();
  const mayWrite = useCan('stock.write');
  const [dialog, setDialog] = useState<'mark' | 'edit' | 'unmark' | null>(null);
  const area = areas.data?.items.find((a) => a.locationId === location.id);
  const around = areas.data?.items.find((a) => location.path.startsWith(`${a.path} › `));
  const worst = area ? worstLimit(area) : null;

  return (
    <section
      aria-labelledby="room-rules-heading"
      className="flex flex-col gap-2 rounded-md border border-ink-200 p-3"
    >
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="room-rules-heading" className="flex items-center gap-1.5 text-base font-semibold">
          <Flame aria-hidden="true" className="size-4 text-ink-600" />
          Room rules
        </h2>
        {mayWrite && area && (
          <div className="flex flex-wrap gap-2">
            <Button
              size="sm"
              onClick={() => setDialog('edit')}
              icon={<Pencil aria-hidden="true" className="size-4" />}
            >
              Change lab area
            </Button>
            <Button
              size="sm"
              onClick={() => setDialog('unmark')}
              icon={<Trash2 aria-hidden="true" className="size-4" />}
            >
              Unmark
            </Button>
          </div>
        )}
      </div>
      {location.flammableStorage && (
        <p className="text-sm text-ink-800">
          {flammableStorageLabels[location.flammableStorage]}: liquids here count as in approved
          storage.
        </p>
      )}
      {areas.isPending ? (
        <p className="flex items-center gap-2 text-sm text-ink-600">
          <Spinner size="sm" /> Loading the lab areas…
        </p>
      ) : areas.isError ? (
        <ErrorState
          title="The lab areas could not be loaded"
          error={areas.error}
          onRetry={() => void areas.refetch()}
        />
      ) : area ? (
        <div className="flex flex-col gap-2">
          <p className="text-sm text-ink-800">
            A lab area: {labAreaFacts(area)}. Counted against{' '}
            <span className="font-medium">{area.flammableRuleSet.citation}</span>.
          </p>
          {worst && (
            <LimitBar
              label={`Most used limit: ${worst.label}`}
              fraction={worst.fractionUsed}
              status={worst.status}
              detail={`${formatLitres(worst.heldLitres)} of ${formatLitres(worst.limitLitres)} — ${worst.label}`}
            />
          )}
          <Link
            to={paths.stockLabArea(area.id)}
            className="text-sm font-medium text-accent-700 underline underline-offset-2"
          >
            Litres held against each limit
          </Link>
        </div>
      ) : around ? (
        <p className="text-sm text-ink-800">
          Counted in the lab area{' '}
          <Link
            to={paths.stockLabArea(around.id)}
            className="font-medium text-accent-700 underline underline-offset-2"
          >
            {around.name}
          </Link>
          .
        </p>
      ) : (
        <div className="flex flex-wrap items-center justify-between gap-2">
          <p className="text-sm text-ink-700">
            Not a lab area. Mark a room as one to count its flammable liquids against a rule set.
          </p>
          {mayWrite && (
            <Button size="sm" variant="primary" onClick={() => setDialog('mark')}>
              Mark as a lab area
            </Button>
          )}
        </div>
      )}
      {dialog === 'mark' && (
        <LabAreaFormDialog location={location} onClose={() => setDialog(null)} />
      )}
      {dialog === 'edit' && area && (
        <LabAreaFormDialog location={location} area={area} onClose={() => setDialog(null)} />
      )}
      {dialog === 'unmark' && area && <UnmarkDialog area={area} onClose={() => setDialog(null)} />}
    </section>
  );
}
