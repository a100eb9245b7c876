import { advanceCure, cureRate, GAS_CONSTANT, initialDegreeOfCure, type PreparedKinetics } from './kinetics';

// Constant-heating-rate DSC runs and the Kissinger analysis (Kissinger, Anal. Chem. 29, 1957):
// at the peak of the reaction rate of a first-order reaction heated at β,
//   β E / (R Tp²) = A e^(−E/(R Tp))   ⇔   ln(β/Tp²) = ln(A R/E) − E/(R Tp),
// so ln(β/Tp²) against 1/Tp is a straight line of slope −E/R. The lab team fits kinetics from DSC uploads.

export interface FirstOrderArrhenius {
  /** pre-exponential factor, 1/s */
  aPerS: number;
  /** activation energy, J/mol */
  eJPerMol: number;
}

/**
 * Peak temperature of the reaction rate of a first-order reaction heated at a constant rate, K: the root of
 * β E/(R T²) = A e^(−E/(RT)) (exact for first order, whatever the start temperature). Newton on the log form.
 */
export function firstOrderPeakTemperatureK(k: FirstOrderArrhenius, heatingRateKPerS: number): number {
  const { aPerS: A, eJPerMol: E } = k;
  if (!(A > 0) || !Number.isFinite(A)) throw new RangeError(`aPerS: ${String(A)} is out of range: allowed > 0 (1/s)`);
  if (!(E > 0) || !Number.isFinite(E)) throw new RangeError(`eJPerMol: ${String(E)} is out of range: allowed > 0 J/mol`);
  const beta = heatingRateKPerS;
  if (!(beta > 0) || !Number.isFinite(beta)) throw new RangeError(`heating rate: ${String(beta)} K/s is out of range: allowed > 0`);
  const b = E / GAS_CONSTANT;
  // g(T) = ln(β b / A) − 2 ln T + b/T = 0, decreasing in T where the peak lies (T < b/2).
  const c = Math.log((beta * b) / A);
  let T = b / 25; // typical E/(R Tp) is 20–30
  for (let i = 0; i < 100; i++) {
    const g = c - 2 * Math.log(T) + b / T;
    const dg = -2 / T - b / (T * T);
    const next = T - g / dg;
    if (!(next > 0)) T = T / 2;
    else if (Math.abs(next - T) < 1e-12 * T) return next;
    else T = next;
  }
  throw new Error(`firstOrderPeakTemperatureK: no convergence (A ${A} 1/s, E ${E} J/mol, β ${beta} K/s)`);
}

/**
 * Peak temperature of the cure rate for any kinetics on a constant-heating-rate run from `startK`, found by
 * integrating the cure along the ramp (steps of 0.05 K, temperature at each step's midpoint) and refining the
 * largest sampled rate with a parabola through its neighbours. A simulated DSC trace, for checking fits.
 */
export function dscPeakTemperatureK(k: PreparedKinetics, heatingRateKPerS: number, startK: number, endK = startK + 400): number {
  const beta = heatingRateKPerS;
  if (!(beta > 0) || !Number.isFinite(beta)) throw new RangeError(`heating rate: ${String(beta)} K/s is out of range: allowed > 0`);
  if (!(startK > 0) || !(endK > startK)) throw new RangeError(`temperature range ${startK}..${endK} K: allowed 0 < start < end`);
  const dT = 0.05;
  const dt = dT / beta;
  let alpha = initialDegreeOfCure(k);
  let T = startK;
  let previous = cureRate(k, alpha, T);
  let best = -1;
  let bestT = startK;
  let before = 0;
  let after = 0;
  let pendingAfter = false;
  while (T < endK) {
    alpha = advanceCure(k, alpha, T + dT / 2, dt);
    T += dT;
    const r = cureRate(k, alpha, T);
    if (pendingAfter) {
      after = r;
      pendingAfter = false;
    }
    if (r > best) {
      best = r;
      bestT = T;
      before = previous;
      pendingAfter = true;
    }
    previous = r;
    if (r < 0.01 * best && alpha > 0.5) break;
  }
  // Parabola through (−dT, before), (0, best), (dT, after): vertex offset.
  const curvature = before - 2 * best + after;
  const shift = curvature < 0 ? (0.5 * dT * (before - after)) / curvature : 0;
  return bestT + (Math.abs(shift) <= dT ? shift : 0);
}

export interface KissingerPoint {
  /** heating rate of the run, K/s */
  heatingRateKPerS: number;
  /** temperature of the rate peak, K */
  peakK: number;
}

export interface KissingerFit {
  /** activation energy from the slope, J/mol */
  eJPerMol: number;
  /** pre-exponential factor from the intercept, 1/s (first-order assumption) */
  aPerS: number;
  /** coefficient of determination of the straight line */
  rSquared: number;
}

/** Least-squares line through ln(β/Tp²) against 1/Tp: E = −slope·R, A = (E/R)·e^intercept. */
export function kissingerFit(points: readonly KissingerPoint[]): KissingerFit {
  if (points.length < 2) throw new RangeError(`points: ${points.length} runs: allowed ≥ 2 runs at different heating rates`);
  points.forEach((p, i) => {
    if (!(p.heatingRateKPerS > 0) || !Number.isFinite(p.heatingRateKPerS)) {
      throw new RangeError(`points.${i}.heatingRateKPerS: ${String(p.heatingRateKPerS)} is out of range: allowed > 0`);
    }
    if (!(p.peakK > 0) || !Number.isFinite(p.peakK)) throw new RangeError(`points.${i}.peakK: ${String(p.peakK)} is out of range: allowed > 0 K`);
  });
  const n = points.length;
  const x = points.map((p) => 1 / p.peakK);
  const y = points.map((p) => Math.log(p.heatingRateKPerS / (p.peakK * p.peakK)));
  const mx = x.reduce((s, v) => s + v, 0) / n;
  const my = y.reduce((s, v) => s + v, 0) / n;
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    sxx += (x[i] - mx) ** 2;
    sxy += (x[i] - mx) * (y[i] - my);
    syy += (y[i] - my) ** 2;
  }
  if (!(sxx > 0)) throw new RangeError('points: every run has the same peak temperature: allowed runs whose peaks differ');
  const slope = sxy / sxx;
  const intercept = my - slope * mx;
  const eOverR = -slope;
  return {
    eJPerMol: eOverR * GAS_CONSTANT,
    aPerS: eOverR * Math.exp(intercept),
    rSquared: syy > 0 ? (sxy * sxy) / (sxx * syy) : 1,
  };
}
