import type { FibreCard, ResinCard, StudyParams, StudyParamsInput, ToolPlate } from '../schemas/study';
import { parseStudy } from '../schemas/study';

// Demo data for the invented shop of the demo scenario. Numbers are our own, chosen to be plausible for the
// class of material; they are not any supplier's data. The one literature card carries the published
// Lee–Loos–Springer kinetics and says so.

const DEMO = 'Dwellform demo data, invented';

/** Prony spectrum: one term per decade pair from 1 s to 1e14 s (reference temperature Tg(α) + offset). */
function demoSpectrum() {
  const timesS = [1e0, 1e2, 1e4, 1e6, 1e8, 1e10, 1e12, 1e14];
  const raw = [0.06, 0.12, 0.2, 0.22, 0.18, 0.12, 0.07, 0.03];
  const sum = raw.reduce((a, b) => a + b, 0);
  return { weights: raw.map((w) => w / sum), timesS };
}

/** Invented 180 °C-class toughened epoxy: autocatalytic (Kamal–Sourour form) with a diffusion factor. */
export function demoResin180(): ResinCard {
  return {
    name: 'DF-E180 demo epoxy',
    provenance: { source: DEMO, note: 'Plausible for a 180 °C-class aerospace epoxy; not measured.' },
    kinetics: { form: 'kamal-sourour', a1PerS: 4.4e4, e1JPerMol: 75_000, a2PerS: 8.0e3, e2JPerMol: 60_000, m: 0.5, n: 1.5 },
    diffusion: { c: 30, alphaC0: -1.3, alphaCTPerK: 0.005 },
    heatOfReactionKJPerKg: 500,
    densityKgM3: 1260,
    specificHeatJPerKgK: 1200,
    conductivityWPerMK: 0.2,
    glassTransition: { tg0C: -15, tgInfC: 215, lambda: 0.45 },
    gelPoint: 0.36,
    modulus: {
      model: 'prony',
      unrelaxedGPa: 3.4,
      relaxedGPa: 0.5,
      poisson: 0.37,
      prony: demoSpectrum(),
      shift: { wlfC1: 15, wlfC2K: 60, offsetC: 0, arrheniusEJPerMol: 250_000 },
      chile: { glassyOffsetC: -40, rubberyOffsetC: 0 },
    },
    cteMicroPerK: 55,
    totalShrinkagePct: 4,
  };
}

/** Invented standard-modulus carbon fibre. */
export function demoCarbonFibre(): FibreCard {
  return {
    name: 'DF-C230 demo carbon fibre',
    provenance: { source: DEMO, note: 'Plausible for a standard-modulus PAN carbon fibre; not measured.' },
    e1GPa: 232,
    e2GPa: 15,
    g12GPa: 24,
    nu12: 0.27,
    nu23: 0.4,
    cte1MicroPerK: -0.5,
    cte2MicroPerK: 8,
    densityKgM3: 1790,
    specificHeatJPerKgK: 760,
    conductivityAxialWPerMK: 9,
    conductivityTransverseWPerMK: 2.4,
  };
}

/**
 * Literature kinetics: Lee, Loos & Springer, J. Compos. Mater. 16 (1982). Constants per minute as published,
 * heat of reaction 473.6 kJ/kg from the same paper. All other properties are our own invented values.
 */
export function leeLoosSpringerResin(): ResinCard {
  return {
    name: 'Lee–Loos–Springer epoxy (literature kinetics)',
    provenance: {
      source: 'Lee, Loos & Springer, J. Compos. Mater. 16 (1982)',
      note: 'Kinetics constants and heat of reaction from the source; thermal, glass-transition and mechanical properties are Dwellform demo data, invented.',
    },
    kinetics: {
      form: 'lee-loos-springer',
      a1PerMin: 2.101e9,
      a2PerMin: -2.014e9,
      a3PerMin: 1.96e5,
      e1JPerMol: 80_700,
      e2JPerMol: 77_800,
      e3JPerMol: 56_600,
      b: 0.47,
    },
    heatOfReactionKJPerKg: 473.6,
    densityKgM3: 1270,
    specificHeatJPerKgK: 1250,
    conductivityWPerMK: 0.19,
    glassTransition: { tg0C: 0, tgInfC: 205, lambda: 0.5 },
    gelPoint: 0.4,
    modulus: {
      model: 'prony',
      unrelaxedGPa: 3.6,
      relaxedGPa: 0.52,
      poisson: 0.36,
      prony: demoSpectrum(),
      shift: { wlfC1: 15, wlfC2K: 60, offsetC: 0, arrheniusEJPerMol: 250_000 },
      chile: { glassyOffsetC: -40, rubberyOffsetC: 0 },
    },
    cteMicroPerK: 57,
    totalShrinkagePct: 4.5,
  };
}

/** Aluminium tool plate; handbook-typical values for a 6000-series alloy (from memory). */
export function aluminiumPlate(thicknessMm = 10): ToolPlate {
  return {
    kind: 'plate',
    name: 'Aluminium plate',
    thicknessMm,
    densityKgM3: 2700,
    specificHeatJPerKgK: 900,
    conductivityWPerMK: 167,
    cteMicroPerK: 23.6,
  };
}

/** Invar-like (36 % Ni–Fe) tool plate; handbook-typical values (from memory). */
export function invarPlate(thicknessMm = 12): ToolPlate {
  return {
    kind: 'plate',
    name: 'Invar-like plate',
    thicknessMm,
    densityKgM3: 8050,
    specificHeatJPerKgK: 515,
    conductivityWPerMK: 10.5,
    cteMicroPerK: 1.5,
  };
}

/** [0/45/−45/90]ns, symmetric about the mid-plane, `plies` a multiple of 8. */
export function quasiIsotropic(plies: number, thicknessMm = 0.19): { angleDeg: number; thicknessMm: number }[] {
  const half = Array.from({ length: plies / 2 }, (_, i) => [0, 45, -45, 90][i % 4]);
  return [...half, ...half.slice().reverse()].map((angleDeg) => ({ angleDeg, thicknessMm }));
}

/**
 * THE reference study: 24 plies quasi-isotropic on an aluminium plate, two-dwell 6 h cure (2 °C/min to 120 °C,
 * 90 min, 1.5 °C/min to 180 °C, 120 min, 2 °C/min to 60 °C: 50 + 90 + 40 + 120 + 60 = 360 min scheduled; holds
 * start when the lagging part point is in band, so the run is a few minutes longer). A long first dwell below
 * the cure temperature and gentle ramps are the usual shape for a 180 °C-class epoxy: the resin flows and
 * consolidates before gel, and the exotherm is spread out (common practice, no source).
 */
export function referenceStudy(): StudyParams {
  const input: StudyParamsInput = {
    schemaVersion: 1,
    resin: demoResin180(),
    fibre: demoCarbonFibre(),
    fibreVolumeFraction: 0.58,
    layup: { plies: quasiIsotropic(24) },
    tool: aluminiumPlate(10),
    heatTransfer: { bagSideWPerM2K: 50, toolSideWPerM2K: 60 },
    mesh: { nodesPerPly: 2 },
    cycle: {
      kind: 'segments',
      startC: 20,
      segments: [
        { kind: 'ramp', rateCPerMin: 2, targetC: 120, pressureBar: 7 },
        { kind: 'hold', holdMin: 90, pressureBar: 7, start: 'lagging-part', bandC: 5 },
        { kind: 'ramp', rateCPerMin: 1.5, targetC: 180, pressureBar: 7 },
        { kind: 'hold', holdMin: 120, pressureBar: 7, start: 'lagging-part', bandC: 5 },
        { kind: 'cool', rateCPerMin: 2, targetC: 60, pressureBar: 7 },
      ],
    },
    constraint: 'tool-held',
    geometry: { stripSpanMm: 300, cornerAngleDeg: 90 },
    limits: {
      minFinalCure: 0.9,
      maxOvershootC: 10,
      maxGradientC: 15,
      maxHeatRateCPerMin: 3,
      maxCoolRateCPerMin: 4,
      maxWarpageMm: 1,
      maxSpringInDeg: 1.5,
      maxCycleMin: 480, // one 8 h shift for a 6 h schedule, with room for a hold that runs long
    },
  };
  return parseStudy(input);
}

/** A few named variants of the reference study for the demo library. */
export function demoStudies(): { name: string; description: string; params: StudyParams }[] {
  const ref = referenceStudy();
  const thick: StudyParams = { ...referenceStudy(), layup: { plies: quasiIsotropic(128) }, mesh: { nodesPerPly: 2 } };
  const fast: StudyParams = {
    ...referenceStudy(),
    cycle: {
      kind: 'segments',
      startC: 20,
      segments: [
        { kind: 'ramp', rateCPerMin: 5, targetC: 180, pressureBar: 7 },
        { kind: 'hold', holdMin: 120, pressureBar: 7, start: 'clock', bandC: 5 },
        { kind: 'cool', rateCPerMin: 5, targetC: 60, pressureBar: 7 },
      ],
    },
  };
  const invar: StudyParams = { ...referenceStudy(), tool: invarPlate(12) };
  const lls: StudyParams = {
    ...referenceStudy(),
    resin: leeLoosSpringerResin(),
    cycle: {
      kind: 'segments',
      startC: 20,
      segments: [
        { kind: 'ramp', rateCPerMin: 2.5, targetC: 116, pressureBar: 6 },
        { kind: 'hold', holdMin: 60, pressureBar: 6, start: 'clock', bandC: 5 },
        { kind: 'ramp', rateCPerMin: 2.5, targetC: 177, pressureBar: 6 },
        { kind: 'hold', holdMin: 120, pressureBar: 6, start: 'clock', bandC: 5 },
        { kind: 'cool', rateCPerMin: 3, targetC: 60, pressureBar: 6 },
      ],
    },
  };
  return [
    { name: 'Skin panel, 24 plies QI', description: 'Reference two-dwell cure on an aluminium plate.', params: ref },
    { name: 'Thick spar cap, 128 plies', description: 'Same cycle on a 24 mm laminate: watch the exotherm.', params: thick },
    { name: 'Skin panel, single fast ramp', description: '5 °C/min straight to 180 °C, clock-started hold.', params: fast },
    { name: 'Skin panel on invar-like tool', description: 'Reference cycle on a low-expansion tool.', params: invar },
    { name: 'Literature resin, two-dwell', description: 'Lee–Loos–Springer kinetics, 116/177 °C dwells.', params: lls },
  ].map((s) => ({ ...s, params: parseStudy(s.params) }));
}
