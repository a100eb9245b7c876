// Through-thickness heat conduction in one column (laminate, optionally on a tool plate):
//   ρc ∂T/∂t = ∂/∂z (k ∂T/∂z) + q,   −k ∂T/∂z = h (T − T_air) on both outer faces, perfect contact inside.
// Vertex-centred finite volumes: nodes sit on both outer faces and on every layer interface, so the surface
// temperatures and the ply top/bottom values the mechanics needs are nodes, not interpolations. Time stepping is
// the θ-scheme (θ = 1/2 Crank–Nicolson, θ = 1 backward Euler) with a Thomas tridiagonal solve. The scheme is
// conservative: stored-heat change = boundary heat in + source, to rounding, which the energy bookkeeping checks.

/**
 * Transverse conductivity of a unidirectional ply from its constituents, Halpin–Tsai-type form with ξ = 1
 * (Halpin & Kardos 1976, from memory):
 *   k_z = k_r (k_f + k_r + (k_f − k_r) V_f) / (k_f + k_r − (k_f − k_r) V_f)
 */
export function transverseConductivity(fibreTransverseWPerMK: number, resinWPerMK: number, fibreVolumeFraction: number): number {
  const kf = fibreTransverseWPerMK;
  const kr = resinWPerMK;
  const vf = fibreVolumeFraction;
  return (kr * (kf + kr + (kf - kr) * vf)) / (kf + kr - (kf - kr) * vf);
}

/** Volumetric heat capacity ρc of the ply by the rule of mixtures on heat capacity per volume, J/(m³·K). */
export function volumetricHeatCapacity(
  fibreDensity: number, fibreSpecificHeat: number, resinDensity: number, resinSpecificHeat: number, fibreVolumeFraction: number,
): number {
  return fibreVolumeFraction * fibreDensity * fibreSpecificHeat + (1 - fibreVolumeFraction) * resinDensity * resinSpecificHeat;
}

/** One homogeneous layer of the column, bottom to top. */
export interface HeatLayer {
  thicknessM: number;
  /** equal intervals through the layer (≥ 1) */
  intervals: number;
  conductivityWPerMK: number;
  /** ρc, J/(m³·K) */
  volumetricHeatCapacity: number;
}

/** The discretised column plus its work arrays (allocated once, reused every step). */
export interface HeatColumn {
  readonly nodes: number;
  /** node height above the column bottom, m */
  readonly zM: Float64Array;
  /** heat capacity of each node's control volume per unit area, J/(m²·K) */
  readonly capacity: Float64Array;
  /** conductance between node i and i + 1 per unit area, W/(m²·K); length nodes − 1 */
  readonly conductance: Float64Array;
  /** film coefficients of the bottom and top faces, W/(m²·K) */
  readonly hBottom: number;
  readonly hTop: number;
  readonly lower: Float64Array;
  readonly diag: Float64Array;
  readonly upper: Float64Array;
  readonly rhs: Float64Array;
  readonly scratch: Float64Array;
  /** the step prepared by prepareHeatStep: its right-hand side without the source, and the Thomas pivots' reciprocals */
  readonly baseRhs: Float64Array;
  readonly inversePivot: Float64Array;
  /** elimination factors of a solve whose source depends on the new temperature (the matrix changes per solve) */
  readonly linearScratch: Float64Array;
  readonly step: PreparedHeatStep;
}

/** What prepareHeatStep fixed for the solves of one step. */
interface PreparedHeatStep {
  dtS: number;
  theta: number;
  bottomAirOldK: number;
  bottomAirNewK: number;
  topAirOldK: number;
  topAirNewK: number;
  /** dtS and θ the matrix and its pivots were built for (NaN: none yet) */
  factoredDtS: number;
  factoredTheta: number;
}

export function createHeatColumn(layers: readonly HeatLayer[], hBottomWPerM2K: number, hTopWPerM2K: number): HeatColumn {
  if (layers.length === 0) throw new RangeError('heat column: needs at least 1 layer');
  layers.forEach((l, i) => {
    const ok = l.thicknessM > 0 && Number.isInteger(l.intervals) && l.intervals >= 1 && l.conductivityWPerMK > 0 && l.volumetricHeatCapacity > 0;
    if (!ok || !Number.isFinite(l.thicknessM + l.conductivityWPerMK + l.volumetricHeatCapacity)) {
      throw new RangeError(
        `heat column layer ${i}: thickness ${l.thicknessM} m, intervals ${l.intervals}, k ${l.conductivityWPerMK} W/(m·K), ρc ${l.volumetricHeatCapacity} J/(m³·K): allowed all > 0 and finite, intervals a whole number ≥ 1`,
      );
    }
  });
  for (const [name, h] of [['bottom', hBottomWPerM2K], ['top', hTopWPerM2K]] as const) {
    if (!(h >= 0) || !Number.isFinite(h)) throw new RangeError(`heat column: ${name} film coefficient ${h} W/(m²·K): allowed ≥ 0 and finite`);
  }
  const nodes = layers.reduce((s, l) => s + l.intervals, 0) + 1;
  const zM = new Float64Array(nodes);
  const capacity = new Float64Array(nodes);
  const conductance = new Float64Array(nodes - 1);
  let node = 0;
  let z = 0;
  for (const l of layers) {
    const dz = l.thicknessM / l.intervals;
    for (let j = 0; j < l.intervals; j++) {
      // each interval gives half its heat capacity to each end node and one conductance between them
      capacity[node] += 0.5 * l.volumetricHeatCapacity * dz;
      capacity[node + 1] += 0.5 * l.volumetricHeatCapacity * dz;
      conductance[node] = l.conductivityWPerMK / dz;
      zM[node] = z + j * dz;
      node++;
    }
    z += l.thicknessM;
  }
  zM[nodes - 1] = z;
  return {
    nodes, zM, capacity, conductance, hBottom: hBottomWPerM2K, hTop: hTopWPerM2K,
    lower: new Float64Array(nodes), diag: new Float64Array(nodes), upper: new Float64Array(nodes),
    rhs: new Float64Array(nodes), scratch: new Float64Array(nodes), baseRhs: new Float64Array(nodes), inversePivot: new Float64Array(nodes),
    linearScratch: new Float64Array(nodes),
    step: {
      dtS: Number.NaN, theta: Number.NaN, bottomAirOldK: Number.NaN, bottomAirNewK: Number.NaN, topAirOldK: Number.NaN, topAirNewK: Number.NaN,
      factoredDtS: Number.NaN, factoredTheta: Number.NaN,
    },
  };
}

/**
 * Thomas algorithm for a tridiagonal system (lower[i] multiplies x[i−1], upper[i] multiplies x[i+1]).
 * The matrices here are diagonally dominant (capacity/dt on the diagonal), so no pivoting is needed.
 */
export function thomasSolve(
  lower: Float64Array, diag: Float64Array, upper: Float64Array, rhs: Float64Array, x: Float64Array, n: number, scratch: Float64Array,
): void {
  let beta = diag[0];
  x[0] = rhs[0] / beta;
  for (let i = 1; i < n; i++) {
    scratch[i] = upper[i - 1] / beta;
    beta = diag[i] - lower[i] * scratch[i];
    x[i] = (rhs[i] - lower[i] * x[i - 1]) / beta;
  }
  for (let i = n - 2; i >= 0; i--) x[i] -= scratch[i + 1] * x[i + 1];
}

/** Heat flowing in through the two faces over one θ-step, split by face, J/m². */
export interface BoundaryHeat {
  bottomJPerM2: number;
  topJPerM2: number;
}

/**
 * One θ-step of the column from TOld to TNew (may not alias). Air temperatures are given at the start and
 * end of the step; `sourceJPerM2` (optional) is the heat released in each node's control volume over the step.
 * Writes the split boundary heat of the step into `heat` and returns the total, J/m².
 */
export function heatStep(
  col: HeatColumn, TOld: Float64Array, TNew: Float64Array, dtS: number, theta: number,
  bottomAirOldK: number, bottomAirNewK: number, topAirOldK: number, topAirNewK: number,
  sourceJPerM2: Float64Array | null, heat: BoundaryHeat,
): number {
  prepareHeatStep(col, TOld, dtS, theta, bottomAirOldK, bottomAirNewK, topAirOldK, topAirNewK);
  return solveHeatStep(col, TOld, TNew, sourceJPerM2, heat);
}

/**
 * The part of heatStep that does not depend on the source: the matrix, its Thomas pivots (kept while dtS and θ
 * stay the same) and the right-hand side from TOld and the air. A coupled step solves several times with
 * different sources; each solve is then one forward and one back substitution (solveHeatStep).
 */
export function prepareHeatStep(
  col: HeatColumn, TOld: Float64Array, dtS: number, theta: number,
  bottomAirOldK: number, bottomAirNewK: number, topAirOldK: number, topAirNewK: number,
): void {
  const n = col.nodes;
  const { capacity: C, conductance: G, lower, diag, upper, baseRhs, scratch, inversePivot, step } = col;
  const ex = 1 - theta;
  const hb = col.hBottom;
  const ht = col.hTop;
  const refactor = !(dtS === step.factoredDtS && theta === step.factoredTheta);
  for (let i = 0; i < n; i++) {
    const gDown = i > 0 ? G[i - 1] : 0;
    const gUp = i < n - 1 ? G[i] : 0;
    const cdt = C[i] / dtS;
    let explicitFlux = 0;
    if (i > 0) explicitFlux += gDown * (TOld[i - 1] - TOld[i]);
    if (i < n - 1) explicitFlux += gUp * (TOld[i + 1] - TOld[i]);
    let d = cdt + theta * (gDown + gUp);
    let r = cdt * TOld[i] + ex * explicitFlux;
    if (i === 0) {
      d += theta * hb;
      r += hb * (ex * (bottomAirOldK - TOld[0]) + theta * bottomAirNewK);
    }
    if (i === n - 1) {
      d += theta * ht;
      r += ht * (ex * (topAirOldK - TOld[n - 1]) + theta * topAirNewK);
    }
    if (refactor) {
      lower[i] = -theta * gDown;
      upper[i] = -theta * gUp;
      diag[i] = d;
    }
    baseRhs[i] = r;
  }
  if (refactor) {
    // Thomas forward elimination of the matrix alone; the solves then multiply by the reciprocal pivots (the
    // substitution is a chain from node to node, and a division on the chain costs several multiplications).
    let inv = 1 / diag[0];
    inversePivot[0] = inv;
    for (let i = 1; i < n; i++) {
      scratch[i] = upper[i - 1] * inv;
      inv = 1 / (diag[i] - lower[i] * scratch[i]);
      inversePivot[i] = inv;
    }
    step.factoredDtS = dtS;
    step.factoredTheta = theta;
  }
  step.dtS = dtS;
  step.theta = theta;
  step.bottomAirOldK = bottomAirOldK;
  step.bottomAirNewK = bottomAirNewK;
  step.topAirOldK = topAirOldK;
  step.topAirNewK = topAirNewK;
}

/**
 * Solve the step prepared by prepareHeatStep (same TOld) with the given source: the heat released in node i's
 * control volume over the step is sourceJPerM2[i] + sourcePerKJPerM2K[i]·TNew[i] when the second array is
 * given (a source linearised in the node's new temperature, which moves into the matrix), sourceJPerM2[i]
 * otherwise (Thomas substitutions with the stored factors). Writes the split boundary heat into `heat` and
 * returns the total, J/m².
 */
export function solveHeatStep(
  col: HeatColumn, TOld: Float64Array, TNew: Float64Array, sourceJPerM2: Float64Array | null, heat: BoundaryHeat,
  sourcePerKJPerM2K: Float64Array | null = null,
): number {
  const n = col.nodes;
  const { lower, rhs, baseRhs, scratch, inversePivot, step } = col;
  const { dtS, theta } = step;
  if (!(dtS > 0)) throw new Error('solveHeatStep: no step prepared (call prepareHeatStep first)');
  for (let i = 0; i < n; i++) rhs[i] = sourceJPerM2 ? baseRhs[i] + sourceJPerM2[i] / dtS : baseRhs[i];
  if (sourcePerKJPerM2K) {
    // The diagonal loses sourcePerK/dt: eliminate afresh (the caller keeps it well under C/dt).
    const { diag, upper, linearScratch: f } = col;
    let inv = 1 / (diag[0] - sourcePerKJPerM2K[0] / dtS);
    TNew[0] = rhs[0] * inv;
    for (let i = 1; i < n; i++) {
      f[i] = upper[i - 1] * inv;
      inv = 1 / (diag[i] - sourcePerKJPerM2K[i] / dtS - lower[i] * f[i]);
      TNew[i] = (rhs[i] - lower[i] * TNew[i - 1]) * inv;
    }
    for (let i = n - 2; i >= 0; i--) TNew[i] -= f[i + 1] * TNew[i + 1];
  } else {
    TNew[0] = rhs[0] * inversePivot[0];
    for (let i = 1; i < n; i++) TNew[i] = (rhs[i] - lower[i] * TNew[i - 1]) * inversePivot[i];
    for (let i = n - 2; i >= 0; i--) TNew[i] -= scratch[i + 1] * TNew[i + 1];
  }
  // The same θ-weighted face fluxes the scheme used, so the bookkeeping matches the discrete balance.
  const ex = 1 - theta;
  heat.bottomJPerM2 = dtS * col.hBottom * (ex * (step.bottomAirOldK - TOld[0]) + theta * (step.bottomAirNewK - TNew[0]));
  heat.topJPerM2 = dtS * col.hTop * (ex * (step.topAirOldK - TOld[n - 1]) + theta * (step.topAirNewK - TNew[n - 1]));
  return heat.bottomJPerM2 + heat.topJPerM2;
}

/** Heat stored in the column relative to 0 K, J/m² (constant properties: Σ C_i T_i). */
export function storedHeat(col: HeatColumn, T: Float64Array): number {
  let s = 0;
  for (let i = 0; i < col.nodes; i++) s += col.capacity[i] * T[i];
  return s;
}
