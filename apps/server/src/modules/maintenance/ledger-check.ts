import type { LedgerCheckResult } from '@lotwise/shared';
import type { Repositories } from '../../db/store';
import { microPerUnit } from '../../db/quantities';
import { nowIso } from '../../db/sql';

const million = BigInt(microPerUnit);

/** Whole millionths as a decimal in the unit, exactly: 99999976n -> "99.999976". */
function show(micro: bigint | null): string {
  if (micro === null) return 'an unreadable value';
  const sign = micro < 0n ? '-' : '';
  const size = micro < 0n ? -micro : micro;
  const fraction = (size % million).toString().padStart(6, '0').replace(/0+$/, '');
  return `${sign}${size / million}${fraction ? `.${fraction}` : ''}`;
}

/**
 * The ledger invariant, checked exactly on the stored whole millionths (bigint arithmetic, no
 * tolerance): every container's stored balance equals the sum of its entries, each entry's
 * balance after equals the one before plus its change, and no balance is negative.
 */
export async function checkLedger(repos: Repositories): Promise<LedgerCheckResult> {
  const problems: LedgerCheckResult['problems'] = [];
  const balances = await repos.containers.balances();
  const containers = new Map(balances.map((b) => [b.id, b]));
  const sums = new Map<number, bigint | null>();
  let entriesChecked = 0;
  let previous: { containerId: number; balance: bigint | null } | null = null;
  for (const entry of await repos.containers.chain()) {
    entriesChecked++;
    const container = containers.get(entry.containerId);
    const label = container?.labelCode ?? `#${entry.containerId}`;
    const unit = container ? ` ${container.unit}` : '';
    const before = previous && previous.containerId === entry.containerId ? previous.balance : 0n;
    const sum = sums.has(entry.containerId) ? sums.get(entry.containerId)! : 0n;
    sums.set(
      entry.containerId,
      sum === null || entry.quantityMicro === null ? null : sum + entry.quantityMicro,
    );
    if (
      before === null ||
      entry.quantityMicro === null ||
      entry.balanceAfterMicro === null ||
      before + entry.quantityMicro !== entry.balanceAfterMicro
    ) {
      problems.push({
        containerId: entry.containerId,
        labelCode: label,
        kind: 'chain_broken',
        message: `${label}: an entry of ${show(entry.quantityMicro)}${unit} after a balance of ${show(before)}${unit} records ${show(entry.balanceAfterMicro)}${unit}.`,
      });
    }
    if (entry.balanceAfterMicro !== null && entry.balanceAfterMicro < 0n) {
      problems.push({
        containerId: entry.containerId,
        labelCode: label,
        kind: 'negative_balance',
        message: `${label} went below zero (${show(entry.balanceAfterMicro)}${unit}).`,
      });
    }
    previous = { containerId: entry.containerId, balance: entry.balanceAfterMicro };
  }
  for (const container of balances) {
    const sum = sums.has(container.id) ? sums.get(container.id)! : 0n;
    if (container.quantityMicro === null || sum === null || container.quantityMicro !== sum) {
      problems.push({
        containerId: container.id,
        labelCode: container.labelCode,
        kind: 'balance_mismatch',
        message: `${container.labelCode} stores ${show(container.quantityMicro)} ${container.unit} but its entries add up to ${show(sum)} ${container.unit}.`,
      });
    }
  }
  problems.sort((a, b) => a.containerId - b.containerId);
  return {
    ok: problems.length === 0,
    containersChecked: balances.length,
    entriesChecked,
    problems,
    checkedAt: nowIso(),
  };
}
