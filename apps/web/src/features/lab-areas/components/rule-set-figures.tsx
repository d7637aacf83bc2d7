import { LIQUID_CLASSES } from '@lotwise/chem';
import {
  containerMaterialLabels,
  containerMaterials,
  type ContainerSizesData,
  type FlammableLimitsData,
  type RuleSet,
  type WasteAccumulationData,
} from '@lotwise/shared';
import { floorAreaUnitLabels } from '../../../components/room-rules/lab-unit-classes';
import { TableScroll } from '../../../components/ui/table-scroll';
import { formatFixed } from '../../../lib/format';

const th = 'py-1 pr-3 font-medium';
const num = 'py-1 pr-3 text-right tabular-nums';

/** A figure as the set writes it: up to 2 decimals, no trailing zeros. */
function figure(value: number): string {
  const decimals = Number.isInteger(value) ? 0 : Number.isInteger(value * 10) ? 1 : 2;
  return formatFixed(value, decimals);
}

function percent(factor: number): string {
  return `${formatFixed(factor * 100, 0)} %`;
}

function FlammableFigures({ data, citation }: { data: FlammableLimitsData; citation: string }) {
  const per = data.perFloorArea
    ? `per ${figure(data.perFloorArea.value)} ${floorAreaUnitLabels[data.perFloorArea.unit]}`
    : 'per lab area';
  return (
    <div className="flex flex-col gap-3">
      <TableScroll label="Limits by lab-unit class">
        <table className="w-full text-sm">
          <caption className="mb-1 text-left font-semibold">
            Limits by lab-unit class ({data.unit}) — {citation}
          </caption>
          <thead className="text-left text-xs text-ink-600">
            <tr>
              <th scope="col" className={th}>
                Lab-unit class
              </th>
              <th scope="col" className={`${th} text-right`}>
                Class I, {per}
              </th>
              <th scope="col" className={`${th} text-right`}>
                Classes I, II and IIIA, {per}
              </th>
              <th scope="col" className={`${th} text-right`}>
                Class I, most per unit
              </th>
              <th scope="col" className={`${th} text-right`}>
                Classes I–IIIA, most per unit
              </th>
            </tr>
          </thead>
          <tbody>
            {data.byUnitClass.map((row) => (
              <tr key={row.unitClass} className="border-t border-ink-100">
                <th scope="row" className="py-1 pr-3 text-left font-normal">
                  Class {row.unitClass}
                </th>
                <td className={num}>{figure(row.perArea.classI)}</td>
                <td className={num}>{figure(row.perArea.classesIToIIIA)}</td>
                <td className={num}>{row.maxPerUnit ? figure(row.maxPerUnit.classI) : '—'}</td>
                <td className={num}>
                  {row.maxPerUnit ? figure(row.maxPerUnit.classesIToIIIA) : '—'}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </TableScroll>
      <ul className="list-inside list-disc text-sm text-ink-800">
        <li>
          The figures include liquids in approved cabinets and safety cans; outside them{' '}
          {percent(data.outsideStorageFactor)} of each per-area figure.
        </li>
        {data.instructional && (
          <li>
            Instructional labs: Class {data.instructional.allowedUnitClasses.join(' or ')}, limited
            to {percent(data.instructional.factor)} of Class {data.instructional.limitedToUnitClass}
            &apos;s figures.
          </li>
        )}
        {data.storeyReductions.map((r, index) => (
          <li key={index}>
            Class {r.unitClasses.join(' and ')}: {percent(r.factor)} of the figures on storey{' '}
            {r.toStorey === null ? `${r.fromStorey} and above` : `${r.fromStorey} to ${r.toStorey}`}
            .
          </li>
        ))}
        <li>
          Waste ignitable liquids {data.countsIgnitableWaste ? 'count' : 'do not count'} toward the
          totals.
        </li>
        {data.perCabinet !== null && (
          <li>
            At most {figure(data.perCabinet)} {data.unit} in each approved cabinet.
          </li>
        )}
      </ul>
    </div>
  );
}

function ContainerSizeFigures({ data, citation }: { data: ContainerSizesData; citation: string }) {
  const cell = (liquidClass: string, material: string) =>
    data.limits.find((l) => l.liquidClass === liquidClass && l.material === material);
  return (
    <TableScroll label="Largest container by liquid class and material">
      <table className="w-full text-sm">
        <caption className="mb-1 text-left font-semibold">
          Largest container ({data.unit}) by liquid class and material — {citation}
        </caption>
        <thead className="text-left text-xs text-ink-600">
          <tr>
            <th scope="col" className={th}>
              Liquid class
            </th>
            {containerMaterials.map((m) => (
              <th key={m} scope="col" className={`${th} text-right`}>
                {containerMaterialLabels[m]}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {LIQUID_CLASSES.map((liquidClass) => (
            <tr key={liquidClass} className="border-t border-ink-100">
              <th scope="row" className="py-1 pr-3 text-left font-normal">
                {liquidClass}
              </th>
              {containerMaterials.map((m) => {
                const limit = cell(liquidClass, m);
                return (
                  <td key={m} className={num}>
                    {limit ? figure(limit.maxCapacity) : '—'}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-1 text-xs text-ink-600">— : this set gives no limit.</p>
    </TableScroll>
  );
}

function WasteFigures({ data, citation }: { data: WasteAccumulationData; citation: string }) {
  return (
    <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-2">
      <div>
        <dt className="text-xs text-ink-600">Hazardous waste, at most</dt>
        <dd className="tabular-nums">
          {figure(data.maxHazardous.value)} {data.maxHazardous.unit}
        </dd>
      </div>
      <div>
        <dt className="text-xs text-ink-600">Acutely hazardous waste, at most</dt>
        <dd className="tabular-nums">
          {figure(data.maxAcutelyHazardous.value)} {data.maxAcutelyHazardous.unit}
        </dd>
      </div>
      <div>
        <dt className="text-xs text-ink-600">Days to remove the excess once over</dt>
        <dd className="tabular-nums">{data.daysAllowedOnceExceeded}</dd>
      </div>
      <div>
        <dt className="text-xs text-ink-600">Longest accumulation</dt>
        <dd className="tabular-nums">
          {data.maxAccumulationDays === null
            ? 'No limit in this set'
            : `${data.maxAccumulationDays} days`}
        </dd>
      </div>
      <div>
        <dt className="text-xs text-ink-600">Warn at</dt>
        <dd className="tabular-nums">{percent(data.nearFraction)} of a limit</dd>
      </div>
      <div>
        <dt className="text-xs text-ink-600">Source</dt>
        <dd>{citation}</dd>
      </div>
    </dl>
  );
}

/** A rule set's figures as tables, with its citation beside them. */
export function RuleSetFigures({ set }: { set: RuleSet }) {
  if (set.kind === 'flammable-limits')
    return <FlammableFigures data={set.data} citation={set.citation} />;
  if (set.kind === 'container-sizes')
    return <ContainerSizeFigures data={set.data} citation={set.citation} />;
  return <WasteFigures data={set.data} citation={set.citation} />;
}
