// jstat ships no types: the parts the gauge-study core uses (its t and F distributions; no eval,
// so the pages' Content-Security-Policy holds) and the tests' cross-checks use.
declare module "jstat" {
  interface JStat {
    tscore(value: number, data: readonly number[]): number;
    ttest(value: number, data: readonly number[], sides: 1 | 2): number;
    centralF: { cdf(x: number, df1: number, df2: number): number };
    studentt: { cdf(x: number, df: number): number };
  }
  const jStat: JStat;
  export default jStat;
}
