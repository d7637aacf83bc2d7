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
});
