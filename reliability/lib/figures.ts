import { appendFileSync } from 'node:fs';
import { inject } from 'vitest';

declare module 'vitest' {
  export interface ProvidedContext {
    /** The file each test appends its figure to (one JSON object a line); see global-setup.ts. */
    reliabilityFiguresFile: string;
  }
}

/** One measured result of a test, printed at once and again with all the others at the end. */
export interface Figure {
  /** The test, short: e.g. `parallel-draws`. */
  test: string;
  /** The sentence printed: what was done and what was found, with the numbers. */
  line: string;
  /** The same numbers, named, for results.json. */
  values: Record<string, number | string | boolean>;
}

/** Prints a test's figure line (`[reliability] …`) and keeps it for the summary and results.json. */
export function reportFigure(test: string, line: string, values: Figure['values'] = {}): void {
  console.log(`[reliability] ${line}`);
  const figure: Figure = { test, line, values };
  appendFileSync(inject('reliabilityFiguresFile'), `${JSON.stringify(figure)}\n`);
}
