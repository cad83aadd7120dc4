// Types for the parts of the npm package `odex` (Hairer's ODEX, GBS extrapolation) the tests use.
// The package ships its TypeScript source beside the JavaScript, which does not pass our strict
// type check; this declaration stands in for it.
declare module 'odex' {
  export type Derivative = (x: number, y: number[]) => number[];
  export type OutputFunction = (
    n: number,
    xOld: number,
    x: number,
    y: number[],
    dense?: (c: number, x: number) => number,
  ) => boolean | void;
  export interface Result {
    y: number[];
    outcome: number;
    nStep: number;
    xEnd: number;
    nAccept: number;
    nReject: number;
    nEval: number;
  }
  export class Solver {
    constructor(n: number);
    absoluteTolerance: number | number[];
    relativeTolerance: number | number[];
    initialStepSize: number;
    maxSteps: number;
    denseOutput: boolean;
    grid(dt: number, out: (x: number, y: number[]) => void): OutputFunction;
    solve(f: Derivative, x: number, y0: number[], xEnd: number, solOut?: OutputFunction): Result;
  }
  const odex: { Solver: typeof Solver };
  export default odex;
}
