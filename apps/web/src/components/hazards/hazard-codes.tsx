import { hazardStatementTexts, type GhsCode } from '@lotwise/shared';
import { TapHint } from '../ui/tap-hint';
import { PictogramList } from './pictogram-badge';

/** Pictograms and H-statement codes in little room (tables, headers); texts on a tap or hover. */
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
              <TapHint
                hint={`${code} ${hazardStatementTexts[code] ?? 'text not held in Lotwise — see SDS'}`}
                srText={hazardStatementTexts[code] ?? 'see SDS'}
                className="underline decoration-dotted underline-offset-2"
              >
                {code}
              </TapHint>
            </span>
          ))}
        </p>
      )}
    </div>
  );
}
