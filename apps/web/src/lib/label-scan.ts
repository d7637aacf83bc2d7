import { normalizeLabelCode } from '@lotwise/shared';
import { paths } from '../config/paths';

/**
 * What a label's QR code holds: the address of the container's page, e.g.
 * `https://lab.example.test/stock/c/LW-00042`. A phone camera opens it; a scanner typing it
 * into the search box is read back by {@link labelCodeFromScan}.
 */
export function labelQrContent(labelCode: string, origin = window.location.origin): string {
  return `${origin}${paths.stockContainerByLabel(labelCode)}`;
}

const labelPath = /\/stock\/c\/([^/?#\s]+)\/?(?:[?#].*)?$/;

/**
 * The label code in what was typed or scanned: a code ("lw-42" -> "LW-00042") or the
 * address a Lotwise label's QR code holds. Null for anything else.
 */
export function labelCodeFromScan(text: string): string | null {
  const direct = normalizeLabelCode(text);
  if (direct) return direct;
  const match = labelPath.exec(text.trim());
  if (!match?.[1]) return null;
  try {
    return normalizeLabelCode(decodeURIComponent(match[1]));
  } catch (_error) {
    return null;
  }
}
