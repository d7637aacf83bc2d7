// Minimal types for js-quantities 1.8.0 (it ships none), covering what the tests call.
declare module 'js-quantities' {
  interface Qty {
    readonly scalar: number;
    to(unit: string): Qty;
    mul(other: Qty | number): Qty;
    div(other: Qty | number): Qty;
    toBase(): Qty;
    units(): string;
    toString(): string;
  }
  function Qty(value: string | number, unit?: string): Qty;
  export default Qty;
}
