// jstat 1.9.6 ships no type declarations. This declares only the parts the analysis modules use.
// Under ESM (package "type": "module", run by tsx or vitest) the CommonJS module arrives as the
// default import, which is the jStat function object itself; `.jStat` points back to the same object.
declare module 'jstat' {
  interface StudentTDistribution {
    /** Density of Student's t with `dof` degrees of freedom at `x`. */
    pdf(x: number, dof: number): number;
    /** P(T ≤ x) for Student's t with `dof` degrees of freedom. */
    cdf(x: number, dof: number): number;
    /** The quantile: the x with P(T ≤ x) = p. */
    inv(p: number, dof: number): number;
  }

  interface JStatStatic {
    studentt: StudentTDistribution;
    /** Regularized incomplete beta function I_x(a, b). */
    ibeta(x: number, a: number, b: number): number;
    jStat: JStatStatic;
  }

  const jStat: JStatStatic;
  export default jStat;
}
