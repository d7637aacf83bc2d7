import {
  addDays,
  bulkDensityMissingMessage,
  ChemError,
  convert,
  dimensionOf,
  toMass,
  toVolume,
} from '@lotwise/chem';
import {
  amountProblem,
  fireClassOf,
  formatLabelCode,
  maxStockAmount,
  maxStockAmountText,
  formatQuantity,
  labelCodeToLookUp,
  normalizeLabelCode,
  todayIso,
  type Container,
  type ContainerChange,
  type ContainerHold,
  type ContainerMaterial,
  type ContainerCreateParsed,
  type ContainerDetail,
  type ContainerListQuery,
  type ContainerPatch,
  type ContainerStatus,
  type DrawParsed,
  type LedgerEntry,
  type LedgerListQuery,
  type LedgerReason,
  type Page,
  type SegregationWarning,
  type PhysicalState,
  type StockUnit,
  type User,
  type adjustmentSchema,
  type disposalSchema,
  type splitSchema,
  type transferSchema,
} from '@lotwise/shared';
import type { z } from 'zod';
import { AppError } from '../../lib/app-error';
import { checkWaste, withWasteWarnings, writeWaste } from '../waste/waste-contents';
import { noteLedgerChange, type Repositories, type Store } from '../../db/store';
import { fromMicro, roundToStored, toMicro } from '../../db/quantities';
import { nowIso } from '../../db/sql';
import type { ChemicalRow } from '../chemicals/chemical.entity';
import { sdsOf } from '../chemicals/chemicals.repository';
import { requireLocation } from '../locations/locations.service';
import type { LocationRow } from '../locations/location.entity';
import { requireLot } from '../lots/lots.service';
import { holdsOfContainers, requireHoldsConfirmed } from '../plans/holds';
import { segregationService } from '../segregation/segregation.service';
import type { ContainerRow } from './container.entity';
import { peroxideDueOf } from './peroxide-dates';
import { checkPlacement } from './placement';
import type { ContainerView, LedgerEntryValues } from './containers.repository';

type AdjustmentParsed = z.output<typeof adjustmentSchema>;
type SplitParsed = z.output<typeof splitSchema>;
type TransferParsed = z.output<typeof transferSchema>;
type DisposalParsed = z.output<typeof disposalSchema>;

/** Quantities are kept to a millionth of a gram or millilitre, so sums do not drift. */
export function roundQuantity(value: number): number {
  const rounded = Math.round(value * 1e6) / 1e6;
  return Object.is(rounded, -0) ? 0 : rounded;
}

const epsilon = 1e-6;

/** What a conversion needs to know about the chemical. */
interface ChemicalFacts {
  name: string;
  density: number | null;
  stockUnit: StockUnit;
  physicalState: PhysicalState;
  bulkDensity: number | null;
}

function amount(value: number, unit: string): string {
  return formatQuantity(value, unit);
}

/** A most that may be taken: rounded down, so what it says can really be taken. */
function limit(value: number, unit: string): string {
  return formatQuantity(value, unit, { rounding: 'down' });
}

/**
 * A quantity a person entered, in the chemical's stock unit: units of the same kind convert
 * directly, a volume of a mass-counted chemical (and the other way round) through the density.
 * The result must be within the amount bounds too (10 000 000 kg is 10^10 g: refused, 400
 * naming `field`).
 */
export function toStockUnit(
  value: number,
  unit: string,
  chemical: ChemicalFacts,
  field: string,
): number {
  const converted = convertToStockUnit(value, unit, chemical, field);
  const problem =
    converted === 0 ? null : amountProblem(Math.abs(converted), 'positive', chemical.stockUnit);
  if (problem) {
    const message = `${amount(value, unit)} is ${amount(converted, chemical.stockUnit)}, which ${problem}.`;
    throw AppError.validation(message, { [field]: message });
  }
  return converted;
}

function convertToStockUnit(
  value: number,
  unit: string,
  chemical: ChemicalFacts,
  field: string,
): number {
  try {
    const dimension = dimensionOf(unit);
    const target = chemical.stockUnit;
    if (dimension === dimensionOf(target)) return convert(value, unit, target);
    const properties = {
      physicalState: chemical.physicalState,
      ...(chemical.density === null ? {} : { density: chemical.density }),
      ...(chemical.bulkDensity === null ? {} : { bulkDensity: chemical.bulkDensity }),
    };
    return target === 'g'
      ? toMass({ value, unit }, properties)
      : toVolume({ value, unit }, properties);
  } catch (error) {
    if (error instanceof ChemError && error.code === 'bulk_density_missing') {
      const message = bulkDensityMissingMessage(
        `${amount(value, unit)} of ${chemical.name}`,
        chemical.stockUnit,
      );
      const sentence = message.charAt(0).toUpperCase() + message.slice(1) + '.';
      throw AppError.validation(sentence, {
        bulkDensity: `is not recorded for ${chemical.name}: add it (g/mL of the poured solid) or weigh it`,
        [field]: `${chemical.name} is a solid: enter the amount in ${chemical.stockUnit}, or record its bulk density`,
      });
    }
    if (error instanceof ChemError && error.code === 'density_missing') {
      throw AppError.validation(
        `${chemical.name} has no density, so ${amount(value, unit)} cannot be turned into ${chemical.stockUnit}. Add its density (g/mL) to the chemical, or enter the amount in ${chemical.stockUnit}.`,
        {
          density: `is not recorded for ${chemical.name}: add it (g/mL at 20 °C) or enter the amount in ${chemical.stockUnit}`,
          [field]: `needs the density of ${chemical.name} to convert ${unit} to ${chemical.stockUnit}`,
        },
      );
    }
    if (error instanceof ChemError)
      throw AppError.validation(error.message, { [field]: error.message });
    throw error;
  }
}

/** The API shape of a container, with what plans hold of it. */
export function presentContainer(
  view: ContainerView,
  holds: ContainerHold[],
  today = todayIso(),
): Container {
  const due = peroxideDueOf(
    view.chemicalPeroxideClass,
    view.openedOn,
    view.lotReceivedOn,
    view.lotExpiresOn,
  );
  return {
    id: view.id,
    labelCode: view.labelCode,
    status: view.status,
    quantity: Number(view.quantity),
    unit: view.unit,
    tareMass: view.tareMass,
    capacity: view.capacity,
    capacityUnit: view.capacityUnit,
    material: view.material ?? null,
    openedOn: view.openedOn,
    expiresOn: view.expiresOn,
    expired: view.expiresOn !== null && view.expiresOn < today,
    peroxide: due ? { ...due, overdue: due.dueOn < today } : null,
    notes: view.notes,
    chemical: {
      id: view.chemicalId,
      name: view.chemicalName,
      formula: view.chemicalFormula,
      casNumber: view.chemicalCasNumber,
      density: view.chemicalDensity,
      physicalState: view.chemicalPhysicalState,
      bulkDensity: view.chemicalBulkDensity,
      storageGroup: view.chemicalStorageGroup,
      extraHazardGroups: view.chemicalExtraHazardGroups,
      ghsPictograms: view.chemicalGhsPictograms,
      hazardStatements: view.chemicalHazardStatements,
      peroxideClass: view.chemicalPeroxideClass,
      stockUnit: view.chemicalStockUnit,
      ...fireClassOf({
        physicalState: view.chemicalPhysicalState,
        flashPointC: view.chemicalFlashPointC,
        boilingPointC: view.chemicalBoilingPointC,
      }),
    },
    lot: {
      id: view.lotId,
      source: view.lotSource,
      supplierName: view.lotSupplierName,
      supplierLotNumber: view.lotSupplierLotNumber,
      grade: view.lotGrade,
      purityPercent: view.lotPurityPercent ?? Number(view.chemicalDefaultPurity),
      receivedOn: view.lotReceivedOn,
      expiresOn: view.lotExpiresOn,
    },
    location: { id: view.locationId, name: view.locationName, path: view.locationPath },
    owner:
      view.ownerId === null || view.ownerId === undefined
        ? null
        : { id: view.ownerId, displayName: view.ownerName ?? '' },
    holds,
    createdAt: view.createdAt,
    updatedAt: view.updatedAt,
  };
}

function notFound(id: number) {
  return AppError.notFound(`There is no container #${id}.`);
}

/** A ledger entry to append: the balance after it is worked out from the container. */
interface Movement {
  delta: number;
  reason: LedgerReason;
  note: string;
  fromLocationId?: number | null;
  toLocationId?: number | null;
  relatedContainerId?: number | null;
  stocktakeId?: number | null;
  /** The run a draw or a product belongs to. */
  runId?: number | null;
  /** The shared order a receipt belongs to. */
  orderId?: number | null;
  /** When it happened, if not now (the demo seed's history). */
  at?: string;
}

/**
 * Appends one entry and stores the new balance on the container in the same transaction.
 * The change and the balance are worked out in whole millionths (what is stored, see
 * db/quantities), so the balance is exactly the sum of the entries. Refuses (409, nothing
 * written) when the balance would fall below zero, and (400) when it would pass the largest
 * amount a container may hold.
 */
export async function appendEntry(
  repos: Repositories,
  container: ContainerRow,
  movement: Movement,
  actor: User | null,
  changes: Partial<ContainerRow> = {},
): Promise<{ entry: LedgerEntry; container: ContainerRow }> {
  let delta = roundToStored(movement.delta);
  let balance = fromMicro(toMicro(container.quantity) + toMicro(delta));
  if (balance > maxStockAmount) {
    const message = `${container.labelCode} would hold ${amount(balance, container.unit)}; one container holds at most ${maxStockAmountText} ${container.unit}.`;
    throw AppError.validation(message, {
      [movement.reason === 'adjusted' ? 'correction' : 'quantity']: message,
    });
  }
  if (balance < 0 && balance >= -epsilon) {
    // Rounding noise on a draw to exactly nothing: take out precisely what is left.
    delta = -container.quantity;
    balance = 0;
  }
  if (balance < 0) {
    throw AppError.conflict(
      `${container.labelCode} holds only ${amount(container.quantity, container.unit)}; ${amount(-delta, container.unit)} cannot be taken from it.`,
      {
        amount: `at most ${limit(container.quantity, container.unit)} is available in ${container.labelCode}`,
      },
    );
  }
  const now = movement.at ?? nowIso();
  const values: LedgerEntryValues = {
    containerId: container.id,
    reason: movement.reason,
    quantity: delta,
    unit: container.unit,
    balanceAfter: balance,
    note: movement.note,
    userId: actor?.id ?? null,
    runId: movement.runId ?? null,
    orderId: movement.orderId ?? null,
    stocktakeId: movement.stocktakeId ?? null,
    fromLocationId: movement.fromLocationId ?? null,
    toLocationId: movement.toLocationId ?? null,
    relatedContainerId: movement.relatedContainerId ?? null,
    createdAt: now,
  };
  const entry = await repos.containers.insertEntry(values);
  noteLedgerChange(repos, container.chemicalId);
  const next = { ...container, ...changes, quantity: values.balanceAfter, updatedAt: now };
  await repos.containers.update(container.id, {
    ...changes,
    quantity: values.balanceAfter,
    updatedAt: now,
  });
  return { entry, container: next };
}

/** Status after a balance change: first use opens a sealed container; nothing left is empty. */
export function statusAfter(
  current: ContainerStatus,
  balance: number,
  today: string,
  openedOn: string | null,
) {
  if (balance <= epsilon) return { status: 'empty' as const, openedOn: openedOn ?? today };
  if (current === 'sealed' || current === 'empty')
    return { status: 'open' as const, openedOn: openedOn ?? today };
  return { status: current, openedOn };
}

/** The peroxide test date of a container of `chemical` opened on `openedOn` (null: not due). */
export async function peroxideDueFor(
  repos: Repositories,
  container: Pick<ContainerRow, 'lotId' | 'openedOn'>,
  chemical: ChemicalRow,
) {
  if (!chemical.peroxideClass) return null;
  const lot = await repos.lots.findRow(container.lotId);
  return (
    peroxideDueOf(chemical.peroxideClass, container.openedOn, lot!.receivedOn, lot!.expiresOn)
      ?.dueOn ?? null
  );
}

/**
 * A new container with the next label code and no quantity yet: its first ledger entry
 * (`received`, or `split` when poured from another) sets the balance. Used by receiving too.
 */
export async function createContainer(
  repos: Repositories,
  values: {
    lotId: number;
    chemical: ChemicalRow;
    location: LocationRow;
    quantity: number;
    status: ContainerStatus;
    openedOn: string | null;
    tareMass: number | null;
    capacity: number | null;
    capacityUnit: string | null;
    /** What it is made of; null or left out: not said. */
    material?: ContainerMaterial | null;
    notes: string;
    expiresOn: string | null;
    /** The member it belongs to; null or left out: the lab's. */
    ownerId?: number | null;
  },
): Promise<ContainerRow> {
  const labelNumber = await repos.containers.nextLabelNumber();
  const now = nowIso();
  const row: Omit<ContainerRow, 'id'> = {
    labelCode: formatLabelCode(labelNumber),
    labelNumber,
    lotId: values.lotId,
    chemicalId: values.chemical.id,
    locationId: values.location.id,
    status: values.status,
    quantity: 0,
    unit: values.chemical.stockUnit,
    tareMass: values.tareMass,
    capacity: values.capacity,
    capacityUnit: values.capacityUnit,
    material: values.material ?? null,
    openedOn: values.openedOn,
    expiresOn: values.expiresOn,
    peroxideDueOn: null,
    notes: values.notes,
    ownerId: values.ownerId ?? null,
    createdAt: now,
    updatedAt: now,
  };
  row.peroxideDueOn = await peroxideDueFor(repos, row, values.chemical);
  const id = await repos.containers.insert(row);
  return { ...row, id };
}

export function containersService(store: Store) {
  async function chemicalOf(repos: Repositories, chemicalId: number): Promise<ChemicalRow> {
    const chemical = await repos.chemicals.findRow(chemicalId);
    if (!chemical) throw new Error(`Container points at missing chemical #${chemicalId}`);
    return chemical;
  }

  async function loadForWrite(repos: Repositories, id: number) {
    const container = await repos.containers.findRow(id);
    if (!container) throw notFound(id);
    return { container, chemical: await chemicalOf(repos, container.chemicalId) };
  }

  function refuseDisposed(container: ContainerRow) {
    if (container.status === 'disposed') {
      throw AppError.conflict(
        `${container.labelCode} was disposed of; nothing more can be recorded on it.`,
      );
    }
  }

  async function detail(repos: Repositories, id: number): Promise<ContainerDetail> {
    const view = await repos.containers.findView(id);
    if (!view) throw notFound(id);
    const today = todayIso();
    const holds = await holdsOfContainers(repos, [{ id, quantity: Number(view.quantity) }], today);
    const container = presentContainer(view, holds.get(id) ?? [], today);
    const location = (await repos.locations.findRow(view.locationId))!;
    const warnings =
      view.status === 'disposed'
        ? []
        : await segregationService(repos).warningsFor(
            { id: view.id, labelCode: view.labelCode },
            {
              id: view.chemicalId,
              name: view.chemicalName,
              storageGroup: view.chemicalStorageGroup,
              extraHazardGroups: view.chemicalExtraHazardGroups,
            },
            location,
          );
    const chemical = await repos.chemicals.findRow(view.chemicalId);
    const sds = chemical ? sdsOf(chemical) : null;
    return { ...container, warnings, sds };
  }

  async function change(
    repos: Repositories,
    id: number,
    entries: LedgerEntry[],
    newContainerId?: number,
  ): Promise<ContainerChange> {
    const container = await detail(repos, id);
    const newContainer =
      newContainerId === undefined ? undefined : await detail(repos, newContainerId);
    const warnings: SegregationWarning[] = newContainer
      ? newContainer.warnings
      : container.warnings;
    return { container, entries, warnings, ...(newContainer ? { newContainer } : {}) };
  }

  /**
   * Runs a ledger write in one transaction, then reads the answer (the container with its holds
   * and storage warnings) after the commit, outside the write queue.
   */
  async function writeThenShow(
    work: (
      repos: Repositories,
    ) => Promise<{ id: number; entries: LedgerEntry[]; newContainerId?: number }>,
  ): Promise<ContainerChange> {
    const written = await store.transaction(work);
    return change(store.repos, written.id, written.entries, written.newContainerId);
  }

  return {
    async list(query: ContainerListQuery): Promise<Page<Container>> {
      const today = todayIso();
      let locationIdPath: string | undefined;
      if (query.locationId) {
        const location = await store.repos.locations.findRow(query.locationId);
        if (!location) return { items: [], total: 0, page: query.page, pageSize: query.pageSize };
        locationIdPath = location.idPath;
      }
      const { items, total } = await store.repos.containers.list(query, {
        today,
        locationIdPath,
        exactLabelCode: query.q ? normalizeLabelCode(query.q) : null,
        expiringBefore:
          query.expiringWithinDays === undefined
            ? undefined
            : addDays(today, query.expiringWithinDays),
        peroxideBefore: addDays(today, query.peroxideDueWithinDays),
      });
      const holds = await holdsOfContainers(
        store.repos,
        items.map((view) => ({ id: view.id, quantity: Number(view.quantity) })),
        today,
      );
      return {
        items: items.map((view) => presentContainer(view, holds.get(view.id) ?? [], today)),
        total,
        page: query.page,
        pageSize: query.pageSize,
      };
    },

    get: (id: number) => detail(store.repos, id),

    async getByLabel(labelCode: string): Promise<ContainerDetail> {
      const code = labelCodeToLookUp(labelCode);
      const view = code ? await store.repos.containers.findViewByLabel(code) : null;
      if (!view) throw AppError.notFound(`No container has the label code ${labelCode}.`);
      return detail(store.repos, view.id);
    },

    async ledger(id: number, query: LedgerListQuery): Promise<Page<LedgerEntry>> {
      if (!(await store.repos.containers.findRow(id))) throw notFound(id);
      const { items, total } = await store.repos.containers.entries(id, query.page, query.pageSize);
      return { items, total, page: query.page, pageSize: query.pageSize };
    },

    async create(input: ContainerCreateParsed, actor: User): Promise<ContainerChange> {
      return writeThenShow(async (repos) => {
        const lot = await requireLot(repos, input.lotId);
        const location = await requireLocation(repos, input.locationId);
        const chemical = await chemicalOf(repos, lot.chemicalId);
        const quantity = roundQuantity(
          toStockUnit(input.quantity, input.unit, chemical, 'quantity'),
        );
        const placement = await checkPlacement(repos, { id: null }, chemical, location, {
          confirmed: input.confirm,
        });
        const row = await createContainer(repos, {
          lotId: lot.id,
          chemical,
          location,
          quantity,
          status: input.status === 'open' || input.openedOn ? 'open' : 'sealed',
          openedOn: input.openedOn ?? (input.status === 'open' ? todayIso() : null),
          tareMass: input.tareMass,
          capacity: input.capacity,
          capacityUnit: input.capacityUnit,
          material: input.material,
          notes: input.notes,
          expiresOn: lot.expiresOn,
        });
        const { entry } = await appendEntry(
          repos,
          row,
          {
            delta: quantity,
            reason: 'received',
            note: `Received into ${location.path}`,
            toLocationId: location.id,
          },
          actor,
          quantity <= epsilon ? { status: 'empty' } : {},
        );
        await placement.settle([row.id]);
        return { id: row.id, entries: [entry] };
      });
    },

    async update(id: number, patch: ContainerPatch): Promise<ContainerDetail> {
      return store.transaction(async (repos) => {
        const { container, chemical } = await loadForWrite(repos, id);
        const next = { ...container, ...patch };
        await repos.containers.update(id, {
          ...patch,
          peroxideDueOn: await peroxideDueFor(repos, next, chemical),
          updatedAt: nowIso(),
        });
        return detail(repos, id);
      });
    },

    /**
     * Records use. The read of the balance, the check and the write happen in one serialized
     * transaction, so parallel draws can never take the balance below zero.
     */
    async draw(id: number, input: DrawParsed, actor: User): Promise<ContainerChange> {
      return writeThenShow(async (repos) => {
        const { container, chemical } = await loadForWrite(repos, id);
        refuseDisposed(container);
        let drawn: number;
        let note = input.note;
        if (input.grossMass !== undefined) {
          if (container.tareMass === null) {
            throw AppError.validation(
              `${container.labelCode} has no tare mass, so its contents cannot be worked out from a gross mass. Record the tare (the empty container with cap, in g) or enter the amount taken.`,
              { grossMass: `${container.labelCode} has no tare mass recorded` },
            );
          }
          const grossG = convert(input.grossMass, input.unit, 'g');
          if (grossG < container.tareMass - epsilon) {
            throw AppError.validation(
              `A gross mass of ${amount(grossG, 'g')} is less than the tare of ${container.labelCode} (${amount(container.tareMass, 'g')}): weigh again with the cap on, or correct the tare.`,
              { grossMass: `is below the tare mass of ${amount(container.tareMass, 'g')}` },
            );
          }
          const net = toStockUnit(
            Math.max(0, grossG - container.tareMass),
            'g',
            chemical,
            'grossMass',
          );
          drawn = roundQuantity(container.quantity - net);
          if (drawn < -epsilon) {
            throw AppError.conflict(
              `${container.labelCode} now holds ${amount(net, container.unit)}, more than its balance of ${amount(container.quantity, container.unit)}: record an adjustment instead of a draw.`,
              { grossMass: 'is more than the container should weigh' },
            );
          }
          note = note || `Weighed ${amount(grossG, 'g')} gross`;
        } else {
          drawn = toStockUnit(input.amount!, input.unit, chemical, 'amount');
        }
        if (roundToStored(drawn) <= 0) {
          throw AppError.validation('Nothing was drawn: the amount works out to 0.', {
            [input.grossMass !== undefined ? 'grossMass' : 'amount']: 'works out to no change',
          });
        }
        if (drawn > container.quantity + epsilon) {
          throw AppError.conflict(
            `${container.labelCode} holds only ${amount(container.quantity, container.unit)}; ${amount(drawn, container.unit)} cannot be drawn from it.`,
            {
              [input.grossMass !== undefined ? 'grossMass' : 'amount']:
                `at most ${limit(container.quantity, container.unit)} is available in ${container.labelCode}`,
            },
          );
        }
        const today = todayIso();
        const toWaste =
          input.toWasteContainerId === undefined
            ? null
            : {
                wasteContainerId: input.toWasteContainerId,
                description: `Drawn from ${container.labelCode} (${chemical.name})${note ? `: ${note}` : ''}`,
                quantity: roundQuantity(drawn),
                unit: container.unit,
                chemicalIds: [chemical.id],
              };
        const wasteWarnings = toWaste
          ? await checkWaste(
              repos,
              [
                {
                  input: toWaste,
                  field: (name) => (name === 'unit' ? 'unit' : 'toWasteContainerId'),
                },
              ],
              input.confirm,
            )
          : [];
        await withWasteWarnings(wasteWarnings, () =>
          requireHoldsConfirmed(repos, [{ container, drawn }], {
            today,
            confirmed: input.confirm,
          }),
        );
        const next = statusAfter(
          container.status,
          container.quantity - drawn,
          today,
          container.openedOn,
        );
        const { entry } = await appendEntry(
          repos,
          container,
          { delta: -Math.min(drawn, container.quantity), reason: 'drawn', note },
          actor,
          {
            ...next,
            peroxideDueOn: await peroxideDueFor(
              repos,
              { lotId: container.lotId, openedOn: next.openedOn },
              chemical,
            ),
          },
        );
        if (toWaste) await writeWaste(repos, toWaste, { ledgerEntryId: entry.id }, actor);
        return { id: id, entries: [entry] };
      });
    },

    async adjust(id: number, input: AdjustmentParsed, actor: User): Promise<ContainerChange> {
      return writeThenShow(async (repos) => {
        const { container, chemical } = await loadForWrite(repos, id);
        refuseDisposed(container);
        const delta =
          input.countedQuantity !== undefined
            ? toStockUnit(input.countedQuantity, input.unit, chemical, 'countedQuantity') -
              container.quantity
            : input.correction! < 0
              ? -toStockUnit(-input.correction!, input.unit, chemical, 'correction')
              : toStockUnit(input.correction!, input.unit, chemical, 'correction');
        if (container.quantity + delta < -epsilon) {
          throw AppError.conflict(
            `${container.labelCode} holds ${amount(container.quantity, container.unit)}; a correction of ${amount(delta, container.unit)} would leave less than nothing.`,
            { correction: `at most −${limit(container.quantity, container.unit)}` },
          );
        }
        const result = await recordAdjustment(repos, container, delta, input.note, actor, null);
        return { id: id, entries: [result] };
      });
    },

    async split(id: number, input: SplitParsed, actor: User): Promise<ContainerChange> {
      return writeThenShow(async (repos) => {
        const { container, chemical } = await loadForWrite(repos, id);
        refuseDisposed(container);
        const location = await requireLocation(repos, input.locationId);
        const quantity = roundQuantity(
          toStockUnit(input.quantity, input.unit, chemical, 'quantity'),
        );
        if (quantity > container.quantity + epsilon) {
          throw AppError.conflict(
            `${container.labelCode} holds only ${amount(container.quantity, container.unit)}; ${amount(quantity, container.unit)} cannot be split off.`,
            {
              quantity: `at most ${limit(container.quantity, container.unit)} is available in ${container.labelCode}`,
            },
          );
        }
        // A bottle poured off onto the shelf its source stands on adds no new conflict.
        const placement = await checkPlacement(repos, { id: null }, chemical, location, {
          confirmed: input.confirm,
          storage: location.id !== container.locationId,
        });
        const today = todayIso();
        const created = await createContainer(repos, {
          lotId: container.lotId,
          chemical,
          location,
          quantity,
          status: 'open',
          openedOn: today,
          tareMass: input.tareMass,
          capacity: input.capacity,
          capacityUnit: input.capacityUnit,
          material: input.material,
          notes: input.note,
          expiresOn: container.expiresOn,
        });
        const next = statusAfter(
          container.status,
          container.quantity - quantity,
          today,
          container.openedOn,
        );
        const out = await appendEntry(
          repos,
          container,
          {
            delta: -quantity,
            reason: 'split',
            note: input.note || `Split into ${created.labelCode}`,
            relatedContainerId: created.id,
            fromLocationId: container.locationId,
            toLocationId: location.id,
          },
          actor,
          {
            ...next,
            peroxideDueOn: await peroxideDueFor(
              repos,
              { lotId: container.lotId, openedOn: next.openedOn },
              chemical,
            ),
          },
        );
        const into = await appendEntry(
          repos,
          created,
          {
            delta: quantity,
            reason: 'split',
            note: input.note || `Split from ${container.labelCode}`,
            relatedContainerId: container.id,
            fromLocationId: container.locationId,
            toLocationId: location.id,
          },
          actor,
        );
        await placement.settle([created.id]);
        return { id: id, entries: [out.entry, into.entry], newContainerId: created.id };
      });
    },

    async transfer(id: number, input: TransferParsed, actor: User): Promise<ContainerChange> {
      return writeThenShow(async (repos) => {
        const { container, chemical } = await loadForWrite(repos, id);
        refuseDisposed(container);
        const to = await requireLocation(repos, input.locationId);
        if (to.id === container.locationId) {
          throw AppError.validation(`${container.labelCode} is already in ${to.path}.`, {
            locationId: 'is where the container already is',
          });
        }
        const placement = await checkPlacement(repos, { id: container.id }, chemical, to, {
          confirmed: input.confirm,
        });
        const from = (await repos.locations.findRow(container.locationId))!;
        const { entry } = await appendEntry(
          repos,
          container,
          {
            delta: 0,
            reason: 'transferred',
            note: input.note || `Moved from ${from.path} to ${to.path}`,
            fromLocationId: from.id,
            toLocationId: to.id,
          },
          actor,
          { locationId: to.id },
        );
        await placement.settle([container.id]);
        return { id: id, entries: [entry] };
      });
    },

    async dispose(id: number, input: DisposalParsed, actor: User): Promise<ContainerChange> {
      return writeThenShow(async (repos) => {
        const { container } = await loadForWrite(repos, id);
        refuseDisposed(container);
        const entry = await recordDisposal(repos, container, input.note || 'Disposed', actor, null);
        return { id: id, entries: [entry] };
      });
    },
  };
}
export type ContainersService = ReturnType<typeof containersService>;

/** An `adjusted` entry of `delta` (stock unit), with the status that follows. */
export async function recordAdjustment(
  repos: Repositories,
  container: ContainerRow,
  delta: number,
  note: string,
  actor: User | null,
  stocktakeId: number | null,
): Promise<LedgerEntry> {
  const balance = container.quantity + delta;
  const changes: Partial<ContainerRow> =
    balance <= epsilon
      ? { status: 'empty' }
      : container.status === 'empty'
        ? { status: 'open' }
        : {};
  const { entry } = await appendEntry(
    repos,
    container,
    { delta: Math.max(delta, -container.quantity), reason: 'adjusted', note, stocktakeId },
    actor,
    changes,
  );
  return entry;
}

/** A `disposed` entry taking out whatever is left; the container is disposed. */
export async function recordDisposal(
  repos: Repositories,
  container: ContainerRow,
  note: string,
  actor: User | null,
  stocktakeId: number | null,
): Promise<LedgerEntry> {
  const { entry } = await appendEntry(
    repos,
    container,
    {
      delta: -container.quantity,
      reason: 'disposed',
      note,
      stocktakeId,
      fromLocationId: container.locationId,
    },
    actor,
    { status: 'disposed' },
  );
  return entry;
}
