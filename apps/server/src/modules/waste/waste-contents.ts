import {
  convert,
  dimensionOf,
  LIQUID_CLASSES,
  liquidClassOf,
  rulesBetween,
  type LiquidClass,
} from '@lotwise/chem';
import {
  storageGroups,
  todayIso,
  type StorageConflictWarning,
  type User,
  type WasteAddition,
  type WasteAdditionInputParsed,
  type WasteContainer,
  type WasteContainerDetail,
} from '@lotwise/shared';
import { AppError } from '../../lib/app-error';
import type { Repositories } from '../../db/store';
import { nowIso } from '../../db/sql';
import type { ChemicalRow } from '../chemicals/chemical.entity';
import { hazardGroupsOf } from '../segregation/segregation.service';
import type { WasteAdditionRow, WasteContainerRow } from './waste.entity';

/**
 * What is in waste containers: adding to one (from a run, a draw or by hand, inside the
 * caller's transaction), the segregation check between what goes in and what is there, and
 * the containers as pages show them (fill, age, liquid class, hazards of the contents).
 */

/**
 * The NFPA 30 class a waste counts under: the most severe class among its chemicals. An
 * ignitable waste whose chemicals give no class counts as Class IB, a conservative choice
 * (it counts toward the Class I limits) and said so beside the figure.
 */
export function wasteLiquidClass(
  chemicals: ChemicalRow[],
  ignitable: boolean,
): { liquidClass: LiquidClass | null; note: string | null } {
  let worst: LiquidClass | null = null;
  for (const chemical of chemicals) {
    const found = liquidClassOf(chemical.flashPointC, chemical.boilingPointC);
    if (
      found &&
      (worst === null || LIQUID_CLASSES.indexOf(found) < LIQUID_CLASSES.indexOf(worst))
    ) {
      worst = found;
    }
  }
  if (worst) return { liquidClass: worst, note: null };
  if (ignitable) {
    return {
      liquidClass: 'IB',
      note: 'Ignitable, and no flash point is known for its contents: counted as Class IB to be on the safe side.',
    };
  }
  return { liquidClass: null, note: null };
}

/**
 * An amount in `toUnit`: directly within mass or volume; between them as if 1 g were 1 mL
 * (waste amounts are estimates; common practice, no source). Null for amounts of substance.
 */
export function approximateIn(value: number, unit: string, toUnit: string): number | null {
  const from = dimensionOf(unit);
  const to = dimensionOf(toUnit);
  if (from === 'amount' || to === 'amount') return null;
  if (from === to) return convert(value, unit, toUnit);
  return convert(
    convert(value, unit, from === 'mass' ? 'g' : 'mL'),
    to === 'mass' ? 'g' : 'mL',
    toUnit,
  );
}

function daysFrom(startIso: string, today: string): number {
  return Math.round(
    (Date.parse(`${today}T00:00:00Z`) - Date.parse(`${startIso}T00:00:00Z`)) / 86_400_000,
  );
}

function groupLabel(group: string): string {
  return storageGroups[group as keyof typeof storageGroups]?.label.toLowerCase() ?? group;
}

/**
 * The segregation rules the chemicals of an addition break with what a waste container holds
 * already (the storage table of packages/chem), as confirmation warnings.
 */
export async function wasteConflicts(
  repos: Repositories,
  container: WasteContainerRow,
  incoming: ChemicalRow[],
): Promise<StorageConflictWarning[]> {
  const inside = await chemicalsIn(repos, [container.id]);
  const there = inside.get(container.id) ?? [];
  const location = await repos.locations.findRow(container.locationId);
  const warnings: StorageConflictWarning[] = [];
  for (const mine of incoming) {
    for (const theirs of there) {
      if (theirs.id === mine.id) continue;
      for (const rule of rulesBetween(hazardGroupsOf(mine), hazardGroupsOf(theirs))) {
        const mineGroups = hazardGroupsOf(mine) as string[];
        const [myGroup, theirGroup] = mineGroups.includes(rule.a)
          ? [rule.a, rule.b]
          : [rule.b, rule.a];
        warnings.push({
          kind: 'storage_conflict',
          message: `${mine.name} (${groupLabel(myGroup)}) must not go into ${container.labelCode} "${container.title}", which holds ${theirs.name} (${groupLabel(theirGroup)}): ${rule.reason}`,
          code: 'incompatible_groups',
          reason: rule.reason,
          source: rule.source,
          groups: [myGroup, theirGroup] as StorageConflictWarning['groups'],
          locationId: container.locationId,
          locationPath: location?.path ?? '',
          labelCodes: [container.labelCode],
        });
      }
    }
  }
  return warnings;
}

/** The chemicals that went into each container, once each, in the order they went in. */
export async function chemicalsIn(
  repos: Repositories,
  containerIds: number[],
): Promise<Map<number, ChemicalRow[]>> {
  const additions = await repos.waste.additionsOf(containerIds);
  const links = await repos.waste.chemicalsOfAdditions(additions.map((a) => a.id));
  const chemicals = new Map(
    (await repos.chemicals.findRows([...new Set(links.map((l) => l.chemicalId))])).map((c) => [
      c.id,
      c,
    ]),
  );
  const containerOf = new Map(additions.map((a) => [a.id, a.wasteContainerId]));
  const result = new Map<number, ChemicalRow[]>();
  for (const link of links) {
    const containerId = containerOf.get(link.wasteAdditionId)!;
    const list = result.get(containerId) ?? [];
    const chemical = chemicals.get(link.chemicalId);
    if (chemical && !list.some((c) => c.id === chemical.id)) list.push(chemical);
    result.set(containerId, list);
  }
  return result;
}

/** Where in the request a field of an addition is: `waste.0.unit`, `toWasteContainerId`. */
export type WasteField = (name: 'wasteContainerId' | 'chemicalIds' | 'unit') => string;

/** The fields of an addition under `prefix` (`waste.0.`). */
export const wasteFieldsAt =
  (prefix: string): WasteField =>
  (name) =>
    `${prefix}${name}`;

/**
 * Checks additions before anything is written (inside the caller's transaction): each
 * container exists and is open, each chemical exists, and the amount is a mass or a volume.
 * Answers the segregation warnings the additions raise (empty once confirmed).
 */
export async function checkWaste(
  repos: Repositories,
  inputs: { input: WasteAdditionInputParsed; field: WasteField }[],
  confirmed: boolean,
): Promise<StorageConflictWarning[]> {
  const warnings: StorageConflictWarning[] = [];
  for (const { input, field } of inputs) {
    const containerField = field('wasteContainerId');
    const container = await repos.waste.findContainer(input.wasteContainerId);
    if (!container) {
      throw AppError.validation(`There is no waste container #${input.wasteContainerId}.`, {
        [containerField]: `no waste container #${input.wasteContainerId}`,
      });
    }
    if (container.status !== 'open') {
      throw AppError.conflict(
        `${container.labelCode} "${container.title}" is ${container.status === 'full' ? 'marked full' : 'picked up'}: choose an open waste container.`,
        { [containerField]: `${container.labelCode} is not open` },
      );
    }
    const chemicals = await repos.chemicals.findRows(input.chemicalIds);
    const missing = input.chemicalIds.filter((id) => !chemicals.some((c) => c.id === id));
    if (missing.length > 0) {
      throw AppError.validation(`There is no chemical #${missing[0]}.`, {
        [field('chemicalIds')]: `no chemical #${missing[0]}`,
      });
    }
    if (approximateIn(input.quantity, input.unit, container.capacityUnit) === null) {
      throw AppError.validation('Give the waste as a mass or a volume.', {
        [field('unit')]: 'must be a mass or volume unit',
      });
    }
    if (!confirmed) warnings.push(...(await wasteConflicts(repos, container, chemicals)));
  }
  return warnings;
}

/**
 * Runs `write` (a write that may ask for confirmation itself, e.g. holds) and then asks for the
 * waste warnings too, so a person sees every warning of one request at once.
 */
export async function withWasteWarnings<T>(
  warnings: StorageConflictWarning[],
  write: () => Promise<T>,
): Promise<T> {
  let result: T;
  try {
    result = await write();
  } catch (error) {
    if (error instanceof AppError && error.code === 'confirmation_required' && warnings.length) {
      throw AppError.confirmationRequired(error.message, [...(error.warnings ?? []), ...warnings]);
    }
    throw error;
  }
  if (warnings.length > 0) {
    throw AppError.confirmationRequired(
      'What goes into the waste container conflicts with what it holds: confirm to add it anyway, or choose another waste container.',
      warnings,
    );
  }
  return result;
}

/**
 * Adds to a waste container inside the caller's transaction, after `checkWaste`: starts the
 * accumulation date with the first addition.
 */
export async function writeWaste(
  repos: Repositories,
  input: WasteAdditionInputParsed,
  source: { runId?: number | null; ledgerEntryId?: number | null },
  actor: User,
  options: { now?: string; today?: string } = {},
): Promise<number> {
  const now = options.now ?? nowIso();
  const today = options.today ?? todayIso();
  const container = (await repos.waste.findContainer(input.wasteContainerId))!;
  const id = await repos.waste.insertAddition(
    {
      wasteContainerId: container.id,
      description: input.description,
      quantity: input.quantity,
      unit: input.unit,
      runId: source.runId ?? null,
      ledgerEntryId: source.ledgerEntryId ?? null,
      addedById: actor.id,
      addedAt: now,
    },
    input.chemicalIds,
  );
  await repos.waste.updateContainer(container.id, {
    accumulationStartOn: container.accumulationStartOn ?? today,
    updatedAt: now,
  });
  return id;
}

/** Checks and writes one addition (inside the caller's transaction); 409 on a conflict. */
export async function addWaste(
  repos: Repositories,
  input: WasteAdditionInputParsed,
  source: { runId?: number | null; ledgerEntryId?: number | null },
  actor: User,
  options: { confirm: boolean; now?: string; today?: string },
): Promise<number> {
  const warnings = await checkWaste(repos, [{ input, field: wasteFieldsAt('') }], options.confirm);
  return withWasteWarnings(warnings, () => writeWaste(repos, input, source, actor, options));
}

/** Waste containers as lists show them. */
export async function presentWasteContainers(
  repos: Repositories,
  rows: WasteContainerRow[],
  today = todayIso(),
): Promise<WasteContainer[]> {
  if (rows.length === 0) return [];
  const ids = rows.map((r) => r.id);
  const additions = await repos.waste.additionsOf(ids);
  const contents = await chemicalsIn(repos, ids);
  const locations = new Map(
    (await repos.locations.rowsByIds([...new Set(rows.map((r) => r.locationId))])).map((l) => [
      l.id,
      l,
    ]),
  );
  return rows.map((row) => {
    let filled: number | null = 0;
    for (const addition of additions.filter((a) => a.wasteContainerId === row.id)) {
      const amount = approximateIn(addition.quantity, addition.unit, row.capacityUnit);
      filled = filled === null || amount === null ? null : filled + amount;
    }
    const { liquidClass, note } =
      row.form === 'liquid'
        ? wasteLiquidClass(contents.get(row.id) ?? [], row.characteristics.includes('ignitable'))
        : { liquidClass: null, note: null };
    return {
      kind: 'waste' as const,
      id: row.id,
      labelCode: row.labelCode,
      title: row.title,
      locationId: row.locationId,
      locationPath: locations.get(row.locationId)?.path ?? '',
      capacity: row.capacity,
      capacityUnit: row.capacityUnit,
      filled: filled === null ? null : Math.round(filled * 1e6) / 1e6,
      fillFraction: filled === null ? null : filled / row.capacity,
      form: row.form,
      characteristics: row.characteristics,
      acutelyHazardous: row.acutelyHazardous,
      liquidClass,
      liquidClassNote: note,
      accumulationStartOn: row.accumulationStartOn,
      ageDays: row.accumulationStartOn ? daysFrom(row.accumulationStartOn, today) : null,
      status: row.status,
      pickupId: row.pickupId,
      notes: row.notes,
      createdAt: row.createdAt,
      updatedAt: row.updatedAt,
    };
  });
}

function presentAddition(
  addition: WasteAdditionRow,
  chemicals: ChemicalRow[],
  addedByName: string | null,
): WasteAddition {
  return {
    id: addition.id,
    wasteContainerId: addition.wasteContainerId,
    description: addition.description,
    quantity: addition.quantity,
    unit: addition.unit,
    chemicals: chemicals.map((c) => ({
      id: c.id,
      name: c.name,
      ghsPictograms: c.ghsPictograms,
      hazardStatements: c.hazardStatements,
    })),
    runId: addition.runId,
    ledgerEntryId: addition.ledgerEntryId,
    addedById: addition.addedById,
    addedByName,
    addedAt: addition.addedAt,
  };
}

/** One waste container with every addition and the hazards of what went in. */
export async function wasteContainerDetail(
  repos: Repositories,
  id: number,
): Promise<WasteContainerDetail> {
  const row = await repos.waste.findContainer(id);
  if (!row) throw AppError.notFound(`There is no waste container #${id}.`);
  const [container] = await presentWasteContainers(repos, [row]);
  const additions = await repos.waste.additionsOf([id]);
  const links = await repos.waste.chemicalsOfAdditions(additions.map((a) => a.id));
  const chemicals = new Map(
    (await repos.chemicals.findRows([...new Set(links.map((l) => l.chemicalId))])).map((c) => [
      c.id,
      c,
    ]),
  );
  const users = new Map(
    (
      await repos.users.findByIds([
        ...new Set(additions.flatMap((a) => (a.addedById ? [a.addedById] : []))),
      ])
    ).map((u) => [u.id, u.displayName]),
  );
  const presented = additions.map((a) =>
    presentAddition(
      a,
      links.filter((l) => l.wasteAdditionId === a.id).map((l) => chemicals.get(l.chemicalId)!),
      a.addedById ? (users.get(a.addedById) ?? null) : null,
    ),
  );
  const all = [...chemicals.values()].map((c) => ({
    id: c.id,
    name: c.name,
    ghsPictograms: c.ghsPictograms,
    hazardStatements: c.hazardStatements,
  }));
  return {
    ...container!,
    additions: presented,
    chemicals: all,
    ghsPictograms: [...new Set(all.flatMap((c) => c.ghsPictograms))],
  };
}
