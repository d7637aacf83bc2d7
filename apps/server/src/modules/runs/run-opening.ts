import { mayRecordRun, mayRunFromPlan, type RunCreateParsed, type User } from '@lotwise/shared';
import { AppError } from '../../lib/app-error';
import type { Repositories } from '../../db/store';
import { nowIso } from '../../db/sql';
import type { RunRow } from './run.entity';
import { requireRun } from './run-views';

/** A run its performer may record; anyone else needs `plans.manage` (`mayRecordRun`). */
export function requireOwnRun(run: RunRow, actor: User) {
  if (!mayRecordRun(actor, { performerId: run.performedById })) {
    throw AppError.forbidden(
      `Run #${run.id} belongs to someone else: only the person running it or a manager can record it.`,
    );
  }
}

/** Opens a run (inside the caller's transaction); answers its id. */
export async function openRun(
  repos: Repositories,
  input: RunCreateParsed,
  actor: User,
  now = nowIso(),
): Promise<number> {
  let procedureId: number;
  let scaleFactor: number;
  let planId: number | null = null;
  if (input.planId !== undefined) {
    const plan = await repos.plans.findRow(input.planId);
    if (!plan) {
      throw AppError.validation(`There is no plan #${input.planId}.`, {
        planId: `no plan #${input.planId}`,
      });
    }
    // Anyone who may record runs may run from anyone's plan: the run is theirs, the plan stays
    // its author's (mayRunFromPlan; the route already asks for runs.record).
    if (!mayRunFromPlan(actor)) {
      throw AppError.forbidden('Recording a run needs the member, manager or admin role.');
    }
    if (plan.status === 'recorded' || plan.status === 'cancelled') {
      throw AppError.conflict(`Plan #${plan.id} is ${plan.status}; start an ad hoc run instead.`);
    }
    procedureId = plan.procedureId;
    planId = plan.id;
    // The whole session: every bench at the plan's scale.
    scaleFactor = input.scaleFactor ?? plan.scaleFactor * plan.benches;
  } else {
    const procedure = await repos.procedures.findRow(input.procedureId!);
    if (!procedure) {
      throw AppError.validation(`There is no procedure #${input.procedureId}.`, {
        procedureId: `no procedure #${input.procedureId}`,
      });
    }
    procedureId = procedure.id;
    scaleFactor = input.scaleFactor ?? 1;
  }
  return repos.runs.insert({
    procedureId,
    planId,
    scaleFactor,
    status: 'open',
    performedById: actor.id,
    performedOn: null,
    theoreticalYieldG: null,
    crudeMassG: null,
    productMassG: null,
    percentYield: null,
    crudePercentYield: null,
    yieldFlag: null,
    crudeYieldFlag: null,
    meltingLowC: null,
    meltingHighC: null,
    appearance: '',
    observationNotes: '',
    notes: input.notes,
    actualLines: null,
    stoichiometry: null,
    warnings: [],
    notices: [],
    recordedAt: null,
    createdAt: now,
    updatedAt: now,
  });
}

/**
 * Discards an opened run (inside the caller's transaction): nothing of it reached the ledger
 * (draws and products are written only when a run is recorded), so the run goes with its
 * timeline and photos, and an audit entry keeps who discarded what. A recorded run stands:
 * its entries are history. Answers the stored names of the photos, for the caller to remove
 * once the transaction committed.
 */
export async function discardRun(
  repos: Repositories,
  runId: number,
  actor: User,
): Promise<string[]> {
  const run = await requireRun(repos, runId);
  requireOwnRun(run, actor);
  if (run.status !== 'open') {
    throw AppError.conflict(
      `Run #${run.id} is already recorded: its draws and products are in the ledger, so it cannot be discarded.`,
    );
  }
  const photos = await repos.runTimeline.photosOf(run.id);
  await repos.runTimeline.deleteOfRun(run.id);
  await repos.runs.delete(run.id);
  await repos.audit.insert({
    actorId: actor.id,
    action: 'run.discarded',
    targetType: 'run',
    targetId: run.id,
    detail: { procedureId: run.procedureId, planId: run.planId, scaleFactor: run.scaleFactor },
    createdAt: nowIso(),
  });
  return photos.map((photo) => photo.storedName);
}
