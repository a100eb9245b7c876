/**
 * The recursive Prony update against the direct hereditary integral, both over 2000 steps of one smooth strain
 * history with a wandering shift factor: the recursion is O(steps) with O(1) memory per term, the direct
 * convolution O(steps²). Target: ratio ≥ 100×. Run alone with `npx tsx bench/viscoelastic.ts`, or through
 * `npm run bench`.
 */
import { fileURLToPath } from 'node:url';
import { advanceScalarRelaxation, createScalarRelaxation, directHereditaryStress, reducedTimeIncrement } from '../shared/solver/viscoelastic';

type Figures = Record<string, number | string>;

const STEPS = 2000;

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : 0.5 * (s[m - 1] + s[m]);
}

/** Median ms of `run` after warm-up, over at least `minRuns` runs and `minMs` of wall time. */
function timeIt(run: () => void, minRuns: number, minMs: number): number {
  for (let i = 0; i < 3; i++) run();
  const times: number[] = [];
  const start = performance.now();
  while (times.length < minRuns || performance.now() - start < minMs) {
    const t0 = performance.now();
    run();
    times.push(performance.now() - t0);
    if (times.length > 20_000) break;
  }
  return median(times);
}

export async function runViscoelasticBench(): Promise<Figures> {
  // A resin spectrum of eight terms, one per two decades (E∞ 0.5 GPa, E_u 3.4 GPa), as a cure card would carry.
  const timesS = [1e0, 1e2, 1e4, 1e6, 1e8, 1e10, 1e12, 1e14];
  const raw = [0.06, 0.12, 0.2, 0.22, 0.18, 0.12, 0.07, 0.03];
  const sum = raw.reduce((a, b) => a + b, 0);
  const termModuliPa = raw.map((w) => ((3.4e9 - 0.5e9) * w) / sum);
  const relaxedPa = 0.5e9;

  const dt = 10;
  const xi = new Float64Array(STEPS + 1);
  const eps = new Float64Array(STEPS + 1);
  for (let k = 0; k <= STEPS; k++) {
    const t = k * dt;
    eps[k] = 1e-3 * Math.sin(t / 3000) + 2e-4 * Math.sin(t / 170);
    if (k > 0) xi[k] = xi[k - 1] + reducedTimeIncrement(dt, 10 ** (-3 * Math.sin(((k - 1) * dt) / 5000)), 10 ** (-3 * Math.sin((k * dt) / 5000)));
  }

  const direct = new Float64Array(STEPS + 1);
  const recursive = new Float64Array(STEPS + 1);
  const runRecursive = () => {
    const s = createScalarRelaxation(relaxedPa, termModuliPa, timesS);
    for (let k = 1; k <= STEPS; k++) recursive[k] = advanceScalarRelaxation(s, xi[k] - xi[k - 1], eps[k] - eps[k - 1]);
  };
  const runDirect = () => directHereditaryStress(relaxedPa, termModuliPa, timesS, xi, eps, direct);

  const recursiveMs = timeIt(runRecursive, 200, 300);
  const directMs = timeIt(runDirect, 5, 1000);

  let maxAbs = 0;
  let maxDiff = 0;
  for (let k = 1; k <= STEPS; k++) {
    maxAbs = Math.max(maxAbs, Math.abs(direct[k]));
    maxDiff = Math.max(maxDiff, Math.abs(direct[k] - recursive[k]));
  }

  return {
    steps: STEPS,
    pronyTerms: timesS.length,
    recursiveMs: Number(recursiveMs.toFixed(4)),
    directMs: Number(directMs.toFixed(2)),
    speedRatio: Math.round(directMs / recursiveMs),
    target: '≥ 100×',
    maxRelativeDifference: Number((maxDiff / maxAbs).toExponential(2)),
  };
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  runViscoelasticBench()
    .then((figures) => console.table(figures))
    .catch((error: unknown) => {
      console.error(error);
      process.exit(1);
    });
}
