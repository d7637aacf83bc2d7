import { hazardStatementTexts } from '@lotwise/shared';

/** The text of an H-statement, or a pointer to the SDS for codes Lotwise does not hold. */
export function hazardStatementText(code: string): string | undefined {
  return hazardStatementTexts[code];
}

export function HazardStatementList({ codes }: { codes: readonly string[] }) {
  if (codes.length === 0) {
    return <p className="text-sm text-ink-600">No hazard statements recorded — check the SDS.</p>;
  }
  return (
    <ul aria-label="Hazard statements" className="flex flex-col gap-1 text-sm">
      {codes.map((code) => {
        const text = hazardStatementText(code);
        return (
          <li key={code} className="flex gap-3">
            <span className="w-14 shrink-0 font-semibold text-ink-900 tabular-nums">{code}</span>
            <span className={text ? 'text-ink-800' : 'text-ink-600 italic'}>
              {text ?? 'Text not held in Lotwise — see SDS'}
            </span>
          </li>
        );
      })}
    </ul>
  );
}
