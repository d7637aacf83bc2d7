import { instructionalProblem, type FlammableLimitsInput } from '@lotwise/chem';
import {
  formatQuantity,
  labAreaStatusLabels,
  type LabArea,
  type LabAreaCreateParsed,
  type LabAreaDetail,
  type LabAreaPatch,
  type TodayItem,
} from '@lotwise/shared';
import { AppError } from '../../lib/app-error';
import type { Repositories, Store } from '../../db/store';
import { nowIso } from '../../db/sql';
import { requireLocation } from '../locations/locations.service';
import { requireRuleSet } from '../rule-sets/rule-sets.service';
import type { RuleSetRow } from '../rule-sets/rule-set.entity';
import type { LabAreaRow } from './lab-area.entity';
import { limitsOf, loadAreaData, totalsOf, type ExtraVolumes } from './lab-area-totals';

function notFound(id: number) {
  return AppError.notFound(`There is no lab area #${id}.`);
}

/** Every area with its totals (four statements, whatever the number of containers). */
export async function allAreaTotals(repos: Repositories, extra?: ExtraVolumes) {
  const areas = await repos.labAreas.list();
  const data = await loadAreaData(repos, areas);
  return areas.map((area) => totalsOf(data, area, extra));
}

const litres = (value: number) => formatQuantity(value, 'L', { decimals: 2 });

/**
 * The start page's items: areas over a limit (critical) or at 90 % of one (warning), the
 * worst first, each naming the limits concerned and the rule set.
 */
export async function labAreasNearLimits(repos: Repositories): Promise<TodayItem[]> {
  const areas = (await allAreaTotals(repos))
    .map((t) => t.area)
    .filter((a) => a.status !== 'within')
    .sort((a, b) => (b.worstFractionUsed ?? Infinity) - (a.worstFractionUsed ?? Infinity));
  return areas.map((area): TodayItem => {
    const concerned = area.limits.filter((l) => l.status !== 'within');
    return {
      key: `lab-area:${area.id}`,
      severity: area.status === 'over' ? 'critical' : 'warning',
      status: labAreaStatusLabels[area.status],
      title: area.path,
      detail: `${concerned.length === 1 ? 'One flammable-liquid limit' : `${concerned.length} flammable-liquid limits`} ${area.status === 'over' ? 'passed' : 'at 90 % or more'} (${area.flammableRuleSet.citation}).`,
      notes: [
        ...concerned.map(
          (l) =>
            `${l.label}: ${litres(l.heldLitres)} of ${litres(l.limitLitres)}${l.fractionUsed === null ? '' : ` (${Math.round(l.fractionUsed * 100)} %)`}.`,
        ),
        area.reminder,
      ],
      link: `/stock/lab-areas/${area.id}`,
      chemicals: [],
      dueOn: null,
    };
  });
}

/** The class, storey and rule set of an area must fit together (400 naming the field). */
function checkFits(
  area: Pick<LabAreaRow, 'unitClass' | 'instructional' | 'floorArea' | 'floorAreaUnit' | 'storey'>,
  set: RuleSetRow,
) {
  const problem = instructionalProblem(set.data as unknown as FlammableLimitsInput, area);
  if (problem) {
    throw AppError.validation(`${problem[0]!.toUpperCase()}${problem.slice(1)} (${set.name}).`, {
      unitClass: problem,
    });
  }
  limitsOf(area, set);
}

export function labAreasService(store: Store) {
  async function detailOf(repos: Repositories, id: number): Promise<LabAreaDetail> {
    const [area] = await repos.labAreas.list([id]);
    if (!area) throw notFound(id);
    const data = await loadAreaData(repos, [area]);
    return totalsOf(data, area).detail;
  }

  /** A place inside an area, or holding one, cannot be marked (409 naming it). */
  async function refuseNested(repos: Repositories, locationId: number, exceptId?: number) {
    const location = await requireLocation(repos, locationId);
    const related = (await repos.labAreas.related(location.idPath)).filter(
      (a) => a.id !== exceptId,
    );
    const same = related.find((a) => a.locationId === location.id);
    if (same) {
      throw AppError.conflict(`${location.path} is already marked as a lab area.`, {
        locationId: 'is already a lab area',
      });
    }
    const above = related.find((a) => location.idPath.startsWith(a.idPath));
    if (above) {
      throw AppError.conflict(
        `${location.path} is inside ${above.path}, which is already a lab area: its liquids count there.`,
        { locationId: `is inside the lab area ${above.path}` },
      );
    }
    if (related.length > 0) {
      throw AppError.conflict(
        `${location.path} holds ${related.map((a) => a.path).join(', ')}, already marked as a lab area: unmark ${related.length === 1 ? 'it' : 'them'} first.`,
        { locationId: 'holds another lab area' },
      );
    }
    return location;
  }

  return {
    async list(): Promise<{ items: LabArea[] }> {
      return { items: (await allAreaTotals(store.repos)).map((t) => t.area) };
    },

    async get(id: number): Promise<LabAreaDetail> {
      return detailOf(store.repos, id);
    },

    async create(input: LabAreaCreateParsed): Promise<LabAreaDetail> {
      return store.transaction(async (repos) => {
        const location = await refuseNested(repos, input.locationId);
        const flammable =
          input.flammableRuleSetId === undefined
            ? await repos.ruleSets.builtIn('flammable-limits')
            : await requireRuleSet(
                repos,
                input.flammableRuleSetId,
                'flammable-limits',
                'flammableRuleSetId',
              );
        if (!flammable) throw new Error('The built-in flammable-limits rule set is missing');
        const sizes =
          input.containerSizeRuleSetId === undefined
            ? await repos.ruleSets.builtIn('container-sizes')
            : input.containerSizeRuleSetId === null
              ? null
              : await requireRuleSet(
                  repos,
                  input.containerSizeRuleSetId,
                  'container-sizes',
                  'containerSizeRuleSetId',
                );
        checkFits(input, flammable);
        const now = nowIso();
        const id = await repos.labAreas.insert({
          locationId: location.id,
          kind: input.kind,
          unitClass: input.unitClass,
          floorArea: input.floorArea,
          floorAreaUnit: input.floorAreaUnit,
          storey: input.storey,
          instructional: input.instructional,
          flammableRuleSetId: flammable.id,
          containerSizeRuleSetId: sizes?.id ?? null,
          notes: input.notes,
          createdAt: now,
          updatedAt: now,
        });
        return detailOf(repos, id);
      });
    },

    async update(id: number, patch: LabAreaPatch): Promise<LabAreaDetail> {
      return store.transaction(async (repos) => {
        const current = await repos.labAreas.findRow(id);
        if (!current) throw notFound(id);
        const next = { ...current, ...patch };
        const flammable = await requireRuleSet(
          repos,
          next.flammableRuleSetId,
          'flammable-limits',
          'flammableRuleSetId',
        );
        if (patch.containerSizeRuleSetId) {
          await requireRuleSet(
            repos,
            patch.containerSizeRuleSetId,
            'container-sizes',
            'containerSizeRuleSetId',
          );
        }
        checkFits(next, flammable);
        await repos.labAreas.update(id, { ...patch, updatedAt: nowIso() });
        return detailOf(repos, id);
      });
    },

    /** Unmarks the place; the place and its containers stay. */
    async remove(id: number): Promise<void> {
      await store.transaction(async (repos) => {
        if (!(await repos.labAreas.findRow(id))) throw notFound(id);
        await repos.labAreas.delete(id);
      });
    },
  };
}
export type LabAreasService = ReturnType<typeof labAreasService>;
