import { useMemo, useState } from 'react';
import { MapPin, Plus } from 'lucide-react';
import type { Location } from '@lotwise/shared';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { PageSpinner } from '../../../components/ui/spinner';
import { useCan } from '../../../lib/auth';
import { useLocations } from '../api';
import { DeleteLocationDialog } from '../components/delete-location-dialog';
import { LocationFormDialog } from '../components/location-form-dialog';
import { buildTree, LocationTree } from '../components/location-tree';

type Editing =
  | { kind: 'add'; parent: Location | null }
  | { kind: 'edit'; location: Location }
  | { kind: 'delete'; location: Location };

export function LocationsPage() {
  const locations = useLocations();
  const mayWrite = useCan('stock.write');
  const [editing, setEditing] = useState<Editing | null>(null);
  const tree = useMemo(() => buildTree(locations.data?.items ?? []), [locations.data]);
  const close = () => setEditing(null);

  const addRoom = mayWrite && (
    <Button
      variant="primary"
      onClick={() => setEditing({ kind: 'add', parent: null })}
      icon={<Plus aria-hidden="true" className="size-4" />}
    >
      Add a room
    </Button>
  );

  return (
    <div className="flex flex-col gap-5">
      <header className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-xl font-semibold text-ink-900">Locations</h1>
          <p className="text-sm text-ink-600">
            Rooms, the cabinets and fridges in them, and their shelves — with the storage groups
            each place is meant for. Open a place to see what it holds.
          </p>
        </div>
        {addRoom}
      </header>

      {locations.isPending ? (
        <PageSpinner label="Loading locations…" />
      ) : locations.isError ? (
        <ErrorState
          title="The locations could not be loaded"
          error={locations.error}
          onRetry={() => void locations.refetch()}
        />
      ) : tree.length === 0 ? (
        <EmptyState icon={<MapPin />} title="No locations yet" action={addRoom || undefined}>
          {mayWrite
            ? 'Start with a room, then add its cabinets and shelves.'
            : 'Someone with the manager or admin role sets up the lab’s rooms and cabinets.'}
        </EmptyState>
      ) : (
        <LocationTree
          nodes={tree}
          actions={
            mayWrite
              ? {
                  onAdd: (parent) => setEditing({ kind: 'add', parent }),
                  onEdit: (location) => setEditing({ kind: 'edit', location }),
                  onDelete: (location) => setEditing({ kind: 'delete', location }),
                }
              : undefined
          }
        />
      )}

      {editing?.kind === 'add' && <LocationFormDialog parent={editing.parent} onClose={close} />}
      {editing?.kind === 'edit' && (
        <LocationFormDialog location={editing.location} onClose={close} />
      )}
      {editing?.kind === 'delete' && (
        <DeleteLocationDialog location={editing.location} onClose={close} />
      )}
    </div>
  );
}
