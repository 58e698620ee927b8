// jstat 1.9.6 ships no type declarations; only the calls the cross-check tests use.
declare module "jstat" {
  export const jStat: {
    normal: { inv(p: number, mean: number, sd: number): number; cdf(x: number, mean: number, sd: number): number };
    chisquare: { inv(p: number, dof: number): number; cdf(x: number, dof: number): number };
    studentt: { inv(p: number, dof: number): number; cdf(x: number, dof: number): number };
    gammaln(x: number): number;
    lowRegGamma(a: number, x: number): number;
  };
}
