import type { LedgerCheckResult } from '@lotwise/shared';
import type { Repositories } from '../../db/store';
import { nowIso } from '../../db/sql';

const tolerance = 1e-6;

/**
 * The ledger invariant: every container's stored balance equals the sum of its entries,
 * each entry's balance after equals the one before plus its change, and no balance is
 * negative.
 */
export async function checkLedger(repos: Repositories): Promise<LedgerCheckResult> {
  const problems: LedgerCheckResult['problems'] = [];
  const balances = await repos.containers.balances();
  const labels = new Map(balances.map((b) => [b.id, b.labelCode]));
  let entriesChecked = 0;
  for (const row of balances) {
    entriesChecked += row.entryCount;
    if (Math.abs(row.quantity - row.entrySum) > tolerance) {
      problems.push({
        containerId: row.id,
        labelCode: row.labelCode,
        kind: 'balance_mismatch',
        message: `${row.labelCode} stores ${row.quantity} but its entries add up to ${row.entrySum}.`,
      });
    }
  }
  let previous: { containerId: number; balance: number } | null = null;
  for (const entry of await repos.containers.chain()) {
    const before = previous && previous.containerId === entry.containerId ? previous.balance : 0;
    const label = labels.get(entry.containerId) ?? `#${entry.containerId}`;
    if (Math.abs(before + entry.quantity - entry.balanceAfter) > tolerance) {
      problems.push({
        containerId: entry.containerId,
        labelCode: label,
        kind: 'chain_broken',
        message: `${label}: an entry of ${entry.quantity} after a balance of ${before} records ${entry.balanceAfter}.`,
      });
    }
    if (entry.balanceAfter < -tolerance) {
      problems.push({
        containerId: entry.containerId,
        labelCode: label,
        kind: 'negative_balance',
        message: `${label} went below zero (${entry.balanceAfter}).`,
      });
    }
    previous = { containerId: entry.containerId, balance: entry.balanceAfter };
  }
  return {
    ok: problems.length === 0,
    containersChecked: balances.length,
    entriesChecked,
    problems,
    checkedAt: nowIso(),
  };
}
