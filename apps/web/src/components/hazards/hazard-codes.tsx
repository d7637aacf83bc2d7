import { hazardStatementTexts, type GhsCode } from '@lotwise/shared';
import { PictogramList } from './pictogram-badge';

/** Pictograms and H-statement codes in little room (tables, headers); texts on hover. */
export function HazardCodes({
  pictograms,
  statements,
}: {
  pictograms: readonly GhsCode[];
  statements: readonly string[];
}) {
  return (
    <div className="flex max-w-72 min-w-40 flex-col gap-1">
      <PictogramList codes={pictograms} />
      {statements.length > 0 && (
        <p className="text-xs text-ink-600 tabular-nums">
          {statements.map((code, index) => (
            <span key={code}>
              {index > 0 && ' '}
              <abbr title={hazardStatementTexts[code] ?? 'See SDS'} className="no-underline">
                {code}
              </abbr>
            </span>
          ))}
        </p>
      )}
    </div>
  );
}
