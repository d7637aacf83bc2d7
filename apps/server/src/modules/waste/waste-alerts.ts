import { formatQuantity, roomRulesReminder, todayIso } from '@lotwise/shared';
import type { Repositories } from '../../db/store';
import type { NotifyInput } from '../alerts/alerts.service';
import { wasteAreas } from './waste-areas';
import { presentWasteContainers } from './waste-contents';

/** A waste container this full is near its capacity (common practice, no source). */
const containerNearFraction = 0.9;

const litres = (value: number) => formatQuantity(value, 'L', { decimals: 2 });

/**
 * The waste alerts of the moment, for managers: an accumulation area near or over a limit of
 * its rule set, a container near its capacity, a container near or past the longest its set
 * lets waste accumulate. Each key names the condition and its state, so the outbox sends it
 * once (a worse state is a new condition).
 */
export async function wasteAlertMessages(
  repos: Repositories,
  now = new Date(),
): Promise<NotifyInput[]> {
  const today = todayIso(now);
  const messages: NotifyInput[] = [];
  for (const area of await wasteAreas(repos, today)) {
    if (area.state !== 'ok') {
      const over = area.state === 'over';
      messages.push({
        kind: 'waste-near-limit',
        audience: 'managers',
        subject: `Waste ${over ? 'over' : 'near'} its limit at ${area.locationPath}`,
        text: [
          `${area.locationPath} holds ${litres(area.hazardous.litres)} of hazardous waste (limit ${litres(area.hazardous.limitLitres)}) and ${litres(area.acutelyHazardous.litres)} of acutely hazardous waste (limit ${litres(area.acutelyHazardous.limitLitres)}), per ${area.citation}.`,
          over
            ? `Once a limit is exceeded, the excess is to be removed within ${area.daysAllowedOnceExceeded} days (${area.citation}): arrange a pickup.`
            : 'Arrange a pickup before the limit is reached.',
          roomRulesReminder,
        ].join('\n\n'),
        dedupKey: `waste-near-limit:area:${area.locationId}:${area.state}`,
        link: '/stock/waste',
      });
    }
    for (const container of area.containers) {
      const max = area.maxAccumulationDays;
      if (max === null || container.ageDays === null) continue;
      const state =
        container.ageDays >= max ? 'over' : container.ageDays >= max * 0.9 ? 'near' : null;
      if (!state) continue;
      messages.push({
        kind: 'waste-time',
        audience: 'managers',
        subject: `${container.labelCode} "${container.title}" ${state === 'over' ? 'is past' : 'nears'} its accumulation time`,
        text: [
          `${container.labelCode} at ${container.locationPath} has accumulated waste for ${container.ageDays} days since ${container.accumulationStartOn}; ${area.citation} allows ${max} days.`,
          roomRulesReminder,
        ].join('\n\n'),
        dedupKey: `waste-time:container:${container.id}:${state}`,
        link: `/stock/waste/${container.id}`,
      });
    }
  }
  // Any open container (in an area or not) near its own capacity.
  const open = await presentWasteContainers(
    repos,
    await repos.waste.listContainers({ status: 'open' }),
    today,
  );
  for (const container of open) {
    if (container.fillFraction === null || container.fillFraction < containerNearFraction) continue;
    const full = container.fillFraction >= 1;
    messages.push({
      kind: 'waste-near-limit',
      audience: 'managers',
      subject: `${container.labelCode} "${container.title}" is ${full ? 'full' : 'nearly full'}`,
      text: [
        `${container.labelCode} at ${container.locationPath} holds about ${formatQuantity(container.filled!, container.capacityUnit)} of ${formatQuantity(container.capacity, container.capacityUnit)}. Mark it full and start another.`,
        roomRulesReminder,
      ].join('\n\n'),
      dedupKey: `waste-near-limit:container:${container.id}:${full ? 'full' : 'near'}`,
      link: `/stock/waste/${container.id}`,
    });
  }
  return messages;
}
