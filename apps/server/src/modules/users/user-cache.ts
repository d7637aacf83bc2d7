import { LRUCache } from 'lru-cache';
import type { DataSource, EntityManager, QueryRunner } from 'typeorm';
import type { UserRow } from './user.entity';

/** How long a user row read for the session check is trusted without reading it again. */
export const userCacheSeconds = 5;
const userCacheSize = 1000;

/**
 * Users read for the session check, per database file, for a few seconds. Every write to
 * `users` goes through users.repository, which calls `userWritten`: the entry is dropped at
 * once, and when the write is inside a transaction, the user is read fresh until that
 * transaction ends and dropped again then (so a read made meanwhile on another connection
 * cannot keep the row as it was before the commit). A write by another process (the
 * `user:create` command) is seen within `userCacheSeconds`.
 */
export interface UserCache {
  /** The user from the cache, or from `load` (and kept when nothing was written meanwhile). */
  get(id: number, load: () => Promise<UserRow | null>): Promise<UserRow | null>;
}

interface CacheState {
  rows: LRUCache<number, UserRow>;
  /** Bumped by every write: a read that started before a write is not kept. */
  generation: number;
  /** Users written by a transaction still open, per transaction. */
  openWrites: Map<QueryRunner, Set<number>>;
}

const states = new Map<string, CacheState>();
const hooked = new WeakSet<DataSource>();

function stateOf(dataSource: DataSource): CacheState {
  const key = String(dataSource.options.database);
  let state = states.get(key);
  if (!state) {
    state = {
      rows: new LRUCache({ max: userCacheSize, ttl: userCacheSeconds * 1000 }),
      generation: 0,
      openWrites: new Map(),
    };
    states.set(key, state);
  }
  return state;
}

function writtenNow(state: CacheState, id: number) {
  state.generation++;
  state.rows.delete(id);
}

function isOpen(state: CacheState, id: number): boolean {
  for (const ids of state.openWrites.values()) if (ids.has(id)) return true;
  return false;
}

/** Drops what transaction `queryRunner` wrote once it has committed or rolled back. */
function hookTransactionEnd(dataSource: DataSource) {
  if (hooked.has(dataSource)) return;
  hooked.add(dataSource);
  const settle = (queryRunner: QueryRunner) => {
    const state = stateOf(dataSource);
    const ids = state.openWrites.get(queryRunner);
    if (!ids) return;
    state.openWrites.delete(queryRunner);
    for (const id of ids) writtenNow(state, id);
  };
  dataSource.subscribers.push({
    afterTransactionCommit: (event) => settle(event.queryRunner),
    afterTransactionRollback: (event) => settle(event.queryRunner),
  });
}

/** Called by every write of users.repository, with the manager it wrote through. */
export function userWritten(manager: EntityManager, id: number) {
  const state = stateOf(manager.connection);
  writtenNow(state, id);
  const queryRunner = manager.queryRunner;
  if (queryRunner?.isTransactionActive) {
    hookTransactionEnd(manager.connection);
    const ids = state.openWrites.get(queryRunner) ?? new Set<number>();
    ids.add(id);
    state.openWrites.set(queryRunner, ids);
  }
}

export function userCacheOf(dataSource: DataSource): UserCache {
  const state = stateOf(dataSource);
  return {
    async get(id, load) {
      const cached = state.rows.get(id);
      if (cached) return { ...cached };
      const generation = state.generation;
      const row = await load();
      if (row && generation === state.generation && !isOpen(state, id)) {
        state.rows.set(id, { ...row });
      }
      return row;
    },
  };
}
