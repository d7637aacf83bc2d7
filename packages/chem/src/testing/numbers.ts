// Test helpers: compare with the precision a reference states.

/** x rounded to n significant figures, as a number: sig(0.0144799, 4) = 0.01448. */
export function sig(x: number, n = 4): number {
  return Number(x.toPrecision(n));
}

/** x rounded to d decimals, as a number. */
export function dec(x: number, d: number): number {
  return Number(x.toFixed(d));
}
