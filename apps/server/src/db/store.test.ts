import { describe, expect, it } from 'vitest';
import { testContext } from '../test/harness';

describe('store transactions', () => {
  it('when transactions overlap in time, then they run one after another (no interleaved read-check-write)', async () => {
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
  });

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
});
