// The small part of jStat's distribution API the mixture statistics use; the package ships no type declarations.
declare module 'jstat' {
  interface JStatDistributions {
    centralF: {
      cdf(x: number, df1: number, df2: number): number;
      inv(p: number, df1: number, df2: number): number;
    };
    studentt: {
      cdf(x: number, dof: number): number;
      inv(p: number, dof: number): number;
    };
  }
  const jStat: JStatDistributions;
  export default jStat;
}
