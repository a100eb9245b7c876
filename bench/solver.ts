/**
 * Solver speed: one full simulation of the reference study, simulations per second, and how the time grows
 * with plies, steps and Prony terms (fitted exponent of time ∝ xᵖ; linear growth is p = 1).
 * Run alone with `npx tsx bench/solver.ts`, or through `npm run bench`.
 */
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseStudy, type StudyParams } from '../shared/schemas/study';
import { quasiIsotropic, referenceStudy } from '../shared/solver/demo-cards';
import { simulate, type SimulateOptions } from '../shared/solver/simulate';

type Figures = Record<string, number | string>;

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : 0.5 * (s[m - 1] + s[m]);
}

/** Median wall time of one simulate() call in ms, after warm-up, over at least `minMs` of runs. */
function timeIt(params: StudyParams, options: SimulateOptions = {}, minRuns = 15, minMs = 400): { ms: number; steps: number } {
  let steps = 0;
  for (let i = 0; i < 5; i++) steps = simulate(params, options).steps;
  const times: number[] = [];
  const start = performance.now();
  while (times.length < minRuns || performance.now() - start < minMs) {
    const t0 = performance.now();
    simulate(params, options);
    times.push(performance.now() - t0);
    if (times.length > 2000) break;
  }
  return { ms: median(times), steps };
}

/** Process CPU time per simulate() call in ms over `runs` calls (user + system; waiting for a core not counted). */
function cpuMsPerRun(params: StudyParams, runs: number): number {
  simulate(params);
  const start = process.cpuUsage();
  for (let i = 0; i < runs; i++) simulate(params);
  const used = process.cpuUsage(start);
  return (used.user + used.system) / 1000 / runs;
}

/** Least-squares slope of log(y) against log(x). */
export function growthExponent(xs: number[], ys: number[]): number {
  const lx = xs.map(Math.log);
  const ly = ys.map(Math.log);
  const mx = lx.reduce((a, b) => a + b, 0) / lx.length;
  const my = ly.reduce((a, b) => a + b, 0) / ly.length;
  let sxy = 0;
  let sxx = 0;
  for (let i = 0; i < lx.length; i++) {
    sxy += (lx[i] - mx) * (ly[i] - my);
    sxx += (lx[i] - mx) ** 2;
  }
  return sxy / sxx;
}

function withPronyTerms(base: StudyParams, terms: number): StudyParams {
  const p = structuredClone(base);
  const timesS = Array.from({ length: terms }, (_, i) => 10 ** ((14 * i) / Math.max(1, terms - 1)));
  p.resin.modulus.prony = { weights: timesS.map(() => 1 / terms), timesS };
  // exact sum to 1 despite rounding
  p.resin.modulus.prony.weights[terms - 1] = 1 - p.resin.modulus.prony.weights.slice(0, -1).reduce((a, b) => a + b, 0);
  return parseStudy(p);
}

export async function runSolverBench(): Promise<Figures> {
  const ref = referenceStudy();
  const main = timeIt(ref, {}, 40, 2000);
  const cpu = cpuMsPerRun(ref, 40);
  const figures: Figures = {
    'reference study: median ms per simulation': round(main.ms, 3),
    'reference study: CPU ms per simulation (less sensitive to a busy machine)': round(cpu, 3),
    'reference study: steps': main.steps,
    'reference study: simulations per second': round(1000 / main.ms, 1),
    'reference study: µs per step': round((1000 * main.ms) / main.steps, 2),
    'target ms (issue 3)': 8,
  };

  // Plies: same cycle, 8 → 128 plies (mesh nodes grow with plies).
  const plies = [8, 16, 32, 64, 128];
  const plyRuns = plies.map((n) => timeIt(parseStudy({ ...ref, layup: { plies: quasiIsotropic(n) } })));
  figures['growth exponent vs plies (8→128)'] = round(growthExponent(plies, plyRuns.map((r) => r.ms)), 3);
  // Thicker laminates exotherm more and so take more steps; per step the work should be linear in plies.
  figures['growth exponent of time per step vs plies'] = round(growthExponent(plies, plyRuns.map((r) => r.ms / r.steps)), 3);
  figures['steps at 8 / 128 plies'] = `${plyRuns[0].steps} / ${plyRuns[plyRuns.length - 1].steps}`;

  // Steps: the same study with a tighter step cap (and air-change limit), so the step count grows.
  const caps = [60, 30, 15, 7.5, 3.75];
  const stepRuns = caps.map((c) => timeIt(ref, { stepLimits: { maxStepS: c, maxAirChangeK: c / 60 } }));
  figures['growth exponent vs steps'] = round(growthExponent(stepRuns.map((r) => r.steps), stepRuns.map((r) => r.ms)), 3);
  figures['steps range'] = `${stepRuns[0].steps}→${stepRuns[stepRuns.length - 1].steps}`;

  // Prony terms: 2 → 32 terms spread over the same 14 decades.
  const terms = [2, 4, 8, 16, 32];
  const termTimes = terms.map((n) => timeIt(withPronyTerms(ref, n)).ms);
  figures['growth exponent vs Prony terms (2→32)'] = round(growthExponent(terms, termTimes), 3);
  figures['target exponent (issue 3)'] = '≤ 1.1';
  // The recursion-vs-hereditary-integral ratio is bench/viscoelastic.ts's figure; bench/run.ts runs it once.
  return figures;
}

function round(x: number, digits: number): number {
  const f = 10 ** digits;
  return Math.round(x * f) / f;
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  runSolverBench().then((f) => console.table(f));
}
