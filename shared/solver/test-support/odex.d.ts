// Minimal typings for the parts of odex (Hairer & Wanner's ODEX, Gragg–Bulirsch–Stoer extrapolation) that the
// kinetics tests use as an independent reference integrator. The package ships raw TypeScript source beside its
// JavaScript, which tsc would otherwise check as our own code; tsconfig.base.json maps the import here instead.
export declare enum Outcome {
  Converged = 0,
  MaxStepsExceeded = 1,
  EarlyReturn = 2,
}
export declare class Solver {
  constructor(n: number);
  absoluteTolerance: number | number[];
  relativeTolerance: number | number[];
  maxSteps: number;
  maxStepSize: number;
  initialStepSize: number;
  denseOutput: boolean;
  solve(
    f: (x: number, y: number[]) => number[],
    x: number,
    y0: number[],
    xEnd: number,
    solOut?: (nr: number, xOld: number, x: number, y: number[], dense?: (c: number, x: number) => number) => boolean | void,
  ): { y: number[]; outcome: Outcome; nStep: number; xEnd: number; nAccept: number; nReject: number; nEval: number };
}
