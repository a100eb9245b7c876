import Papa from 'papaparse';
import type { StudyParams } from '../schemas/study';

// The demo run log of the invented shop: a cure of the 24-ply reference panel in autoclave 2, written the way
// a shop logger writes it (date-time stamps, °C thermocouples, vessel pressure in psi, bag vacuum in inHg, a
// text column with the controller step). Part and tool thermocouples follow the air through first-order
// lags (each TC its own time constant: common practice for a quick thermal sketch, no source), with a little
// seeded noise. One deliberate excursion: the second (180 °C) hold ran long, 170 min instead of 120, because
// the controller waited on an operator's release. Everything here is invented.

export const DEMO_RUN_LOG_FILE_NAME = 'autoclave-2-job-4471-TB-2407.csv';
/** What the demo's deliberate excursion is, for the seed's description and the tutorial text. */
export const DEMO_RUN_LOG_EXCURSION = { hold: 2, specifiedMin: 120, ranMin: 170 } as const;

export interface DemoRunLogOptions {
  /** sample interval, s (default 30) */
  stepS?: number;
  /** how long the second hold actually ran, min (default 170; 120 gives a clean run) */
  secondHoldMin?: number;
  /** first time stamp (naive local time) */
  start?: string;
}

/** Park–Miller minimal standard generator (Park & Miller, CACM 31, 1988): reproducible noise without deps. */
function lcg(seed: number) {
  let s = seed % 2147483647;
  if (s <= 0) s += 2147483646;
  return () => {
    s = (s * 16807) % 2147483647;
    return (s - 1) / 2147483646;
  };
}

interface Tc {
  header: string;
  tauMin: number;
}

const TCS: Tc[] = [
  { header: 'TC1 leading bag-side (°C)', tauMin: 3 },
  { header: 'TC2 mid (°C)', tauMin: 6 },
  { header: 'TC3 lagging tool-side (°C)', tauMin: 9 },
];
const TOOL_TAU_MIN = 8;
const PSI_PER_BAR = 14.503773773;
const INHG_VACUUM = 28.2;
const SHOP_C = 22;
const SHOP_TAU_MIN = 25;

function pad(n: number): string {
  return String(n).padStart(2, '0');
}

function stamp(startMs: number, tS: number): string {
  const d = new Date(startMs + Math.round(tS) * 1000);
  return `${d.getUTCFullYear()}-${pad(d.getUTCMonth() + 1)}-${pad(d.getUTCDate())} ${pad(d.getUTCHours())}:${pad(d.getUTCMinutes())}:${pad(d.getUTCSeconds())}`;
}

/**
 * The demo run as CSV text. The air follows the study's segment cycle (holds clocked from the lagging TC
 * entering the band, as the reference cycle asks), except that hold 2 runs `secondHoldMin`.
 */
export function demoRunLogCsv(params: StudyParams, options: DemoRunLogOptions = {}): string {
  if (params.cycle.kind !== 'segments') throw new Error('the demo run log follows a segment cycle');
  const stepS = options.stepS ?? 30;
  const secondHoldMin = options.secondHoldMin ?? DEMO_RUN_LOG_EXCURSION.ranMin;
  const startMs = Date.parse(`${options.start ?? '2026-03-14T06:40:00'}Z`);
  const rand = lcg(4471);
  const noise = (amp: number) => (rand() - 0.5) * 2 * amp;

  const { startC, segments } = params.cycle;
  const pressureBar = Math.max(...segments.map((s) => s.pressureBar));
  let air = startC;
  const tcs = TCS.map(() => startC);
  let tool = startC;
  let seg = 0;
  let holdCount = 0;
  let clockStartS = -1;
  let segmentStartS = 0;
  let currentTarget = startC;
  const rows: (string | number)[][] = [];
  const fields = ['Timestamp', 'Air (°C)', 'Tool (°C)', ...TCS.map((t) => t.header), 'Vessel pressure (psi)', 'Bag vacuum (inHg)', 'Controller step'];
  let coolEndS = -1;
  let ventS = -1;

  for (let tS = 0; ; tS += stepS) {
    const s = segments[Math.min(seg, segments.length - 1)];
    let step = 'done';
    if (seg < segments.length) {
      if (s.kind === 'hold') {
        step = `hold ${holdCount + 1}`;
        air = currentTarget;
        const lagging = Math.min(...tcs);
        if (clockStartS < 0 && (s.start === 'clock' || lagging >= currentTarget - s.bandC)) clockStartS = tS;
        const holdMin = holdCount === 1 ? secondHoldMin : s.holdMin;
        if (clockStartS >= 0 && tS - clockStartS >= holdMin * 60) {
          seg++;
          holdCount++;
          clockStartS = -1;
          segmentStartS = tS;
        }
      } else {
        step = s.kind === 'ramp' ? `ramp to ${s.targetC}` : `cool to ${s.targetC}`;
        const sign = s.kind === 'ramp' ? 1 : -1;
        air = currentTarget + sign * s.rateCPerMin * ((tS - segmentStartS) / 60);
        if (sign * (air - s.targetC) >= 0) {
          air = s.targetC;
          currentTarget = s.targetC;
          seg++;
          segmentStartS = tS;
        }
      }
    } else {
      // After the cycle the door opens: the air drifts towards the shop temperature.
      if (coolEndS < 0) coolEndS = tS;
      air += ((SHOP_C - air) * stepS) / (SHOP_TAU_MIN * 60);
    }
    // First-order lags, explicit Euler with the log's step (step ≪ time constants).
    for (let k = 0; k < tcs.length; k++) tcs[k] += ((air - tcs[k]) * stepS) / (TCS[k].tauMin * 60);
    tool += ((air - tool) * stepS) / (TOOL_TAU_MIN * 60);
    // Pressure rises over the first 10 min and vents once every part TC is 2 °C below the demould
    // temperature; vacuum is held throughout.
    if (coolEndS >= 0 && ventS < 0 && Math.max(...tcs) < currentTarget - 2) ventS = tS;
    const vented = ventS >= 0;
    const p = vented ? 0 : Math.min(1, tS / 600) * pressureBar * PSI_PER_BAR;
    rows.push([
      stamp(startMs, tS),
      (air + noise(0.15)).toFixed(1),
      (tool + noise(0.15)).toFixed(1),
      ...tcs.map((v) => (v + noise(0.15)).toFixed(1)),
      (p + (vented ? 0 : noise(0.3))).toFixed(1),
      (INHG_VACUUM + noise(0.1)).toFixed(1),
      step,
    ]);
    if (ventS >= 0 && tS - ventS > 600) break;
  }
  return Papa.unparse({ fields, data: rows }, { newline: '\n' });
}
