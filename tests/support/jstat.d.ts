// jstat ships no types; the tests use only the normal distribution and density functions.
declare module "jstat" {
  const jStat: { normal: { cdf(x: number, mean: number, sd: number): number; pdf(x: number, mean: number, sd: number): number } };
  export default jStat;
}
