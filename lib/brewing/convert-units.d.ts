// The convert-units 2.x package ships no types; this covers the part Kettlefork calls.
declare module 'convert-units' {
  interface UnitConverter {
    from(unit: string): UnitConverter;
    to(unit: string): number;
    possibilities(measure?: string): string[];
  }
  export default function convert(value?: number): UnitConverter;
}
