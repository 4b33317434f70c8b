declare module "jstat" {
  const jStat: {
    studentt: { inv(p: number, df: number): number; cdf(t: number, df: number): number };
  };
  export default jStat;
}
