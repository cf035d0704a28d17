// jstat ships no types; the little the statistics tests use as an independent reference.
declare module 'jstat' {
  interface Continuous {
    cdf(x: number, ...params: number[]): number;
    pdf(x: number, ...params: number[]): number;
    inv(p: number, ...params: number[]): number;
  }
  const jstat: { jStat: { normal: Continuous; chisquare: Continuous; beta: Continuous } };
  export default jstat;
}
