import { useMemo } from 'react';
import { create as createQr } from 'qrcode';

/**
 * A QR code drawn as one SVG path (crisp at any print size). Error correction M survives a
 * scuffed or slightly wet label. `title` is what a screen reader hears.
 */
export function QrCode({
  value,
  title,
  className,
}: {
  value: string;
  title: string;
  className?: string;
}) {
  const { size, path } = useMemo(() => {
    const { modules } = createQr(value, { errorCorrectionLevel: 'M' });
    const parts: string[] = [];
    for (let row = 0; row < modules.size; row++) {
      for (let col = 0; col < modules.size; col++) {
        if (modules.get(row, col)) parts.push(`M${col + 2} ${row + 2}h1v1h-1z`);
      }
    }
    // Two modules of quiet zone on each side; the label's white margin adds the rest.
    return { size: modules.size + 4, path: parts.join('') };
  }, [value]);

  return (
    <svg
      role="img"
      viewBox={`0 0 ${size} ${size}`}
      shapeRendering="crispEdges"
      className={className}
      data-qr-value={value}
    >
      <title>{title}</title>
      <rect width={size} height={size} fill="#fff" />
      <path d={path} fill="#000" />
    </svg>
  );
}
