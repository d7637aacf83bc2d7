import { Link } from 'react-router';
import {
  Archive,
  Box,
  DoorOpen,
  Layers,
  Pencil,
  Plus,
  Refrigerator,
  Trash2,
  type LucideIcon,
} from 'lucide-react';
import type { Location, LocationKind } from '@lotwise/shared';
import { StorageGroupLabel } from '../../../components/hazards/storage-group-label';
import { Button } from '../../../components/ui/button';
import { formatCount } from '../../../lib/format';
import { paths } from '../../../config/paths';
import { locationKindLabels } from '../labels';

export const locationKindIcons: Record<LocationKind, LucideIcon> = {
  room: DoorOpen,
  cabinet: Archive,
  shelf: Layers,
  fridge: Refrigerator,
  other: Box,
};

export interface LocationNode {
  location: Location;
  children: LocationNode[];
}

/** The flat list (sorted by path) as a tree. */
export function buildTree(locations: readonly Location[]): LocationNode[] {
  const nodes = new Map<number, LocationNode>();
  for (const location of locations) nodes.set(location.id, { location, children: [] });
  const roots: LocationNode[] = [];
  for (const node of nodes.values()) {
    const parent = node.location.parentId === null ? undefined : nodes.get(node.location.parentId);
    if (parent) parent.children.push(node);
    else roots.push(node);
  }
  return roots;
}

export interface LocationTreeActions {
  onAdd: (parent: Location) => void;
  onEdit: (location: Location) => void;
  onDelete: (location: Location) => void;
}

function Node({ node, actions }: { node: LocationNode; actions?: LocationTreeActions }) {
  const { location } = node;
  const Icon = locationKindIcons[location.kind];
  return (
    <li>
      <div className="flex flex-wrap items-start gap-x-4 gap-y-1 border-b border-ink-100 py-2">
        <div className="flex min-w-52 flex-1 items-start gap-2">
          <Icon aria-hidden="true" className="mt-0.5 size-4 shrink-0 text-ink-600" />
          <div>
            <Link
              to={paths.stockLocation(location.id)}
              className="font-medium text-accent-700 underline-offset-2 hover:underline"
            >
              {location.name}
            </Link>
            <span className="ml-2 text-xs text-ink-600">{locationKindLabels[location.kind]}</span>
            <p className="text-xs text-ink-600 tabular-nums">
              {formatCount(location.containerCount)}{' '}
              {location.containerCount === 1 ? 'container' : 'containers'} here
              {location.childCount > 0 &&
                ` · ${formatCount(location.childCount)} ${location.childCount === 1 ? 'place' : 'places'} inside`}
            </p>
          </div>
        </div>
        <div className="flex min-w-48 flex-wrap gap-x-3 gap-y-0.5 text-sm text-ink-800">
          {location.storageGroups.length === 0 ? (
            <span className="text-ink-600">Any storage group</span>
          ) : (
            location.storageGroups.map((group) => <StorageGroupLabel key={group} group={group} />)
          )}
        </div>
        {actions && (
          <div className="flex gap-1">
            <Button
              size="sm"
              variant="ghost"
              onClick={() => actions.onAdd(location)}
              icon={<Plus aria-hidden="true" className="size-4" />}
              aria-label={`Add a place in ${location.name}`}
            >
              Add inside
            </Button>
            <Button
              size="sm"
              variant="ghost"
              onClick={() => actions.onEdit(location)}
              icon={<Pencil aria-hidden="true" className="size-4" />}
              aria-label={`Change ${location.name}`}
            />
            <Button
              size="sm"
              variant="ghost"
              onClick={() => actions.onDelete(location)}
              icon={<Trash2 aria-hidden="true" className="size-4" />}
              aria-label={`Delete ${location.name}`}
            />
          </div>
        )}
      </div>
      {node.children.length > 0 && (
        <ul className="ml-3 border-l border-ink-200 pl-4">
          {node.children.map((child) => (
            <Node key={child.location.id} node={child} actions={actions} />
          ))}
        </ul>
      )}
    </li>
  );
}

/** Rooms, what is in them, and what is in that — with the groups each place is meant for. */
export function LocationTree({
  nodes,
  actions,
}: {
  nodes: LocationNode[];
  actions?: LocationTreeActions;
}) {
  return (
    <ul aria-label="Locations" className="rounded-lg border border-ink-200 bg-white px-4 py-1">
      {nodes.map((node) => (
        <Node key={node.location.id} node={node} actions={actions} />
      ))}
    </ul>
  );
}
