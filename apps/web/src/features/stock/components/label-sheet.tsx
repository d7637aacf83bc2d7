import type { ContainerDetail } from '@lotwise/shared';
import { storageGroups } from '@lotwise/shared';
import { Formula } from '../../../components/chem/formula';
import { PictogramSymbol } from '../../../components/hazards/pictogram-symbols';
import { storageGroupIcons } from '../../../components/hazards/storage-group-label';
import { QrCode } from '../../../components/ui/qr-code';
import { hazardStatementText } from '../../../components/hazards/hazard-statement-list';
import { TableScroll } from '../../../components/ui/table-scroll';
import { formatDate } from '../../../lib/format';
import { labelQrContent } from '../../../lib/label-scan';

export type PaperSize = 'a4' | 'letter';

/** Paper, in mm. */
export const papers: Record<
  PaperSize,
  { label: string; width: number; height: number; css: string }
> = {
  a4: { label: 'A4 (210 × 297 mm)', width: 210, height: 297, css: 'A4' },
  letter: { label: 'Letter (8.5 × 11 in)', width: 215.9, height: 279.4, css: 'letter' },
};

/**
 * One label grid for both papers: 3 × 7 labels of 64 × 36 mm with 2 mm between them, which
 * leaves at least 7 mm of margin on A4 and on Letter for printers that cannot print to the
 * edge.
 */
export const labelGrid = { columns: 3, rows: 7, width: 64, height: 36, gap: 2 } as const;
export const labelsPerSheet = labelGrid.columns * labelGrid.rows;

/** Longest H-statement line a label prints with the statements' text (about three lines of 5 pt). */
const labelStatementChars = 110;

/**
 * The H-statements as a label prints them: codes with their text where it fits
 * ("H225 Highly flammable liquid and vapour; H319 …"), else the codes alone ("H225 H319 H336").
 */
export function labelHazardStatements(codes: readonly string[]): string {
  if (codes.length === 0) return '';
  const withText = codes.map((code) => {
    const text = hazardStatementText(code);
    return text ? `${code} ${text}` : code;
  });
  const full = withText.join('; ');
  return full.length <= labelStatementChars ? full : codes.join(' ');
}

/** One container's label: what it is, its hazards, its dates, and its code as text and QR. */
export function ContainerLabel({
  container: c,
  publicUrl,
}: {
  container: ContainerDetail;
  /** The lab's public address (`PUBLIC_URL`): the QR code opens the container there. */
  publicUrl: string;
}) {
  const GroupIcon = storageGroupIcons[c.chemical.storageGroup];
  const statements = labelHazardStatements(c.chemical.hazardStatements);
  return (
    <article
      aria-label={`Label ${c.labelCode}`}
      className="flex h-full gap-[2mm] overflow-hidden rounded-[1.5mm] border border-ink-400 bg-white p-[2mm] text-ink-900 print:border-ink-300"
      data-testid="container-label"
    >
      <div className="flex w-[20mm] shrink-0 flex-col items-center">
        <QrCode
          value={labelQrContent(c.labelCode, publicUrl)}
          title={`QR code for ${c.labelCode}`}
          className="size-[20mm]"
        />
        <p className="mt-[0.5mm] font-mono text-[7.5pt] leading-none font-bold tracking-tight">
          {c.labelCode}
        </p>
        <p className="mt-[1mm] text-center text-[4.8pt] leading-tight text-ink-700">
          Read the SDS before use
        </p>
      </div>
      <div className="flex min-w-0 flex-1 flex-col gap-[0.8mm]">
        <p className="line-clamp-2 text-[8pt] leading-[1.15] font-bold">{c.chemical.name}</p>
        <p className="truncate text-[6.5pt] leading-tight text-ink-800">
          <Formula value={c.chemical.formula} />
          {c.chemical.casNumber && <> · CAS RN {c.chemical.casNumber}</>}
        </p>
        {c.chemical.ghsPictograms.length > 0 ? (
          <ul aria-label="GHS pictograms" className="flex flex-wrap gap-x-[0.6mm] gap-y-[0.3mm]">
            {c.chemical.ghsPictograms.map((code) => (
              <li key={code} className="flex flex-col items-center">
                <PictogramSymbol code={code} size={20} className="size-[6mm]" />
                <span className="text-[4.5pt] leading-none tabular-nums">{code}</span>
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-[5.5pt] leading-tight text-ink-700">No GHS pictograms recorded</p>
        )}
        <p
          aria-label="Hazard statements"
          className="line-clamp-3 text-[5pt] leading-[1.2] text-ink-900"
          data-testid="label-hazard-statements"
        >
          {statements || 'No H-statements recorded: see the SDS'}
        </p>
        <div className="mt-auto flex flex-col gap-[0.3mm] text-[5.8pt] leading-tight tabular-nums">
          <p>
            Received <span className="font-semibold">{formatDate(c.lot.receivedOn)}</span>
          </p>
          <p>
            Expires <span className="font-semibold">{formatDate(c.expiresOn)}</span>
          </p>
          <p className="flex items-center gap-[0.6mm] truncate">
            <GroupIcon aria-hidden="true" className="size-[2.6mm] shrink-0" />
            Store: {storageGroups[c.chemical.storageGroup].label}
          </p>
        </div>
      </div>
    </article>
  );
}

/**
 * The labels laid out on sheets of paper: on screen as page previews, in print one sheet per
 * page. `skip` leaves the first positions of the first sheet empty (a sheet already started).
 */
export function LabelSheets({
  containers,
  paper,
  publicUrl,
  skip = 0,
}: {
  containers: readonly ContainerDetail[];
  paper: PaperSize;
  publicUrl: string;
  skip?: number;
}) {
  const { width, height } = papers[paper];
  const gridWidth = labelGrid.columns * labelGrid.width + (labelGrid.columns - 1) * labelGrid.gap;
  const gridHeight = labelGrid.rows * labelGrid.height + (labelGrid.rows - 1) * labelGrid.gap;
  const cells: (ContainerDetail | null)[] = [...Array<null>(skip).fill(null), ...containers];
  const sheets: (ContainerDetail | null)[][] = [];
  for (let i = 0; i < cells.length; i += labelsPerSheet) {
    sheets.push(cells.slice(i, i + labelsPerSheet));
  }

  return (
    <TableScroll
      label="Label sheets"
      className="flex flex-col items-center gap-6 print:block print:gap-0 print:overflow-visible"
    >
      {sheets.map((sheet, index) => (
        <section
          key={index}
          aria-label={`Sheet ${index + 1} of ${sheets.length}`}
          className="label-sheet shrink-0 bg-white shadow-md ring-1 ring-ink-200 print:shadow-none print:ring-0"
          style={{
            width: `${width}mm`,
            height: `${height}mm`,
            paddingTop: `${(height - gridHeight) / 2}mm`,
            paddingLeft: `${(width - gridWidth) / 2}mm`,
          }}
        >
          <div
            className="grid"
            style={{
              gridTemplateColumns: `repeat(${labelGrid.columns}, ${labelGrid.width}mm)`,
              gridAutoRows: `${labelGrid.height}mm`,
              gap: `${labelGrid.gap}mm`,
            }}
          >
            {sheet.map((container, cell) =>
              container ? (
                <ContainerLabel
                  key={`${container.id}-${cell}`}
                  container={container}
                  publicUrl={publicUrl}
                />
              ) : (
                <div key={`empty-${cell}`} aria-hidden="true" />
              ),
            )}
          </div>
        </section>
      ))}
    </TableScroll>
  );
}
