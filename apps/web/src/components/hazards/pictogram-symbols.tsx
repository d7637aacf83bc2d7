import type { GhsCode } from '@lotwise/shared';
import type { ReactElement } from 'react';
import { cn } from '../../lib/cn';

/*
 * Lotwise's own simplified drawings of the nine GHS symbols, on a 100 x 100 canvas inside
 * the standard red-bordered diamond. They are reminders, not reproductions of any label.
 */
const ink = '#1c1916';

const symbols: Record<GhsCode, ReactElement> = {
  GHS01: (
    <g fill={ink} stroke={ink}>
      <circle cx="50" cy="62" r="11" stroke="none" />
      <g strokeWidth="3.5" strokeLinecap="round" fill="none">
        <path d="M50 46 V30 M40 48 L32 35 M60 48 L68 35 M36 56 L25 51 M64 56 L75 51" />
      </g>
      <rect x="27" y="30" width="5" height="5" transform="rotate(20 29 32)" stroke="none" />
      <rect x="68" y="29" width="5" height="5" transform="rotate(-15 70 31)" stroke="none" />
      <rect x="47.5" y="22" width="5" height="5" stroke="none" />
    </g>
  ),
  GHS02: (
    <g fill={ink}>
      <path d="M50 24 C57 35 67 42 65 56 C64 65 58 70 50 70 C42 70 35 65 35 56 C35 48 41 44 43 36 C47 41 46 48 50 51 C53 44 48 35 50 24 Z" />
      <rect x="30" y="73" width="40" height="4.5" />
    </g>
  ),
  GHS03: (
    <g fill={ink}>
      <path d="M50 24 C55 32 62 37 61 47 C60.5 52 57 55 53 56 C55 50 52 46 50 43 C48 46 45 50 47 56 C43 55 39.5 52 39 47 C38.5 40 44 37 45 31 C47.5 34 47.5 38 49.5 40 C51 35 48.5 30 50 24 Z" />
      <circle cx="50" cy="63" r="8.5" fill="none" stroke={ink} strokeWidth="5" />
      <rect x="30" y="74" width="40" height="4.5" />
    </g>
  ),
  GHS04: (
    <g fill={ink}>
      <g transform="rotate(-58 50 55)">
        <rect x="41" y="30" width="18" height="44" rx="9" />
        <rect x="45.5" y="23" width="9" height="8" rx="1.5" />
      </g>
      <rect x="28" y="71" width="44" height="4" />
    </g>
  ),
  GHS05: (
    <g fill={ink}>
      <rect x="28" y="22" width="8" height="20" rx="3" transform="rotate(35 32 32)" />
      <rect x="61" y="22" width="8" height="20" rx="3" transform="rotate(35 65 32)" />
      <circle cx="38.5" cy="47" r="2.2" />
      <circle cx="38.5" cy="54" r="2.2" />
      <circle cx="71.5" cy="47" r="2.2" />
      <circle cx="71.5" cy="54" r="2.2" />
      <path d="M26 60 H45 V66 C42 64 39 67 36 65 C33 63 30 66 26 65 Z" />
      <path d="M60 60 H79 V66 H74 L71 63 L68 66 H60 Z" />
      <rect x="24" y="70" width="55" height="4.5" />
    </g>
  ),
  GHS06: (
    <g fill={ink}>
      <circle cx="50" cy="38" r="13" />
      <rect x="43" y="44" width="14" height="11" rx="2.5" />
      <circle cx="44.5" cy="37" r="3.6" fill="#fff" />
      <circle cx="55.5" cy="37" r="3.6" fill="#fff" />
      <path d="M47 51 V55 M50 51 V55 M53 51 V55" stroke="#fff" strokeWidth="1.4" />
      <path d="M31 59 L69 75 M69 59 L31 75" stroke={ink} strokeWidth="5" strokeLinecap="round" />
      <circle cx="29.5" cy="58" r="3" />
      <circle cx="70.5" cy="58" r="3" />
      <circle cx="29.5" cy="76" r="3" />
      <circle cx="70.5" cy="76" r="3" />
    </g>
  ),
  GHS07: (
    <g fill={ink}>
      <path d="M44 25 H56 L53.5 60 H46.5 Z" />
      <circle cx="50" cy="69" r="5.5" />
    </g>
  ),
  GHS08: (
    <g fill={ink}>
      <circle cx="50" cy="29" r="7.5" />
      <path d="M32 75 C32 53 39 41 50 41 C61 41 68 53 68 75 Z" />
      <path
        fill="#fff"
        d="M50 49 L52.6 55.2 L59 54 L54.6 58.8 L58 64.5 L51.8 62.4 L50 69 L48.2 62.4 L42 64.5 L45.4 58.8 L41 54 L47.4 55.2 Z"
      />
    </g>
  ),
  GHS09: (
    <g fill={ink}>
      <path
        d="M37 71 V40 M37 52 L29 44 M37 47 L45 37 M37 59 L45 53"
        stroke={ink}
        strokeWidth="3.5"
        strokeLinecap="round"
        fill="none"
      />
      <path d="M24 72 H77" stroke={ink} strokeWidth="3" />
      <ellipse cx="60" cy="63" rx="10" ry="5" />
      <path d="M68 63 L76 58 V68 Z" />
      <path d="M53.5 61.5 L56 64 M56 61.5 L53.5 64" stroke="#fff" strokeWidth="1.2" />
    </g>
  ),
};

/** A GHS pictogram as an SVG; decorative — the badge around it carries the words. */
export function PictogramSymbol({
  code,
  size = 32,
  className,
}: {
  code: GhsCode;
  size?: number;
  className?: string;
}) {
  return (
    <svg
      viewBox="0 0 100 100"
      width={size}
      height={size}
      aria-hidden="true"
      focusable="false"
      // Never squeezed by words wrapping beside it, on screen or on paper.
      className={cn('shrink-0', className)}
      data-pictogram={code}
    >
      <polygon
        points="50,5 95,50 50,95 5,50"
        fill="#fff"
        stroke="var(--color-ghs-red, #d4161c)"
        strokeWidth="7"
        strokeLinejoin="miter"
      />
      {symbols[code]}
    </svg>
  );
}
