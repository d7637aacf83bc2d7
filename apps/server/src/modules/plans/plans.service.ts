import { displayQuantity, lineAmounts } from '@lotwise/chem';
import {
  allocateHolds,
  defaultTextLocale,
  formatDate,
  formatQuantity,
  hazardStatementTexts,
  mayChangePlan,
  roundingRules,
  safetyDeferral,
  todayIso,
  withRoundedText,
  type CautionFlags,
  type DispensingSheet,
  type Page,
  type Plan,
  type PlanCreateParsed,
  type PlanDetail,
  type PlanListQuery,
  type PlanPreview,
  type PlanPatch,
  type Reservation,
  type User,
  type reservationCreateSchema,
} from '@lotwise/shared';
import type { z } from 'zod';
import { AppError } from '../../lib/app-error';
import type { Repositories, Store } from '../../db/store';
import { nowIso } from '../../db/sql';
import type { ChemicalRow } from '../chemicals/chemical.entity';
import { toStockUnit } from '../containers/containers.service';
import {
  chemLinesOf,
  loadProcedure,
  presentSteps,
  requireMeasurableFactor,
  type LoadedProcedure,
} from '../procedures/procedures.service';
import type { PlanRow } from './plan.entity';
import type { ReservationView } from './plans.repository';
import { heldNowOf } from './holds';
import { planChemicals, stockCheckOf, tidy } from './stock-check';

type ReservationCreateParsed = z.output<typeof reservationCreateSchema>;

const epsilon = 1e-6;

function amount(value: number, unit: string): string {
  return formatQuantity(value, unit);
}

/** The caution flags in words, for the top of a plan and the dispensing sheet. */
export function cautionItems(flags: CautionFlags): string[] {
  const items: string[] = [];
  if (flags.exothermicAddition) {
    items.push('Exothermic addition: add slowly with cooling; the temperature sets the pace.');
  }
  if (flags.keepBelowC !== null) items.push(`Keep the mixture below ${flags.keepBelowC} °C.`);
  if (flags.flammableSolvent) {
    items.push('Flammable solvent: no open flames; heat on a water bath or heating mantle.');
  }
  if (flags.toxicGas) items.push('A toxic gas may be given off: work in a fume hood.');
  if (flags.fumeHood) items.push('Work in a fume hood.');
  return items;
}

function hazardsOf(chemicals: Iterable<ChemicalRow>) {
  return [...chemicals]
    .sort((a, b) => a.name.localeCompare(b.name))
    .map((chemical) => ({
      chemicalId: chemical.id,
      name: chemical.name,
      ghsPictograms: chemical.ghsPictograms,
      hazardStatements: chemical.hazardStatements.map((code) => ({
        code,
        text: hazardStatementTexts[code] ?? null,
      })),
    }));
}

/** `heldNow`: what the reservation holds now, when it is in force (see `heldNowOf`). */
function presentReservation(view: ReservationView, heldNow: number | undefined): Reservation {
  return {
    id: view.id,
    planId: view.planId,
    containerId: view.containerId,
    labelCode: view.labelCode,
    chemicalId: view.chemicalId,
    chemicalName: view.chemicalName,
    locationPath: view.locationPath,
    requirementIndex: view.requirementIndex,
    quantity: tidy(heldNow ?? view.quantity),
    reservedQuantity: view.quantity,
    unit: view.unit,
    until: view.until,
    status: view.status,
    releasedReason: view.releasedReason,
    releasedAt: view.releasedAt,
    createdAt: view.createdAt,
  };
}

async function presentReservations(
  repos: Repositories,
  planId: number,
  today: string,
): Promise<Reservation[]> {
  const views = await repos.plans.reservationsOf(planId);
  const held = await heldNowOf(
    repos,
    views.filter((v) => v.status === 'active'),
    today,
  );
  return views.map((view) => presentReservation(view, held.get(view.id)));
}

/** Plans whose reservations have all run out become `lapsed`, releasing what they held. */
export async function sweepLapsedPlans(repos: Repositories, today = todayIso()): Promise<number[]> {
  const ids = await repos.plans.lapsedPlanIds(today);
  const now = nowIso();
  for (const id of ids) {
    await repos.plans.release(id, 'lapsed', now);
    await repos.plans.update(id, { status: 'lapsed', updatedAt: now });
  }
  return ids;
}

/** Editing, reserving for or cancelling a plan: its author or a manager (`mayChangePlan`). */
export function requireOwnPlan(plan: PlanRow, actor: User) {
  if (!mayChangePlan(actor, { authorId: plan.createdById })) {
    throw AppError.forbidden(
      `Plan #${plan.id} belongs to someone else: only its author or a manager can change or cancel it. You can still record a run from it.`,
    );
  }
}

export async function requirePlan(repos: Repositories, id: number): Promise<PlanRow> {
  const plan = await repos.plans.findRow(id);
  if (!plan) throw AppError.notFound(`There is no plan #${id}.`);
  return plan;
}

function refuseClosed(plan: PlanRow, what: string) {
  if (plan.status === 'recorded' || plan.status === 'cancelled') {
    throw AppError.conflict(`Plan #${plan.id} is ${plan.status}; it cannot be ${what}.`);
  }
}

/** Releases a plan's reservations and marks it recorded (inside the run's transaction). */
export async function markPlanRecorded(repos: Repositories, planId: number, runId: number) {
  const now = nowIso();
  await repos.plans.release(planId, 'recorded', now);
  await repos.plans.update(planId, { status: 'recorded', runId, updatedAt: now });
}

export function plansService(
  store: Store,
  text: { locale: string } = { locale: defaultTextLocale },
) {
  const date = (value: string) => formatDate(value, text);
  async function summaries(repos: Repositories, rows: PlanRow[]): Promise<Plan[]> {
    const procedures = new Map(
      (await repos.procedures.rowsByIds([...new Set(rows.map((r) => r.procedureId))])).map(
        (row) => [row.id, row],
      ),
    );
    const users = new Map(
      (
        await repos.users.findByIds([
          ...new Set(rows.flatMap((r) => (r.createdById === null ? [] : [r.createdById]))),
        ])
      ).map((user) => [user.id, user]),
    );
    const reservations = await repos.plans.reservationsOfPlans(rows.map((row) => row.id));
    const result: Plan[] = [];
    for (const row of rows) {
      const active = reservations.filter((r) => r.planId === row.id && r.status === 'active');
      const creator = row.createdById === null ? undefined : users.get(row.createdById);
      result.push({
        id: row.id,
        procedure: { id: row.procedureId, title: procedures.get(row.procedureId)?.title ?? '' },
        scaleFactor: row.scaleFactor,
        benches: row.benches,
        overagePercent: row.overagePercent,
        totalFactor: row.scaleFactor * row.benches * (1 + row.overagePercent / 100),
        plannedOn: row.plannedOn,
        status: row.status,
        notes: row.notes,
        createdBy: creator ? { id: creator.id, displayName: creator.displayName } : null,
        reservedUntil: active.length
          ? active
              .map((r) => r.until)
              .sort()
              .at(-1)!
          : null,
        runId: row.runId,
        createdAt: row.createdAt,
        updatedAt: row.updatedAt,
      });
    }
    return result;
  }

  async function detail(repos: Repositories, id: number, today = todayIso()): Promise<PlanDetail> {
    const plan = await requirePlan(repos, id);
    const [summary] = await summaries(repos, [plan]);
    const { check, procedure } = await stockCheckOf(repos, plan, today);
    const chemicals = await planChemicals(repos, procedure);
    return {
      ...summary!,
      stockCheck: check,
      hazards: hazardsOf(chemicals.values()),
      cautions: {
        text: procedure.row.cautions,
        flags: procedure.row.cautionFlags,
        items: cautionItems(procedure.row.cautionFlags),
      },
      safetyDeferral,
      reservations: await presentReservations(repos, id, today),
      steps: presentSteps(procedure.row.steps),
    };
  }

  async function sweep() {
    await store.transaction((repos) => sweepLapsedPlans(repos));
  }

  return {
    sweep,

    async list(query: PlanListQuery, actor: User): Promise<Page<Plan>> {
      await sweep();
      const { rows, total } = await store.repos.plans.list(query, query.mine ? actor.id : null);
      return {
        items: await summaries(store.repos, rows),
        total,
        page: query.page,
        pageSize: query.pageSize,
      };
    },

    async get(id: number): Promise<PlanDetail> {
      await sweep();
      return detail(store.repos, id);
    },

    /**
     * The stock check, hazards and cautions a plan would have, without saving it: what the
     * form shows before "Save this plan".
     */
    async preview(input: PlanCreateParsed, today = todayIso()): Promise<PlanPreview> {
      const repos = store.repos;
      const procedure = await repos.procedures.findRow(input.procedureId);
      if (!procedure) {
        throw AppError.validation(`There is no procedure #${input.procedureId}.`, {
          procedureId: `no procedure #${input.procedureId}`,
        });
      }
      const loaded = await loadProcedure(repos, input.procedureId);
      requireMeasurableFactor(loaded, input.scaleFactor, 'scaleFactor');
      // Id 0 is no plan: every active reservation counts as another plan's.
      const { check } = await stockCheckOf(repos, { ...input, id: 0 }, today, loaded);
      const chemicals = await planChemicals(repos, loaded);
      return {
        totalFactor: input.scaleFactor * input.benches * (1 + input.overagePercent / 100),
        stockCheck: check,
        hazards: hazardsOf(chemicals.values()),
        cautions: {
          text: loaded.row.cautions,
          flags: loaded.row.cautionFlags,
          items: cautionItems(loaded.row.cautionFlags),
        },
        safetyDeferral,
      };
    },

    async create(input: PlanCreateParsed, actor: User): Promise<PlanDetail> {
      return store.transaction(async (repos) => {
        const procedure = await repos.procedures.findRow(input.procedureId);
        if (!procedure) {
          throw AppError.validation(`There is no procedure #${input.procedureId}.`, {
            procedureId: `no procedure #${input.procedureId}`,
          });
        }
        requireMeasurableFactor(
          await loadProcedure(repos, input.procedureId),
          input.scaleFactor,
          'scaleFactor',
        );
        const now = nowIso();
        const id = await repos.plans.insert({
          procedureId: input.procedureId,
          scaleFactor: input.scaleFactor,
          benches: input.benches,
          overagePercent: input.overagePercent,
          plannedOn: input.plannedOn,
          status: 'draft',
          notes: input.notes,
          createdById: actor.id,
          runId: null,
          createdAt: now,
          updatedAt: now,
        });
        return detail(repos, id);
      });
    },

    async update(id: number, patch: PlanPatch, actor: User): Promise<PlanDetail> {
      return store.transaction(async (repos) => {
        const plan = await requirePlan(repos, id);
        requireOwnPlan(plan, actor);
        refuseClosed(plan, 'changed');
        if (patch.scaleFactor !== undefined) {
          const procedure = await loadProcedure(repos, plan.procedureId);
          requireMeasurableFactor(procedure, patch.scaleFactor, 'scaleFactor');
        }
        await repos.plans.update(id, { ...patch, updatedAt: nowIso() });
        return detail(repos, id);
      });
    },

    async cancel(id: number, actor: User): Promise<PlanDetail> {
      return store.transaction(async (repos) => {
        const plan = await requirePlan(repos, id);
        requireOwnPlan(plan, actor);
        refuseClosed(plan, 'cancelled');
        const now = nowIso();
        await repos.plans.release(id, 'cancelled', now);
        await repos.plans.update(id, { status: 'cancelled', updatedAt: now });
        return detail(repos, id);
      });
    },

    /**
     * Holds containers for the plan until a date, replacing what it held before. All or
     * nothing: a container with less free than asked (others' reservations taken off)
     * refuses the whole request with 409 naming it.
     */
    async reserve(id: number, input: ReservationCreateParsed, actor: User): Promise<PlanDetail> {
      return store.transaction(async (repos) => {
        const today = todayIso();
        await sweepLapsedPlans(repos, today);
        const plan = await requirePlan(repos, id);
        requireOwnPlan(plan, actor);
        refuseClosed(plan, 'reserved for');
        const until = input.until ?? plan.plannedOn;
        if (until < today) {
          throw AppError.validation(
            `A reservation until ${date(until)} would already have run out: choose today (${date(today)}) or later.`,
            { until: 'is in the past' },
          );
        }
        const now = nowIso();
        await repos.plans.release(id, 'replaced', now);

        let items: {
          containerId: number;
          quantity: number;
          unit?: string;
          requirementIndex: number | null;
        }[];
        if (input.items) {
          items = input.items.map((item) => ({
            containerId: item.containerId,
            quantity: item.quantity,
            ...(item.unit === undefined ? {} : { unit: item.unit }),
            requirementIndex: item.requirementIndex ?? null,
          }));
        } else {
          const { check } = await stockCheckOf(repos, plan, today);
          items = check.lines.flatMap((line) =>
            line.take
              .filter((take) => take.take > epsilon)
              .map((take) => ({
                containerId: take.containerId,
                quantity: take.take,
                requirementIndex: line.index,
              })),
          );
          if (items.length === 0) {
            throw AppError.conflict(
              'There is nothing in stock to reserve for this plan: see the shortfalls in its stock check.',
            );
          }
        }

        // Sum what is asked of each container, in its own unit.
        const asked = new Map<number, { quantity: number; requirementIndex: number | null }[]>();
        for (const [index, item] of items.entries()) {
          const container = await repos.containers.findRow(item.containerId);
          if (!container) {
            throw AppError.validation(`There is no container #${item.containerId}.`, {
              [`items.${index}.containerId`]: `no container #${item.containerId}`,
            });
          }
          const chemical = (await repos.chemicals.findRow(container.chemicalId))!;
          const quantity = item.unit
            ? toStockUnit(item.quantity, item.unit, chemical, `items.${index}.quantity`)
            : item.quantity;
          const list = asked.get(container.id) ?? [];
          list.push({ quantity, requirementIndex: item.requirementIndex });
          asked.set(container.id, list);
        }
        const inForce = await repos.plans.activeOn([...asked.keys()], today);
        for (const [containerId, parts] of asked) {
          const container = (await repos.containers.findRow(containerId))!;
          if (container.status !== 'sealed' && container.status !== 'open') {
            throw AppError.conflict(
              `${container.labelCode} is ${container.status}; it cannot be reserved.`,
              { items: `${container.labelCode} is ${container.status}` },
            );
          }
          if (container.expiresOn !== null && container.expiresOn < until) {
            throw AppError.conflict(
              `${container.labelCode} expires on ${date(container.expiresOn)}, before ${date(until)}; it cannot be reserved until then.`,
              { items: `${container.labelCode} expires on ${date(container.expiresOn)}` },
            );
          }
          const others = inForce.filter((r) => r.containerId === containerId && r.planId !== id);
          const heldNow = allocateHolds(container.quantity, others);
          const held = [...heldNow.values()].reduce((sum, amount) => sum + amount, 0);
          const free = Math.max(0, container.quantity - held);
          const want = parts.reduce((sum, part) => sum + part.quantity, 0);
          if (want > free + epsilon) {
            const holders = [...new Set(others.map((r) => `#${r.planId}`))].join(', ');
            const freeText = formatQuantity(free, container.unit, { rounding: 'down' });
            throw AppError.conflict(
              `${container.labelCode} has only ${freeText} free` +
                (held > 0
                  ? ` (${amount(held, container.unit)} of its ${amount(container.quantity, container.unit)} are reserved by plan ${holders})`
                  : '') +
                `; ${amount(want, container.unit)} cannot be reserved. Nothing was reserved.`,
              { items: `at most ${freeText} of ${container.labelCode} is free` },
            );
          }
          for (const part of parts) {
            await repos.plans.insertReservation({
              planId: id,
              containerId,
              requirementIndex: part.requirementIndex,
              quantity: tidy(part.quantity),
              unit: container.unit,
              until,
              status: 'active',
              releasedReason: null,
              releasedAt: null,
              createdById: actor.id,
              createdAt: now,
            });
          }
        }
        await repos.plans.update(id, { status: 'reserved', updatedAt: now });
        return detail(repos, id, today);
      });
    },

    /** The dispensing sheet: per bench amounts, rounded for the bench, with hazards. */
    async dispensing(id: number): Promise<DispensingSheet> {
      await sweep();
      const repos = store.repos;
      const plan = await requirePlan(repos, id);
      const procedure: LoadedProcedure = await loadProcedure(repos, plan.procedureId);
      const { check } = await stockCheckOf(repos, plan, todayIso(), procedure);
      const perBenchLines = chemLinesOf(procedure, plan.scaleFactor);
      const chemicals = await planChemicals(repos, procedure);
      return {
        planId: plan.id,
        procedure: {
          id: procedure.row.id,
          title: procedure.row.title,
          reference: procedure.row.reference,
          baseScale: procedure.row.baseScale,
        },
        plannedOn: plan.plannedOn,
        scaleFactor: plan.scaleFactor,
        benches: plan.benches,
        overagePercent: plan.overagePercent,
        lines: check.lines.map((row) => {
          const line = procedure.lines[row.lineIndex]!;
          let perBench: { value: number; unit: string } | null;
          if (row.purpose === 'dissolving') {
            perBench = {
              value: line.dissolvedInQuantity! * plan.scaleFactor,
              unit: line.dissolvedInUnit!,
            };
          } else {
            const chem = perBenchLines[row.lineIndex]!;
            perBench = chem.quantity ?? null;
            if (perBench && /mol$/.test(perBench.unit)) {
              // Nobody weighs moles: show the mass (or volume) to measure instead.
              const amounts = lineAmounts(chem);
              perBench =
                amounts.massG !== undefined
                  ? { value: amounts.massG, unit: 'g' }
                  : amounts.volumeMl !== undefined
                    ? { value: amounts.volumeMl, unit: 'mL' }
                    : perBench;
            }
          }
          const chemical = chemicals.get(row.chemical.id)!;
          return {
            lineIndex: row.lineIndex,
            purpose: row.purpose,
            chemicalId: row.chemical.id,
            name: row.chemical.name,
            role: row.role,
            optional: row.optional,
            notes:
              row.purpose === 'dissolving' ? `to dissolve line ${row.lineIndex + 1}` : line.notes,
            perBench,
            perBenchDisplay: perBench ? withRoundedText(displayQuantity(perBench)) : null,
            total: row.required,
            totalDisplay: row.requiredDisplay,
            ghsPictograms: chemical.ghsPictograms,
            containers: row.take.map((take) => ({
              containerId: take.containerId,
              labelCode: take.labelCode,
              locationPath: take.locationPath,
              take: take.take,
              quantity: take.quantity,
              unit: row.unit,
            })),
            stock: {
              status: row.status,
              unit: row.unit,
              shortfall: row.shortfall,
              problem: row.problem,
              suggestions: row.suggestions,
              benchesCovered: row.benchesCovered,
              remedy: row.remedy,
            },
          };
        }),
        shortCount: check.shortCount,
        benchesServed: check.benchesServed,
        hazards: hazardsOf(chemicals.values()),
        cautions: {
          text: procedure.row.cautions,
          flags: procedure.row.cautionFlags,
          items: cautionItems(procedure.row.cautionFlags),
        },
        rules: [roundingRules.balance, roundingRules.glassware, roundingRules.amount],
        safetyDeferral,
        steps: presentSteps(procedure.row.steps),
      };
    },
  };
}
export type PlansService = ReturnType<typeof plansService>;
