// Type boundary for the untyped convert-units 2.3.4 package (CommonJS, no bundled types).
declare module 'convert-units' {
  interface Converter {
    from(unit: string): { to(unit: string): number };
  }
  function convert(value: number): Converter;
  export default convert;
}
