import { describeSegments } from '../../../../shared/compare/segment-names';
import { KINETICS_NAMES } from '../../../../shared/compare/field-labels';
import { formatQuantity } from '../../../../shared/compare/field-labels';
import type { StudyParams } from '../../../../shared/schemas/study';

// Inputs of a study as the rows of the printed report, in plain words with units.

export type Row = [label: string, value: string];

const q = formatQuantity;

/** "[0/45/−45/90]: 24 plies × 0.19 mm = 4.56 mm" style summary with the full sequence. */
export function describeLayup(params: StudyParams): { summary: string; sequence: string } {
  const plies = params.layup.plies;
  const total = plies.reduce((s, p) => s + p.thicknessMm, 0);
  const thicknesses = new Set(plies.map((p) => p.thicknessMm));
  const each = thicknesses.size === 1 ? ` × ${q(plies[0].thicknessMm, 'mm')}` : ' of mixed thickness';
  const sequence = plies
    .map((p) => (thicknesses.size === 1 ? q(p.angleDeg, '°') : `${q(p.angleDeg, '°')} (${q(p.thicknessMm, 'mm')})`))
    .join(' / ');
  return { summary: `${plies.length} plies${each}, laminate ${q(Number(total.toPrecision(6)), 'mm')}`, sequence };
}

export function describeCycleSteps(params: StudyParams): string[] {
  const c = params.cycle;
  if (c.kind === 'record') {
    const last = c.points[c.points.length - 1];
    return [`Measured record of ${c.points.length} points over ${q(last.timeMin - c.points[0].timeMin, 'min')}, starting at ${q(c.points[0].airC, '°C')}`];
  }
  return [`Start at ${q(c.startC, '°C')}`, ...describeSegments(c.segments)];
}

export function resinRows(params: StudyParams): Row[] {
  const r = params.resin;
  const k = r.kinetics;
  const kinetics =
    k.form === 'nth-order'
      ? `${KINETICS_NAMES['nth-order']}: A ${q(k.aPerS, '1/s')}, E ${q(k.eJPerMol, 'J/mol')}, n ${q(k.n, '')}`
      : k.form === 'kamal-sourour'
        ? `${KINETICS_NAMES['kamal-sourour']}: A1 ${q(k.a1PerS, '1/s')}, E1 ${q(k.e1JPerMol, 'J/mol')}, A2 ${q(k.a2PerS, '1/s')}, E2 ${q(k.e2JPerMol, 'J/mol')}, m ${q(k.m, '')}, n ${q(k.n, '')}`
        : `${KINETICS_NAMES['lee-loos-springer']}: A1 ${q(k.a1PerMin, '1/min')}, A2 ${q(k.a2PerMin, '1/min')}, A3 ${q(k.a3PerMin, '1/min')}, E1 ${q(k.e1JPerMol, 'J/mol')}, E2 ${q(k.e2JPerMol, 'J/mol')}, E3 ${q(k.e3JPerMol, 'J/mol')}, B ${q(k.b, '')}`;
  return [
    ['Resin card', r.name],
    ['Source', r.provenance.source + (r.provenance.note ? ` (${r.provenance.note})` : '')],
    ['Kinetics', kinetics],
    ['Diffusion factor', r.diffusion ? `C ${q(r.diffusion.c, '')}, αC0 ${q(r.diffusion.alphaC0, '')}, αCT ${q(r.diffusion.alphaCTPerK, '1/K')}` : 'none'],
    ['Heat of reaction', q(r.heatOfReactionKJPerKg, 'kJ/kg')],
    ['Density, specific heat, conductivity', `${q(r.densityKgM3, 'kg/m³')}, ${q(r.specificHeatJPerKgK, 'J/(kg·K)')}, ${q(r.conductivityWPerMK, 'W/(m·K)')}`],
    ['Glass transition (DiBenedetto)', `Tg0 ${q(r.glassTransition.tg0C, '°C')}, Tg∞ ${q(r.glassTransition.tgInfC, '°C')}, λ ${q(r.glassTransition.lambda, '')}`],
    ['Gel point', `degree of cure ${q(r.gelPoint, '')}`],
    ['Modulus', `${r.modulus.model === 'prony' ? `Prony series, ${r.modulus.prony.weights.length} terms` : 'CHILE'}: unrelaxed ${q(r.modulus.unrelaxedGPa, 'GPa')}, relaxed ${q(r.modulus.relaxedGPa, 'GPa')}, Poisson ratio ${q(r.modulus.poisson, '')}`],
    ['CTE, total volumetric shrinkage', `${q(r.cteMicroPerK, 'µ/K')}, ${q(r.totalShrinkagePct, '%')}`],
  ];
}

export function fibreRows(params: StudyParams): Row[] {
  const f = params.fibre;
  return [
    ['Fibre card', f.name],
    ['Source', f.provenance.source + (f.provenance.note ? ` (${f.provenance.note})` : '')],
    ['E1, E2, G12', `${q(f.e1GPa, 'GPa')}, ${q(f.e2GPa, 'GPa')}, ${q(f.g12GPa, 'GPa')}`],
    ['ν12', q(f.nu12, '')],
    ['CTE1, CTE2', `${q(f.cte1MicroPerK, 'µ/K')}, ${q(f.cte2MicroPerK, 'µ/K')}`],
    ['Fibre volume fraction', q(params.fibreVolumeFraction, '')],
  ];
}

export function processRows(params: StudyParams): Row[] {
  const t = params.tool;
  return [
    ['Tool', t.kind === 'none' ? 'no tool plate' : `${t.name}, ${q(t.thicknessMm, 'mm')}, CTE ${q(t.cteMicroPerK, 'µ/K')}, conductivity ${q(t.conductivityWPerMK, 'W/(m·K)')}`],
    ['Part constraint', params.constraint === 'tool-held' ? 'held flat on the tool until demould, then released' : 'free on the tool'],
    ['Heat transfer', `bag side ${q(params.heatTransfer.bagSideWPerM2K, 'W/(m²·K)')}, tool side ${q(params.heatTransfer.toolSideWPerM2K, 'W/(m²·K)')}`],
    ['Part geometry', `strip span ${q(params.geometry.stripSpanMm, 'mm')}, corner angle ${q(params.geometry.cornerAngleDeg, '°')}`],
    ['Mesh', `${params.mesh.nodesPerPly} nodes per ply`],
  ];
}
