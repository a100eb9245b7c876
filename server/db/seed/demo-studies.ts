/**
 * Parts and studies of the invented demo scenario. Each study starts from the
 * shared reference study and each revision is one small, named edit of it,
 * the way an engineer would iterate.
 */
import { referenceStudy, quasiIsotropic } from '../../../shared/solver/demo-cards';
import type { StudyParams } from '../../../shared/schemas/index';

export type { StudyParams };

export interface DemoRevision {
  author: string; // login
  message: string;
  edit: (params: StudyParams) => void;
}

export interface DemoStudy {
  title: string;
  owner: string; // login
  start: () => StudyParams;
  revisions: DemoRevision[];
}

export interface DemoPart {
  partNumber: string;
  name: string;
  description: string;
  studies: DemoStudy[];
  /** index of the study and revision number pinned as the part's baseline */
  baseline?: { study: number; revision: number; note: string; pinnedBy: string };
}

const segments = (p: StudyParams) => {
  if (p.cycle.kind !== 'segments') throw new Error('demo edits expect a segment cycle');
  return p.cycle.segments;
};
const unchanged = () => {};

function fortyPlies(): StudyParams {
  return { ...referenceStudy(), layup: { plies: quasiIsotropic(40) } };
}

export const DEMO_PARTS: readonly DemoPart[] = [
  {
    partNumber: 'TB-2407',
    name: 'Tailcone access panel, 24 plies',
    description: 'Quasi-isotropic carbon/epoxy skin, autoclave cured on an aluminium plate tool.',
    studies: [
      {
        title: 'Two-dwell cycle for the 24-ply panel',
        owner: 'amara.okafor',
        start: referenceStudy,
        revisions: [
          { author: 'amara.okafor', message: 'Starting point from the shop cycle sheet', edit: unchanged },
          {
            author: 'amara.okafor',
            message: 'Slower first ramp to 1.5 °C/min to flatten the exotherm',
            edit: (p) => {
              const ramp = segments(p)[0];
              if (ramp.kind === 'ramp') ramp.rateCPerMin = 1.5;
            },
          },
        ],
      },
      {
        title: 'Shorter first dwell trial',
        owner: 'tomas.reed',
        start: referenceStudy,
        revisions: [
          {
            author: 'tomas.reed',
            message: 'First dwell cut to 40 min',
            edit: (p) => {
              const hold = segments(p)[1];
              if (hold.kind === 'hold') hold.holdMin = 40;
            },
          },
        ],
      },
    ],
    baseline: { study: 0, revision: 2, note: 'Released for the first-article build', pinnedBy: 'amara.okafor' },
  },
  {
    partNumber: 'TB-4012',
    name: 'Pylon aft fairing, 40 plies',
    description: 'Thicker section; exotherm and through-thickness gradient govern the cycle.',
    studies: [
      {
        title: 'Thick-section exotherm check',
        owner: 'tomas.reed',
        start: fortyPlies,
        revisions: [
          { author: 'tomas.reed', message: 'Shop cycle applied to the 40-ply stack', edit: unchanged },
          {
            author: 'tomas.reed',
            message: 'Intermediate dwell lengthened to 120 min',
            edit: (p) => {
              const hold = segments(p)[1];
              if (hold.kind === 'hold') hold.holdMin = 120;
            },
          },
          {
            author: 'amara.okafor',
            message: 'Cool-down at 1.5 °C/min to respect the tool limit',
            edit: (p) => {
              const cool = segments(p)[segments(p).length - 1];
              if (cool.kind === 'cool') cool.rateCPerMin = 1.5;
            },
          },
        ],
      },
    ],
  },
];
