import { useState } from 'react';
import { MapPin, Pencil, Plus, Trash2 } from 'lucide-react';
import { can, type WasteArea } from '@lotwise/shared';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { PageSpinner } from '../../../components/ui/spinner';
import { useCurrentUser } from '../../../lib/auth';
import { formatAmount, formatDate } from '../../../lib/format';
import { useOpenWasteContainers, useWasteAreas, useWastePickups } from '../api';
import { PickupForm } from '../components/pickup-form';
import { UnmarkWasteAreaDialog, WasteAreaFormDialog } from '../components/waste-area-dialogs';
import { WasteContainerFormDialog } from '../components/waste-container-form-dialog';
import { WasteTable } from '../components/waste-table';

const stateWords: Record<WasteArea['state'], string> = {
  ok: 'Within its limits',
  near: 'Near a limit',
  over: 'Over a limit',
};

function AreaTotals({ area }: { area: WasteArea }) {
  const line = (what: string, t: WasteArea['hazardous']) =>
    `${what}: ${formatAmount(t.litres, 'L')} of ${formatAmount(t.limitLitres, 'L')} (${Math.round(t.fraction * 100)} %)`;
  return (
    <div className="flex flex-col gap-1 text-sm text-ink-800">
      <p className="font-medium">
        {stateWords[area.state]}
        {area.state === 'over' &&
          ` — the excess is to be removed within ${area.daysAllowedOnceExceeded} days`}
      </p>
      <p>
        {line('Hazardous waste', area.hazardous)} — {area.citation}
      </p>
      <p>
        {line('Acutely hazardous waste', area.acutelyHazardous)} — {area.citation}
      </p>
      <p className="text-xs text-ink-600">{area.reminder}</p>
    </div>
  );
}

export function WastePage() {
  const { data: user } = useCurrentUser();
  const areas = useWasteAreas();
  const open = useOpenWasteContainers();
  const pickups = useWastePickups();
  const mayPickUp = user ? can(user.role, 'stock.write') : false;
  const [dialog, setDialog] = useState<
    { kind: 'container' | 'mark' } | { kind: 'change' | 'unmark'; area: WasteArea } | null
  >(null);
  const close = () => setDialog(null);

  if (areas.isPending || open.isPending) return <PageSpinner label="Loading the waste…" />;
  if (areas.isError || open.isError) {
    return (
      <ErrorState
        title="The waste could not be loaded"
        error={areas.error ?? open.error}
        onRetry={() => {
          void areas.refetch();
          void open.refetch();
        }}
      />
    );
  }
  const inAreas = new Set(areas.data.flatMap((a) => a.containers.map((c) => c.id)));
  const elsewhere = open.data.filter((c) => !inAreas.has(c.id));
  const waiting = [...areas.data.flatMap((a) => a.containers), ...elsewhere];

  return (
    <div className="flex flex-col gap-6">
      <header className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h1 className="text-xl font-semibold text-ink-900">Waste</h1>
          <p className="text-sm text-ink-600">
            Waste containers by accumulation area, how full and how old each is, and the pickups
            that took them away. Amounts are the estimates entered with each addition.
          </p>
        </div>
        {mayPickUp && (
          <div className="flex flex-wrap gap-2">
            <Button
              onClick={() => setDialog({ kind: 'mark' })}
              icon={<MapPin aria-hidden="true" className="size-4" />}
            >
              Mark a place as a waste accumulation area
            </Button>
            <Button
              variant="primary"
              onClick={() => setDialog({ kind: 'container' })}
              icon={<Plus aria-hidden="true" className="size-4" />}
            >
              New waste container
            </Button>
          </div>
        )}
      </header>
      <SafetyCaution />

      {waiting.length === 0 && (
        <EmptyState icon={<Trash2 />} title="No waste container is open">
          Add one to collect washings, filtrates and residues; runs and draws can then send waste to
          it.
        </EmptyState>
      )}

      {areas.data.map((area) => (
        <section
          key={area.locationId}
          aria-labelledby={`area-${area.locationId}`}
          className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-white p-4"
        >
          <h2 id={`area-${area.locationId}`} className="font-semibold text-ink-900">
            {area.locationPath}{' '}
            <span className="text-sm font-normal text-ink-600">— accumulation area</span>
          </h2>
          <AreaTotals area={area} />
          {mayPickUp && (
            <div className="flex flex-wrap gap-2">
              <Button
                size="sm"
                onClick={() => setDialog({ kind: 'change', area })}
                icon={<Pencil aria-hidden="true" className="size-4" />}
                aria-label={`Change the rule set of ${area.locationPath}`}
              >
                Change the rule set
              </Button>
              <Button
                size="sm"
                onClick={() => setDialog({ kind: 'unmark', area })}
                aria-label={`Unmark ${area.locationPath} as an accumulation area`}
              >
                Unmark
              </Button>
            </div>
          )}
          {area.containers.length > 0 ? (
            <WasteTable
              containers={area.containers}
              maxAccumulationDays={area.maxAccumulationDays}
              caption={`Waste containers at ${area.locationPath}`}
            />
          ) : (
            <p className="text-sm text-ink-600">No open waste container here.</p>
          )}
        </section>
      ))}

      {elsewhere.length > 0 && (
        <section aria-labelledby="waste-elsewhere" className="flex flex-col gap-3">
          <h2 id="waste-elsewhere" className="font-semibold text-ink-900">
            Outside an accumulation area
          </h2>
          <WasteTable containers={elsewhere} caption="Waste containers outside an area" />
        </section>
      )}

      {mayPickUp && (
        <section
          aria-labelledby="waste-pickup"
          className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-white p-4"
        >
          <h2 id="waste-pickup" className="font-semibold text-ink-900">
            Record a pickup
          </h2>
          <PickupForm containers={waiting} />
        </section>
      )}

      <section aria-labelledby="waste-pickups" className="flex flex-col gap-2">
        <h2 id="waste-pickups" className="font-semibold text-ink-900">
          Pickups
        </h2>
        {pickups.isPending ? (
          <PageSpinner label="Loading the pickups…" />
        ) : pickups.isError ? (
          <ErrorState
            title="The pickups could not be loaded"
            error={pickups.error}
            onRetry={() => void pickups.refetch()}
          />
        ) : pickups.data.length === 0 ? (
          <p className="text-sm text-ink-600">No pickup recorded yet.</p>
        ) : (
          <ul className="flex flex-col gap-1 text-sm text-ink-800">
            {pickups.data.map((p) => (
              <li key={p.id}>
                {formatDate(p.pickedUpOn)} — {p.contractor}, manifest{' '}
                <span className="font-mono">{p.manifestNumber}</span>:{' '}
                {p.containers.map((c) => `${c.labelCode} ${c.title}`).join('; ')}
              </li>
            ))}
          </ul>
        )}
      </section>

      {dialog?.kind === 'container' && <WasteContainerFormDialog onClose={close} />}
      {dialog?.kind === 'mark' && (
        <WasteAreaFormDialog
          exclude={new Set(areas.data.map((a) => a.locationId))}
          onClose={close}
        />
      )}
      {dialog?.kind === 'change' && <WasteAreaFormDialog area={dialog.area} onClose={close} />}
      {dialog?.kind === 'unmark' && <UnmarkWasteAreaDialog area={dialog.area} onClose={close} />}
    </div>
  );
}
