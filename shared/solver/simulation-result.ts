import type { LimitCheck, StudySummary } from './metrics';

export type { LimitCheck, StudySummary };

/** Time histories, one entry per accepted step plus t = 0, SI units. */
export interface SimulationHistory {
  timeS: Float64Array;
  airK: Float64Array;
  pressurePa: Float64Array;
  /** tool back face (the face away from the part); the tool-side air when there is no tool */
  toolK: Float64Array;
  bagSurfaceK: Float64Array;
  midPlaneK: Float64Array;
  toolSideSurfaceK: Float64Array;
  alphaMin: Float64Array;
  alphaMax: Float64Array;
  tgMidK: Float64Array;
  resinModulusMidPa: Float64Array;
  setpointK: Float64Array;
}

export interface SimulationResult {
  modelVersion: string;
  steps: number;
  history: SimulationHistory;
  /** laminate nodes only; temperatureK and alpha are steps×nodes row-major (empty unless recordProfiles) */
  profiles: { zM: Float64Array; temperatureK: Float64Array; alpha: Float64Array };
  /** per laminate node; −1 where never reached */
  nodes: { zM: Float64Array; gelTimeS: Float64Array; vitrificationTimeS: Float64Array };
  /** 2 points per ply: bottom then top, bottom ply first; after demould, at the shop temperature (summary.shapeAtC) */
  plyStresses: { zM: Float64Array; plyIndex: Int32Array; sigma1Pa: Float64Array; sigma2Pa: Float64Array; tau12Pa: Float64Array };
  /** 1/m, after demould, at the shop temperature (summary.shapeAtC), like plyStresses */
  curvature: { kx: number; ky: number; kxy: number };
  /** segment start times, then the demould time, s */
  segmentBoundsS: Float64Array;
  summary: StudySummary;
}

export interface SimulateOptions {
  recordProfiles?: boolean;
  /** step-size control; defaults follow the time-step rule in shared/solver/README.md (additive to the contract, used by convergence tests) */
  stepLimits?: Partial<StepLimits>;
  /** tolerance on α per node and step of the cure integrator (default kinetics.DEFAULT_CURE_TOLERANCE, 1e-7) */
  cureTolerance?: number;
  /**
   * laminate nodes per ply for this solve instead of the study's own mesh (a whole number 1 to 6; 1 puts
   * nodes on the ply faces only, which the quick look uses; a stored study keeps at least 2)
   */
  nodesPerPly?: number;
}

export interface StepLimits {
  /** largest change of air temperature per step, K */
  maxAirChangeK: number;
  /** largest change of α at any node per step */
  maxCureChange: number;
  /** largest change of any part temperature per step, K (guards the exotherm) */
  maxPartChangeK: number;
  /** step cap, s */
  maxStepS: number;
}

export const DEFAULT_STEP_LIMITS: StepLimits = { maxAirChangeK: 5, maxCureChange: 0.0075, maxPartChangeK: 5, maxStepS: 600 };

/**
 * What a preview is, the quick look while the user drags (sized in shared/solver/README.md, "Time step"):
 * limits twice the defaults, about half the steps (the loop is second order in the step, so results move by
 * roughly 4× the already small step error of the defaults), a cure tolerance of 1e-6 per step instead of
 * 1e-7 (the longer steps would otherwise send many node steps to sub-steps; the results move by under
 * 1e-6 K and 1e-6 mm on the reference study), and nodes on the ply faces only (half the nodes of the
 * coarsest stored mesh; on the demo studies that moves peak temperature, gradient and final cure by under
 * 1e-3 K or 1e-6 and warpage by under 0.05 %, far less than the longer steps do). Re-solve with the
 * defaults when the drag ends.
 */
export const PREVIEW_OPTIONS: SimulateOptions = {
  stepLimits: {
    maxAirChangeK: 2 * DEFAULT_STEP_LIMITS.maxAirChangeK,
    maxCureChange: 2 * DEFAULT_STEP_LIMITS.maxCureChange,
    maxPartChangeK: 2 * DEFAULT_STEP_LIMITS.maxPartChangeK,
    maxStepS: 2 * DEFAULT_STEP_LIMITS.maxStepS,
  },
  cureTolerance: 1e-6,
  nodesPerPly: 1,
};
