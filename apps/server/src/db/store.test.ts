import { describe, expect, it } from 'vitest';
import type { EntityManager } from 'typeorm';
import { signedIn, stockFactory } from '../test/factories';
import { onPostgres, testContext } from '../test/harness';
import { createStore, type RepositoryFactories } from './store';

describe('store transactions', () => {
  // SQLite's write queue; on PostgreSQL transactions overlap and lock rows instead.
  it.skipIf(onPostgres)(
    'when transactions overlap in time, then they run one after another (no interleaved read-check-write)',
    async () => {
      const { store } = testContext();
      const log: string[] = [];
      await Promise.all(
        [1, 2, 3].map((n) =>
          store.transaction(async () => {
            log.push(`start ${n}`);
            await new Promise((resolve) => setTimeout(resolve, 5));
            log.push(`end ${n}`);
          }),
        ),
      );
      expect(log).toEqual(['start 1', 'end 1', 'start 2', 'end 2', 'start 3', 'end 3']);
    },
  );

  it('when a transaction fails, then the next one still runs', async () => {
    const { store } = testContext();
    const failed = store.transaction(async () => {
      throw new Error('boom');
    });
    const next = store.transaction(async () => 'ran');
    await expect(failed).rejects.toThrow('boom');
    await expect(next).resolves.toBe('ran');
  });

  it('when a lone write arrives while a failing transaction awaits, then it is kept, not rolled back with it', async () => {
    const { store } = testContext();
    const now = new Date().toISOString();
    let release!: () => void;
    const gate = new Promise<void>((resolve) => (release = resolve));
    const failing = store.transaction(async (repos) => {
      await repos.locations.insert(
        {
          name: 'Rolled back room',
          kind: 'room',
          parentId: null,
          storageGroups: [],
          notes: '',
          createdAt: now,
          updatedAt: now,
        },
        null,
      );
      await gate;
      throw new Error('import failed midway');
    });
    // the lone write waits for the transaction instead of joining it
    const lone = store.repos.locations.insert(
      {
        name: 'Kept room',
        kind: 'room',
        parentId: null,
        storageGroups: [],
        notes: '',
        createdAt: now,
        updatedAt: now,
      },
      null,
    );
    release();
    await expect(failing).rejects.toThrow('import failed midway');
    const kept = await lone;
    expect(await store.repos.locations.findRow(kept.id)).toMatchObject({ name: 'Kept room' });
    expect(await store.repos.locations.siblingNamed(null, 'Rolled back room')).toBeNull();
  });

  it('when a transaction is opened inside another, then it joins it instead of waiting for itself', async () => {
    const { store } = testContext();
    const answer = await store.transaction(async () => store.transaction(async () => 'joined'));
    expect(answer).toBe('joined');
  });

  it('when a long write transaction is open, then a read outside it answers at once with the last committed state', async () => {
    const { store } = testContext();
    const now = new Date().toISOString();
    let release!: () => void;
    const gate = new Promise<void>((resolve) => (release = resolve));
    let inserted = false;
    const writing = store.transaction(async (repos) => {
      await repos.locations.insert(
        {
          name: 'Room being written',
          kind: 'room',
          parentId: null,
          storageGroups: [],
          notes: '',
          createdAt: now,
          updatedAt: now,
        },
        null,
      );
      inserted = true;
      await gate;
    });
    while (!inserted) await new Promise((resolve) => setTimeout(resolve, 1));
    // the read does not wait for the gate (it would never resolve if it queued behind it)
    expect(await store.repos.locations.siblingNamed(null, 'Room being written')).toBeNull();
    release();
    await writing;
    expect(await store.repos.locations.siblingNamed(null, 'Room being written')).not.toBeNull();
  });

  // SQLite's read-only second connection; PostgreSQL has a pool and no such split.
  it.skipIf(onPostgres)(
    'when a method named as a read writes, then it is refused on the read connection and runs in the write queue',
    async () => {
      const { dataSource } = testContext();
      const factories = {
        probe: (manager: EntityManager) => ({
          async countAndTouch(name: string) {
            await manager.query(
              "INSERT INTO locations (name, kind, parent_id, storage_groups, notes, path, id_path, depth, created_at, updated_at) VALUES (?, 'room', NULL, '[]', '', ?, '/0/', 0, datetime('now'), datetime('now'))",
              [name, name],
            );
            const [row] = await manager.query(
              'SELECT COUNT(*) AS n FROM locations WHERE name = ?',
              [name],
            );
            return Number(row.n);
          },
        }),
      } as unknown as RepositoryFactories;
      const probe = (
        createStore(dataSource, factories).repos as unknown as {
          probe: { countAndTouch(name: string): Promise<number> };
        }
      ).probe;
      expect(await probe.countAndTouch('Touched room')).toBe(1);
    },
  );

  it.runIf(onPostgres)(
    'when two transactions lock two containers in opposite order, then PostgreSQL ends the deadlock and the one it rolled back runs again: both commit',
    async () => {
      const { store } = testContext();
      const manager = (await signedIn('manager')).cookie;
      const make = stockFactory(() => manager);
      const chemical = await make.chemical();
      const lot = await make.lot(chemical.id);
      const shelf = await make.location();
      const a = await make.container(lot.id, shelf.id);
      const b = await make.container(lot.id, shelf.id);
      let arrived = 0;
      let release!: () => void;
      const bothHoldOne = new Promise<void>((resolve) => (release = resolve));
      const meet = async () => {
        if (++arrived === 2) release();
        await bothHoldOne;
      };
      let attempts = 0;
      const lockInOrder = (first: number, second: number) =>
        store.transaction(async (repos) => {
          attempts++;
          await repos.containers.findRow(first);
          await meet();
          await repos.containers.findRow(second);
          return 'committed';
        });
      const results = await Promise.all([lockInOrder(a.id, b.id), lockInOrder(b.id, a.id)]);
      expect(results).toEqual(['committed', 'committed']);
      expect(attempts).toBe(3);
    },
  );
});
