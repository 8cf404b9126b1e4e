// jstat 1.9.6 ships no types; the tests use only these reference functions.
declare module "jstat" {
  interface JStat {
    normal: { inv(p: number, mean: number, sd: number): number; cdf(x: number, mean: number, sd: number): number };
    binomial: { pdf(k: number, n: number, p: number): number; cdf(k: number, n: number, p: number): number };
    chisquare: { cdf(x: number, df: number): number; inv(p: number, df: number): number };
    gammaln(x: number): number;
    lowRegGamma(a: number, x: number): number;
  }
  const jStat: JStat;
  export default jStat;
}
