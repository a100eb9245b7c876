// Run logs: reading an autoclave/oven record, checking its data and its run against the study, and turning
// it into a replay of the study. Pure functions over strings and typed arrays (no DOM, no Node).
export * from './limits';
export * from './units';
export * from './column-mapping';
export * from './run-log-error';
export * from './types';
export { inspectRunLog, parseRunLog, readNumberCell, type RunLogInspection, type ParseOptions } from './parse-run-log';
export { checkHygiene, usableValues, displayValue, EXCLUDING_RULES, type HygieneReport, type FlaggedChannel } from './hygiene';
export { checkSpec, holdsOf, type SpecReport, type HoldReport, type WindowReport, type SpecCheckOptions } from './spec-check';
export { replayInput, ReplayInputError, type ReplayOptions } from './replay';
export { demoRunLogCsv, DEMO_RUN_LOG_FILE_NAME, DEMO_RUN_LOG_EXCURSION } from './demo-run-log';
export * from './record';
export { analyseRunLog, type AnalyseInput } from './analyse';
export { uploadWarnings, logWarningFindings } from './upload-warnings';
