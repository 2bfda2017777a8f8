// Minimal types for the two cross-check libraries that ship none; only what the reference tests call.
declare module 'numeric' {
  interface DopriSolution {
    at(t: number): number[];
  }
  interface EigenResult {
    lambda: { x: number[]; y?: number[] };
  }
  interface Numeric {
    dopri(
      t0: number,
      t1: number,
      y0: number[],
      f: (t: number, y: number[]) => number[],
      tolerance?: number,
      maxIterations?: number,
    ): DopriSolution;
    eig(A: number[][]): EigenResult;
  }
  const numeric: Numeric;
  export default numeric;
}

declare module 'jstat' {
  interface JStat {
    normal: { inv(p: number, mean: number, sd: number): number; cdf(x: number, mean: number, sd: number): number };
    chisquare: { inv(p: number, dof: number): number; cdf(x: number, dof: number): number };
  }
  const jStat: JStat;
  export default jStat;
}
