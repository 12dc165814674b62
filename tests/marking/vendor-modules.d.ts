// Type declarations for the reference statistics packages used only to cross-check the engine
// in tests and in scripts/bench-marking.ts; neither package ships its own types.
declare module "ml-regression" {
  export { SimpleLinearRegression } from "ml-regression-simple-linear";
  export { PolynomialRegression } from "ml-regression-polynomial";
}

declare module "jstat" {
  interface OrdinaryLeastSquares {
    coef: number[];
    R2: number;
    t: { se: number[] };
  }
  const jStat: {
    models: { ols(endog: number[], exog: number[][]): OrdinaryLeastSquares };
  };
  export default jStat;
}
