import { peroxideTestDue, type PeroxideFormerClass } from '@lotwise/chem';

/** Peroxide test-or-discard date of a container, or null when the chemical is no peroxide former. */
export function peroxideDueOf(
  peroxideClass: string | null,
  openedOn: string | null,
  receivedOn: string,
  expiresOn: string | null,
) {
  if (!peroxideClass) return null;
  return peroxideTestDue({
    peroxideClass: peroxideClass as PeroxideFormerClass,
    openedOn,
    receivedOn,
    expiresOn,
  });
}
