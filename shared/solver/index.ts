// Public API of the cure solver. Consumers (the worker, the server seed, exports) import from here.

export { simulate, MODEL_VERSION, DEFAULT_STEP_LIMITS, PREVIEW_OPTIONS } from './simulate';
export type { SimulationResult, SimulationHistory, SimulateOptions, StepLimits, StudySummary, LimitCheck } from './simulate';

export { plannedSchedule, prepareCycle, airAt, createCycleState, scheduledDurationS } from './cycle';
export type { CycleProgram, CycleState, AirConditions } from './cycle';

export {
  aluminiumPlate,
  demoCarbonFibre,
  demoResin180,
  demoStudies,
  invarPlate,
  leeLoosSpringerResin,
  quasiIsotropic,
  referenceStudy,
} from './demo-cards';

export { cureRate, prepareKinetics, advanceCure } from './kinetics';
export type { PreparedKinetics } from './kinetics';
export { glassTransitionK, prepareGlassTransition, cureState } from './glass-transition';
export type { CureState, GlassTransitionK } from './glass-transition';
export { adiabaticTemperatureRiseK } from './thermochemical';
export { stripWarpageM, radfordDiefendorfSpringInDeg } from './distortion';

export { StudyInputError, validateStudy, parseStudy, studyParamsSchema } from '../schemas/study';
export type { StudyParams, StudyParamsInput, ResinCard, FibreCard, StudyIssue } from '../schemas/study';
