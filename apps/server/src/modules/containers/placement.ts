import type { ConfirmationWarning } from '@lotwise/shared';
import type { Repositories } from '../../db/store';
import { watchLabAreas } from '../lab-areas/lab-area-confirmations';
import type { LocationRow } from '../locations/location.entity';
import {
  refuseUnconfirmed,
  segregationService,
  type PlacedChemical,
} from '../segregation/segregation.service';

/**
 * What putting containers of `chemical` at `location` asks a person to confirm: storage
 * conflicts (read before the write) and lab-area limits and container sizes (the areas'
 * totals after the write, read inside the same transaction). Call `settle(ids)` once the
 * containers are written: it refuses (409, the transaction rolls back) until confirmed.
 */
export async function checkPlacement(
  repos: Repositories,
  container: { id: number | null },
  chemical: PlacedChemical,
  location: LocationRow,
  options: { confirmed: boolean; storage?: boolean },
) {
  if (options.confirmed) return { async settle(_ids: number[]) {} };
  const storage: ConfirmationWarning[] =
    options.storage === false
      ? []
      : await segregationService(repos).confirmationsFor(container, chemical, location);
  const areas = await watchLabAreas(repos, [location]);
  return {
    async settle(ids: number[]) {
      refuseUnconfirmed(
        [...storage, ...(await areas.warnings(ids))],
        'Nothing was saved: confirm to store it there anyway.',
      );
    },
  };
}
