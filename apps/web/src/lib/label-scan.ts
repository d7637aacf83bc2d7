import { labelCodeToLookUp, normalizeLabelCode } from '@lotwise/shared';
import { paths } from '../config/paths';

/**
 * What a label's QR code holds: the address of the container's page at the lab's public address
 * (the server's `PUBLIC_URL`), e.g. `https://lab.example.test/stock/c/LW-00042`. A phone's own
 * camera app opens it; the scan button and a scanner typing into the search box read it back
 * with {@link readScannedLabel}.
 */
export function labelQrContent(labelCode: string, publicUrl: string): string {
  return `${publicUrl.replace(/\/+$/, '')}${paths.stockContainerByLabel(labelCode)}`;
}

const labelPath = /^\/stock\/c\/([^/?#\s]+)\/?$/;

/** What was read from a label, scanned or typed. */
export type ScannedLabel =
  /** A label of this lab, or a bare code: look the container up by `code`. */
  | { kind: 'label'; code: string }
  /** A Lotwise label printed by another lab (its address is not this lab's). */
  | { kind: 'other-lab'; code: string; origin: string }
  /** Neither a label code nor a Lotwise label's address. */
  | { kind: 'unknown'; text: string };

function parseUrl(text: string): URL | null {
  if (!/^https?:\/\//i.test(text)) return null;
  try {
    return new URL(text);
  } catch (_error) {
    return null;
  }
}

function codeInPath(pathname: string): string | null {
  const match = labelPath.exec(pathname);
  if (!match?.[1]) return null;
  try {
    return labelCodeToLookUp(decodeURIComponent(match[1]));
  } catch (_error) {
    return null;
  }
}

/**
 * Reads scanned or typed text: an `LW-` code ("lw-42" -> "LW-00042"), another label code kept
 * from an import ("FW/B-117"), or the address a Lotwise label's QR code holds. An address counts
 * as this lab's when its origin is one of `labOrigins` (the public address and the one the page
 * is open at); any other Lotwise address is another lab's label.
 */
export function readScannedLabel(text: string, labOrigins: readonly string[]): ScannedLabel {
  const trimmed = text.trim();
  const url = parseUrl(trimmed);
  if (!url) {
    const code = labelCodeToLookUp(trimmed);
    return code ? { kind: 'label', code } : { kind: 'unknown', text: trimmed };
  }
  const code = codeInPath(url.pathname);
  if (!code) return { kind: 'unknown', text: trimmed };
  const ours = labOrigins.some((origin) => {
    const lab = parseUrl(origin);
    return lab !== null && lab.origin === url.origin;
  });
  return ours ? { kind: 'label', code } : { kind: 'other-lab', code, origin: url.origin };
}

/**
 * The label code in what was typed into the search box or scanned by a scanner that types: an
 * `LW-` code or the address a Lotwise label's QR code holds. Null for anything else (other text
 * is searched for).
 */
export function labelCodeFromScan(text: string): string | null {
  const direct = normalizeLabelCode(text);
  if (direct) return direct;
  const url = parseUrl(text.trim());
  return url ? codeInPath(url.pathname) : null;
}
