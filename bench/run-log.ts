/**
 * Run-log figures: parse + hygiene + spec check of a 1-million-row, 12-channel log (seconds, peak memory),
 * and the replay of a 10-hour log through the solver (milliseconds).
 */
import { referenceStudy } from '../shared/solver/demo-cards';
import { checkHygiene, checkSpec, demoRunLogCsv, inspectRunLog, parseRunLog, replayInput } from '../shared/run-log/index';

type Figures = Record<string, number | string>;

/** A synthetic 12-channel log: air, tool, 8 part TCs, pressure, vacuum; first-order lags behind the air. */
function bigLog(rows: number, durationS: number): string {
  const dt = durationS / rows;
  const header = ['Time (s)', 'Air (°C)', 'Tool (°C)', ...Array.from({ length: 8 }, (_, k) => `TC${k + 1} (°C)`), 'Pressure (bar)', 'Vacuum (kPa)'];
  const taus = [300, 400, 450, 500, 550, 600, 650, 700, 750];
  const state = taus.map(() => 20);
  const lines: string[] = [header.join(',')];
  for (let i = 0; i < rows; i++) {
    const t = i * dt;
    const air = t < 4800 ? 20 + t / 30 : t < 4800 + 14_400 ? 180 : Math.max(30, 180 - (t - 19_200) / 20);
    for (let k = 0; k < taus.length; k++) state[k] += ((air - state[k]) * dt) / taus[k];
    lines.push(`${t.toFixed(2)},${air.toFixed(1)},${state.map((v) => v.toFixed(1)).join(',')},${t < 600 ? (t / 86).toFixed(2) : '7.00'},-95.0`);
  }
  return lines.join('\n');
}

export async function runRunLogBench(): Promise<Figures> {
  const params = referenceStudy();
  const rows = 1_000_000;
  const text = bigLog(rows, 8 * 3600);
  const megabytes = Buffer.byteLength(text) / (1024 * 1024);
  const rssBefore = process.memoryUsage().rss;

  const t0 = performance.now();
  const inspection = inspectRunLog(text, { maxBytes: Infinity });
  const log = parseRunLog(text, inspection.mapping, { maxBytes: Infinity });
  const t1 = performance.now();
  const hygiene = checkHygiene(log);
  const spec = checkSpec(log, params, { excluded: hygiene.excluded });
  const t2 = performance.now();
  const peakRssMb = process.resourceUsage().maxRSS / 1024;

  const figures: Figures = {
    'rows × channels': `${log.rows} × ${log.channels.length}`,
    'file size (MB)': Number(megabytes.toFixed(1)),
    'parse (s)': Number(((t1 - t0) / 1000).toFixed(2)),
    'hygiene + spec check (s)': Number(((t2 - t1) / 1000).toFixed(2)),
    'parse + check (s)': Number(((t2 - t0) / 1000).toFixed(2)),
    'process peak RSS (MB)': Math.round(peakRssMb),
    'RSS before parsing (MB, text held)': Math.round(rssBefore / (1024 * 1024)),
    'findings': hygiene.findings.length + spec.findings.length,
  };

  // Replay of a 10-hour log (the demo run stretched: 6.6 h cycle + a long cool, 30 s samples, then 10 h total).
  try {
    const { simulate } = await import('../shared/solver/simulate');
    const csv = demoRunLogCsv(params, { secondHoldMin: 380, stepS: 10 });
    const demo = parseRunLog(csv, inspectRunLog(csv).mapping);
    const hours = (demo.timeS[demo.rows - 1] - demo.timeS[0]) / 3600;
    const r0 = performance.now();
    const input = replayInput(demo, params);
    const result = simulate(input);
    const r1 = performance.now();
    figures['replay log length (h)'] = Number(hours.toFixed(2));
    figures['replay (ms)'] = Math.round(r1 - r0);
    figures['replay solver steps'] = result.steps;
  } catch (error) {
    figures['replay (ms)'] = `not available: ${(error as Error).message}`;
  }
  return figures;
}
