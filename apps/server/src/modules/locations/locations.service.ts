import {
  countOf,
  locationPathSeparator,
  type Location,
  type LocationCreateParsed,
  type LocationDetail,
  type LocationListQuery,
  type LocationPatch,
  type Page,
} from '@lotwise/shared';
import { AppError } from '../../lib/app-error';
import type { Repositories, Store } from '../../db/store';
import { nowIso } from '../../db/sql';
import { segregationService } from '../segregation/segregation.service';
import type { LocationRow } from './location.entity';

function notFound(id: number) {
  return AppError.notFound(`There is no location #${id}.`);
}

/** The place a write names in its body: 400 naming the field when it does not exist. */
export async function requireLocation(
  repos: Repositories,
  id: number,
  field = 'locationId',
): Promise<LocationRow> {
  const row = await repos.locations.findRow(id);
  if (!row) {
    throw AppError.validation(`There is no location #${id}.`, { [field]: `no location #${id}` });
  }
  return row;
}

export function locationsService(store: Store) {
  const { locations } = store.repos;

  async function assertNameFree(parentId: number | null, name: string, exceptId?: number) {
    const holder = await locations.siblingNamed(parentId, name);
    if (holder && holder.id !== exceptId) {
      throw AppError.conflict(`${holder.path} already exists.`, {
        name: 'is already used by another place in the same parent',
      });
    }
  }

  return {
    async list(query: LocationListQuery): Promise<Page<Location>> {
      const { items, total } = await locations.list(query);
      return { items, total, page: query.page, pageSize: query.pageSize };
    },

    async get(id: number): Promise<LocationDetail> {
      const row = await locations.findRow(id);
      if (!row) throw notFound(id);
      const location = (await locations.findById(id))!;
      const ancestorIds = row.idPath.split('/').filter(Boolean).map(Number).slice(0, -1);
      const ancestors = await locations.rowsByIds(ancestorIds);
      return {
        ...location,
        ancestors: ancestorIds.flatMap((ancestorId) => {
          const found = ancestors.find((a) => a.id === ancestorId);
          return found ? [{ id: found.id, name: found.name }] : [];
        }),
        children: await locations.children(id),
        subtreeContainerCount: await locations.subtreeContainerCount(row),
        warnings: await segregationService(store.repos).warningsAt(row),
      };
    },

    async create(input: LocationCreateParsed): Promise<Location> {
      return store.transaction(async (repos) => {
        const parent =
          input.parentId === null ? null : await requireLocation(repos, input.parentId, 'parentId');
        await assertNameFree(input.parentId, input.name);
        const now = nowIso();
        const row = await repos.locations.insert(
          { ...input, createdAt: now, updatedAt: now },
          parent,
        );
        return (await repos.locations.findById(row.id))!;
      });
    },

    async update(id: number, patch: LocationPatch): Promise<Location> {
      return store.transaction(async (repos) => {
        const current = await repos.locations.findRow(id);
        if (!current) throw notFound(id);
        const moving = patch.parentId !== undefined && patch.parentId !== current.parentId;
        let parent: LocationRow | null =
          current.parentId === null ? null : await repos.locations.findRow(current.parentId);
        if (moving) {
          parent =
            patch.parentId === null
              ? null
              : await requireLocation(repos, patch.parentId!, 'parentId');
          if (parent && parent.idPath.startsWith(current.idPath)) {
            throw AppError.conflict(
              `${current.path} cannot move into ${parent.path}: that place is inside it.`,
              { parentId: 'is this place or one inside it' },
            );
          }
        }
        const name = patch.name ?? current.name;
        if (moving || patch.name !== undefined) await assertNameFree(parent?.id ?? null, name, id);
        const path = parent ? `${parent.path}${locationPathSeparator}${name}` : name;
        const idPath = `${parent ? parent.idPath : '/'}${id}/`;
        const depth = parent ? parent.depth + 1 : 0;
        const { parentId: _parentId, ...rest } = patch;
        const now = nowIso();
        await repos.locations.update(id, {
          ...rest,
          parentId: parent?.id ?? null,
          path,
          idPath,
          depth,
          updatedAt: now,
        });
        if (path !== current.path || idPath !== current.idPath) {
          // Every place below gets the new beginning of its path.
          for (const below of await repos.locations.descendants(current)) {
            await repos.locations.update(below.id, {
              path: path + below.path.slice(current.path.length),
              idPath: idPath + below.idPath.slice(current.idPath.length),
              depth: below.depth - current.depth + depth,
            });
          }
        }
        return (await repos.locations.findById(id))!;
      });
    },

    async remove(id: number): Promise<void> {
      await store.transaction(async (repos) => {
        const current = await repos.locations.findById(id);
        if (!current) throw notFound(id);
        if (current.childCount > 0) {
          throw AppError.conflict(
            `${current.path} holds ${countOf(current.childCount, 'other place')}: move or delete them first.`,
          );
        }
        if (current.containerCount > 0) {
          throw AppError.conflict(
            `${current.path} holds ${countOf(current.containerCount, 'container')}: move them elsewhere first.`,
          );
        }
        const kept = await repos.locations.containerCount(id, false);
        if (kept > 0) {
          throw AppError.conflict(
            `${current.path} is named in the history of ${countOf(kept, 'disposed container')} and cannot be deleted; rename it instead.`,
          );
        }
        await repos.locations.delete(id);
      });
    },
  };
}
export type LocationsService = ReturnType<typeof locationsService>;
