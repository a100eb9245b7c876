// Every threshold the run-log checks use, in one place. Values marked "common practice, no source" are
// trade habits we chose as defaults; a shop's own specification may set other values.

/** Largest run-log file accepted (bytes): 50 MB. */
export const MAX_RUN_LOG_BYTES = 50 * 1024 * 1024;
/** Most data rows accepted in one run log. */
export const MAX_RUN_LOG_ROWS = 1_000_000;
/** Most columns accepted (time + channels). */
export const MAX_RUN_LOG_COLUMNS = 64;
/** Rows read to propose a column mapping. */
export const INSPECT_ROWS = 200;

// --- Physically possible readings (outside: implausible) ---------------------------------------------------
/** Cure-vessel temperatures outside −60…450 °C are not possible readings (same window as the study schema). */
export const TEMPERATURE_POSSIBLE_C = { min: -60, max: 450 } as const;
/** Vessel gauge pressure window, bar: a vessel cannot hold below −1 bar gauge; 30 bar is far above autoclave use. */
export const PRESSURE_POSSIBLE_BAR = { min: -1.05, max: 30 } as const;
/** Vacuum depth below atmosphere, kPa: cannot be deeper than one atmosphere (101.325 kPa). */
export const VACUUM_POSSIBLE_KPA = { min: -5, max: 105 } as const;
/** Standard atmosphere, kPa: absolute vacuum readings are converted to depth against it. */
export const STANDARD_ATMOSPHERE_KPA = 101.325;

// --- Hygiene (common practice, no source) ------------------------------------------------------------------
/** A channel with at least this share of missing or impossible readings is dead. */
export const DEAD_FRACTION = 0.5;
/** A temperature channel spanning less than this (K) while the air spans FLAT_AIR_SPAN_K is flat. */
export const FLAT_SPAN_K = 2;
export const FLAT_AIR_SPAN_K = 20;
/** Estimated white-noise standard deviation above which a channel is noisy. */
export const NOISE_LIMIT = { temperatureK: 1.0, pressurePa: 10_000, vacuumPa: 2_000 } as const;
/** A part TC above the air by more than this (K) while the air is heating is implausible (swapped or misplaced TC). */
export const PART_LEADS_AIR_K = 10;
/** Air heating faster than this (K/min) counts as "heating" for the lead rule. */
export const AIR_HEATING_K_PER_MIN = 0.2;
/** A time step longer than max(GAP_FACTOR × median step, GAP_MIN_S) is a gap in the record. */
export const GAP_FACTOR = 5;
export const GAP_MIN_S = 60;

/** A log shorter than this (min) or with fewer rows cannot show a cure cycle; it is warned about, not refused. */
export const SHORT_LOG_MIN = 30;
export const SHORT_LOG_ROWS = 20;

// --- Spec check (common practice, no source) ---------------------------------------------------------------
/** Rates are taken over this window (min) so single-sample jitter does not read as a rate. */
export const RATE_WINDOW_MIN = 5;
/** A hold may run this much shorter or longer than specified: max(min, fraction × hold). */
export const HOLD_TOLERANCE = { min: 5, fraction: 0.05 } as const;
/** Vessel pressure must stay within ± this of the specified pressure once reached (bar). */
export const PRESSURE_TOLERANCE_BAR = 0.5;
/** Bag vacuum must stay at least this deep (kPa below atmosphere) until the part is cooled. */
export const MIN_VACUUM_DEPTH_KPA = 75;

// --- Replay ------------------------------------------------------------------------------------------------
/** Record cycles are resampled to at most this many points (the study schema allows 20 000). */
export const REPLAY_MAX_POINTS = 4_000;
