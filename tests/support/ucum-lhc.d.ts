// The parts of @lhncbc/ucum-lhc (the NLM's UCUM library) the unit tests use as an outside
// reference; the package ships no types.
declare module '@lhncbc/ucum-lhc' {
  type Conversion = { status: 'succeeded' | 'failed' | 'error'; toVal: number | null; msg: string[] };
  const ucum: {
    UcumLhcUtils: { getInstance(): { convertUnitTo(fromCode: string, value: number, toCode: string): Conversion } };
  };
  export default ucum;
}
