// The few jstat functions bandshelf calls (the package ships no types).
declare module 'jstat' {
  interface Distribution {
    cdf(x: number, ...parameters: number[]): number;
    inv(p: number, ...parameters: number[]): number;
    pdf(x: number, ...parameters: number[]): number;
  }
  const jStatModule: {
    jStat: {
      studentt: Distribution;
      centralF: Distribution;
      normal: Distribution;
      chisquare: Distribution;
    };
  };
  export = jStatModule;
}
