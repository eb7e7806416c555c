// Minimal typings for js-quantities 1.8 (the package ships none); used only as an independent oracle in tests.
declare module 'js-quantities' {
  interface Quantity {
    scalar: number;
    to(units: string): Quantity;
    units(): string;
    kind(): string;
  }
  export default function Qty(definition: string): Quantity;
}
