import { describe, expect, it } from 'vitest';
import { testContext } from '../../test/harness';
import { alertRulesJob } from './alerts-scheduler';

const at = (iso: string) => iso;

describe('turns of the scheduled alert evaluation', () => {
  it('when several instances claim the same turn at once, then exactly one gets it', async () => {
    const { scheduledRuns } = testContext().store.repos;
    const now = at('2026-12-02T08:00:00.000Z');
    const claims = await Promise.all(
      Array.from({ length: 6 }, () =>
        scheduledRuns.claimTurn('race-job', now, at('2026-12-02T07:00:00.000Z')),
      ),
    );
    expect(claims.filter(Boolean)).toHaveLength(1);
  });

  it('when the last start is within the interval, then the turn is refused; once it is older, then it is given', async () => {
    const { scheduledRuns } = testContext().store.repos;
    // hourly: a claim is due when the last start is at or before now − 54 min
    expect(
      await scheduledRuns.claimTurn(
        alertRulesJob,
        at('2026-12-02T09:00:00.000Z'),
        at('2026-12-02T08:06:00.000Z'),
      ),
    ).toBe(true);
    expect(
      await scheduledRuns.claimTurn(
        alertRulesJob,
        at('2026-12-02T09:30:00.000Z'),
        at('2026-12-02T08:36:00.000Z'),
      ),
    ).toBe(false);
    expect(
      await scheduledRuns.claimTurn(
        alertRulesJob,
        at('2026-12-02T09:50:00.000Z'),
        at('2026-12-02T08:56:00.000Z'),
      ),
    ).toBe(false);
    expect(
      await scheduledRuns.claimTurn(
        alertRulesJob,
        at('2026-12-02T10:00:00.000Z'),
        at('2026-12-02T09:06:00.000Z'),
      ),
    ).toBe(true);
  });
});
