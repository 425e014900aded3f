declare module 'jstat' {
  interface StudentT {
    inv(p: number, dof: number): number;
    cdf(x: number, dof: number): number;
  }
  interface Normal {
    inv(p: number, mean: number, sd: number): number;
  }
  interface ChiSquare {
    inv(p: number, dof: number): number;
    cdf(x: number, dof: number): number;
  }
  interface JStat {
    studentt: StudentT;
    normal: Normal;
    chisquare: ChiSquare;
    corrcoeff(a: number[], b: number[]): number;
  }
  export const jStat: JStat;
  /** The CommonJS module itself (`module.exports = jStat`, with `jStat.jStat = jStat`). */
  const jstat: JStat & { jStat: JStat };
  export default jstat;
}
