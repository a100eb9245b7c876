import type { StudySummary } from '../../../../shared/solver/simulation-result';

// The fixed text of the printed report: what the model assumes and what a reader must keep in mind. Kept as
// data so the page, and any later export, say the same thing.

export const ASSUMPTIONS: readonly string[] = [
  'Heat flows through the thickness only (one dimension): the part is taken as wide compared with its thickness, with no edge, ply-drop or corner heating effects.',
  'The tool is a uniform plate under the part; bag and tool sides exchange heat with the air through the film coefficients given, which stand for the vessel’s circulation and the bagging materials.',
  'Cure follows the resin card’s kinetics (rate against degree of cure and temperature), slowed by the diffusion factor when one is given; the heat of reaction is released in proportion to cure.',
  'Tg follows the DiBenedetto relation with degree of cure; the resin gels at the card’s gel point and takes load only after it.',
  'Resin stiffness relaxes by the card’s Prony series (or steps between glassy and rubbery in the CHILE form), shifted by temperature relative to Tg; ply properties come from micromechanics of fibre and resin at the given fibre volume fraction.',
  'Residual stresses build up from thermal and chemical (cure shrinkage) strains in classical laminate theory; a tool-held part stays flat on the tool until demould and is then released.',
  'Warpage is the deflection of a flat strip of the given span from the laminate’s curvature after demould; spring-in is the Radford–Diefendorf estimate for a corner of the given angle.',
  'Not modelled: resin flow, consolidation, bleed, voids and porosity, fibre waviness, tool–part friction or sliding, moisture, and post-cure.',
];

export const CAUTIONS: readonly string[] = [
  'These are predictions. They support, and never replace, part qualification, the process specification, local codes and licensed engineering practice.',
  'A prediction is only as good as the material cards behind it: check each card’s source, and that it was fitted over the temperatures and rates of this cycle.',
  'Confirm the cycle on the first article with thermocouples at the thickest section and at the lagging and leading points of the part and tool.',
];

/** The exotherm caution, with this run's figures. */
export function exothermNote(summary: Pick<StudySummary, 'adiabaticRiseC' | 'peakOvershootC' | 'peakOvershootTimeMin' | 'limits'>): string {
  const overshootLimit = summary.limits.find((l) => l.key === 'maxOvershootC');
  const over = overshootLimit && !overshootLimit.pass;
  return (
    `Exotherm risk: this resin can heat itself by up to ${summary.adiabaticRiseC.toFixed(0)} °C if none of its reaction heat escapes. ` +
    `Thick sections, insulating tools, fast ramps and dwells near the fastest reaction can let cure run away, damaging the part and ` +
    `giving off smoke or fire. The predicted overshoot above the set point is ${summary.peakOvershootC.toFixed(1)} °C at ` +
    `${summary.peakOvershootTimeMin.toFixed(0)} min${over ? ', ABOVE the process limit: do not run this cycle as it stands' : ''}.`
  );
}
